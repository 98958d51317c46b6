/**
 * The parameter catalogue: every measurable quantity a spec sheet can name, with its canonical unit,
 * the units a lab may report it in, display precision, OIV method where one exists, and which bounds
 * make sense. Method references marked confirmed: false are from memory and shown as such.
 */
import type { UnitId } from "./units.ts";

export type BoundSides = "upper" | "lower" | "both";

export interface MethodRef {
  ref: string;
  title: string;
  /** false: the reference is from memory and has not been checked against the OIV compendium. */
  confirmed: boolean;
}

/** Standard uncertainty used when a laboratory reports none; always stated as a default on the verdict. */
export interface DefaultUncertainty {
  /** "absolute": u in the canonical unit. "relative": u as a fraction of the result. */
  kind: "absolute" | "relative";
  u: number;
  basis: string;
}

export interface ParameterDef {
  id: string;
  name: string;
  group: ParameterGroup;
  unit: UnitId;
  units: readonly UnitId[];
  digits: number;
  bounds: BoundSides;
  kind: "quantity" | "presence";
  method?: MethodRef;
  /** Computed from other results rather than measured. */
  derivedFrom?: readonly string[];
  defaultUncertainty?: DefaultUncertainty;
  note?: string;
}

export type ParameterGroup =
  | "Sulphur dioxide"
  | "Acidity"
  | "Alcohol, sugar and density"
  | "Extract"
  | "Stability and clarity"
  | "Metals"
  | "Dissolved gases"
  | "Microbiology"
  | "Taints and contaminants";

const MASS = ["mg/L", "g/L", "µg/L", "ppm"] as const;
const ACID = ["meq/L", "g/L as tartaric acid", "g/L as sulfuric acid", "g/L as acetic acid", "g/100 mL as acetic acid"] as const;
const TEN_PERCENT: DefaultUncertainty = {
  kind: "relative",
  u: 0.1,
  basis: "Cellarpact default of 10 % relative standard uncertainty (common practice for routine methods; no published source)",
};

// One row per parameter: the catalogue reads as a table.
// prettier-ignore
export const PARAMETERS = [
  // Sulphur dioxide
  { id: "free_so2", name: "Free SO2", group: "Sulphur dioxide", unit: "mg/L", units: MASS, digits: 0, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS323-04A", title: "Sulphur dioxide (free and total)", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "total_so2", name: "Total SO2", group: "Sulphur dioxide", unit: "mg/L", units: MASS, digits: 0, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS323-04A", title: "Sulphur dioxide (free and total)", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "bound_so2", name: "Bound SO2", group: "Sulphur dioxide", unit: "mg/L", units: MASS, digits: 0, bounds: "upper", kind: "quantity", derivedFrom: ["total_so2", "free_so2"], note: "Total SO2 minus free SO2." },
  { id: "molecular_so2", name: "Molecular SO2", group: "Sulphur dioxide", unit: "mg/L", units: ["mg/L"], digits: 2, bounds: "both", kind: "quantity", derivedFrom: ["free_so2", "ph"], note: "Free SO2 / (1 + 10^(pH − pKa)), pKa 1.81 by default." },
  // Acidity
  { id: "volatile_acidity", name: "Volatile acidity", group: "Acidity", unit: "meq/L", units: ACID, digits: 1, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS313-02", title: "Volatile acidity", confirmed: true }, defaultUncertainty: { kind: "absolute", u: 0.46, basis: "R ≈ 1.3 meq/L for steam distillation (OIV-MA-AS313-02, from memory), u = R/2.8 (ISO 5725)" } },
  { id: "total_acidity", name: "Total acidity", group: "Acidity", unit: "meq/L", units: ACID, digits: 1, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS313-01", title: "Total acidity (titration to pH 7)", confirmed: true }, defaultUncertainty: { kind: "absolute", u: 1.43, basis: "R ≈ 4 meq/L (OIV-MA-AS313-01, from memory), u = R/2.8 (ISO 5725)" } },
  { id: "fixed_acidity", name: "Fixed acidity", group: "Acidity", unit: "meq/L", units: ACID, digits: 1, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS313-03", title: "Fixed acidity", confirmed: true }, derivedFrom: ["total_acidity", "volatile_acidity"], note: "Total acidity minus volatile acidity, in the same unit." },
  { id: "ph", name: "pH", group: "Acidity", unit: "pH", units: ["pH"], digits: 2, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS313-15", title: "pH", confirmed: false }, defaultUncertainty: { kind: "absolute", u: 0.02, basis: "Cellarpact default of 0.02 pH units (common practice; no published source)" } },
  { id: "malic_acid", name: "Malic acid", group: "Acidity", unit: "g/L", units: ["g/L", "mg/L"], digits: 2, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS313-11", title: "Malic acid (enzymatic)", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "lactic_acid", name: "Lactic acid", group: "Acidity", unit: "g/L", units: ["g/L", "mg/L"], digits: 2, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS313-07", title: "Lactic acid (enzymatic)", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "citric_acid", name: "Citric acid", group: "Acidity", unit: "g/L", units: ["g/L", "mg/L"], digits: 2, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS313-09", title: "Citric acid", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "sorbic_acid", name: "Sorbic acid", group: "Acidity", unit: "mg/L", units: ["mg/L", "g/L"], digits: 0, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS313-14A", title: "Sorbic acid", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  // Alcohol, sugar, density
  { id: "alcohol", name: "Actual alcoholic strength", group: "Alcohol, sugar and density", unit: "% vol", units: ["% vol", "g/L ethanol"], digits: 2, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS312-01", title: "Alcoholic strength by volume at 20 °C", confirmed: true }, defaultUncertainty: { kind: "absolute", u: 0.068, basis: "R = 0.19 % vol for pycnometry (OIV-MA-AS312-01A, from memory), u = R/2.8 (ISO 5725)" } },
  { id: "residual_sugar", name: "Residual sugar (glucose + fructose)", group: "Alcohol, sugar and density", unit: "g/L", units: ["g/L", "mg/L"], digits: 1, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS311-02", title: "Glucose and fructose (enzymatic)", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "density", name: "Density at 20 °C", group: "Alcohol, sugar and density", unit: "g/mL", units: ["g/mL", "kg/m³"], digits: 5, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS2-01A", title: "Density and specific gravity at 20 °C", confirmed: true }, defaultUncertainty: { kind: "absolute", u: 0.0001, basis: "Cellarpact default of 0.0001 g/mL (common practice; no published source)" } },
  // Extract
  { id: "total_dry_extract", name: "Total dry extract", group: "Extract", unit: "g/L", units: ["g/L"], digits: 1, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS2-03B", title: "Total dry matter", confirmed: true }, defaultUncertainty: TEN_PERCENT },
  { id: "sugar_free_extract", name: "Sugar-free extract", group: "Extract", unit: "g/L", units: ["g/L"], digits: 1, bounds: "lower", kind: "quantity", method: { ref: "OIV-MA-AS2-03B", title: "Total dry matter", confirmed: true }, derivedFrom: ["total_dry_extract", "residual_sugar"], note: "Total dry extract minus total sugars." },
  { id: "reduced_extract", name: "Reduced extract", group: "Extract", unit: "g/L", units: ["g/L"], digits: 1, bounds: "lower", kind: "quantity", method: { ref: "OIV-MA-AS2-03B", title: "Total dry matter", confirmed: true }, derivedFrom: ["total_dry_extract", "residual_sugar"], note: "Total dry extract minus sugars above 1 g/L (and potassium sulphate above 1 g/L, mannitol, added substances)." },
  // Stability and clarity
  { id: "heat_test_haze", name: "Heat test haze increase (protein stability)", group: "Stability and clarity", unit: "NTU", units: ["NTU"], digits: 2, bounds: "upper", kind: "quantity", note: "Turbidity of the heated sample minus the unheated control (80 °C, 2 h, per the AWRI method).", defaultUncertainty: { kind: "absolute", u: 0.1, basis: "Cellarpact default of 0.1 NTU (common practice; no published source)" } },
  { id: "cold_stability_conductivity", name: "Cold stability: conductivity drop", group: "Stability and clarity", unit: "%", units: ["%"], digits: 1, bounds: "upper", kind: "quantity", note: "Mini-contact test; a drop of 5 % or more is commonly read as unstable." },
  { id: "cold_stability_deposit", name: "Cold stability: deposit after refrigeration test", group: "Stability and clarity", unit: "presence", units: ["presence"], digits: 0, bounds: "upper", kind: "presence", note: "−4 °C for 3 days (AWRI); any persistent crystal is a fail." },
  { id: "turbidity", name: "Turbidity", group: "Stability and clarity", unit: "NTU", units: ["NTU"], digits: 1, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  // Metals
  { id: "iron", name: "Iron", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 1, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS322-05A", title: "Iron", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "copper", name: "Copper", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 2, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS322-06", title: "Copper", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "lead", name: "Lead", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L", "mg/kg", "µg/kg"], digits: 3, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS322-12", title: "Lead", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "arsenic", name: "Arsenic", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 3, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "cadmium", name: "Cadmium", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 4, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "boron", name: "Boron (as boric acid)", group: "Metals", unit: "mg/L", units: ["mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT, note: "Expressed as boric acid, as the OIV limit is." },
  { id: "bromine", name: "Bromine", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 2, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "excess_sodium", name: "Excess sodium", group: "Metals", unit: "mg/L", units: ["mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT, note: "Sodium beyond what the wine's chloride accounts for, as the OIV defines it (OENO 09/2007)." },
  { id: "silver", name: "Silver", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 2, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "fluoride", name: "Fluoride", group: "Metals", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 2, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "sulphates", name: "Sulphates (as potassium sulphate)", group: "Metals", unit: "g/L", units: ["g/L", "mg/L"], digits: 2, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT, note: "Expressed as potassium sulphate, as the OIV limit is." },
  // Dissolved gases
  { id: "overpressure", name: "Overpressure (CO2, at 20 °C)", group: "Dissolved gases", unit: "bar", units: ["bar"], digits: 1, bounds: "both", kind: "quantity", defaultUncertainty: TEN_PERCENT, note: "For sparkling and semi-sparkling wine, measured in the closed container." },
  { id: "dissolved_oxygen", name: "Dissolved oxygen", group: "Dissolved gases", unit: "mg/L", units: ["mg/L", "µg/L"], digits: 2, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "carbon_dioxide", name: "Carbon dioxide", group: "Dissolved gases", unit: "g/L", units: ["g/L", "mg/L", "g/100 mL"], digits: 2, bounds: "both", kind: "quantity", method: { ref: "OIV-MA-AS314-01", title: "Carbon dioxide", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  // Microbiology
  { id: "yeast_count", name: "Yeast count", group: "Microbiology", unit: "CFU/mL", units: ["CFU/mL", "CFU/100 mL", "CFU/L"], digits: 0, bounds: "upper", kind: "quantity" },
  { id: "bacteria_count", name: "Bacteria count", group: "Microbiology", unit: "CFU/mL", units: ["CFU/mL", "CFU/100 mL", "CFU/L"], digits: 0, bounds: "upper", kind: "quantity" },
  { id: "sterility_count", name: "Sterility count (after filtration)", group: "Microbiology", unit: "CFU/100 mL", units: ["CFU/100 mL", "CFU/mL", "CFU/L"], digits: 0, bounds: "upper", kind: "quantity", note: "Membrane filtration of 100 mL; 0 CFU/100 mL is the usual expectation." },
  // Taints and contaminants
  { id: "tca", name: "2,4,6-Trichloroanisole (TCA)", group: "Taints and contaminants", unit: "ng/L", units: ["ng/L"], digits: 1, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "ethylphenol_4", name: "4-Ethylphenol", group: "Taints and contaminants", unit: "µg/L", units: ["µg/L", "mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "ethylguaiacol_4", name: "4-Ethylguaiacol", group: "Taints and contaminants", unit: "µg/L", units: ["µg/L", "mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "ethyl_carbamate", name: "Ethyl carbamate", group: "Taints and contaminants", unit: "µg/L", units: ["µg/L", "mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "diethylene_glycol", name: "Diethylene glycol", group: "Taints and contaminants", unit: "mg/L", units: ["mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "ethylene_glycol", name: "Ethylene glycol (ethanediol)", group: "Taints and contaminants", unit: "mg/L", units: ["mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "propylene_glycol", name: "Propylene glycol (propan-1,2-diol)", group: "Taints and contaminants", unit: "mg/L", units: ["mg/L", "g/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT },
  { id: "malvidin_diglucoside", name: "Malvidin diglucoside", group: "Taints and contaminants", unit: "mg/L", units: ["mg/L"], digits: 0, bounds: "upper", kind: "quantity", defaultUncertainty: TEN_PERCENT, note: "Marker of hybrid grape varieties, by the OIV's quantitative method." },
  { id: "methanol", name: "Methanol", group: "Taints and contaminants", unit: "mg/L", units: ["mg/L", "g/L"], digits: 0, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS312-03A", title: "Methanol", confirmed: false }, defaultUncertainty: TEN_PERCENT },
  { id: "ochratoxin_a", name: "Ochratoxin A", group: "Taints and contaminants", unit: "µg/L", units: ["µg/L", "µg/kg", "ng/L"], digits: 2, bounds: "upper", kind: "quantity", method: { ref: "OIV-MA-AS315-10", title: "Ochratoxin A", confirmed: false }, defaultUncertainty: TEN_PERCENT },
] as const satisfies readonly ParameterDef[];

export type ParameterId = (typeof PARAMETERS)[number]["id"];

const BY_ID = new Map<string, ParameterDef>(PARAMETERS.map((p) => [p.id, p]));

export function parameter(id: ParameterId): ParameterDef {
  return BY_ID.get(id)!;
}

export const isParameterId = (id: string): id is ParameterId => BY_ID.has(id);

export function findParameter(id: string): ParameterDef | undefined {
  return BY_ID.get(id);
}

export function acceptsUnit(p: ParameterDef, unit: string): unit is UnitId {
  return (p.units as readonly string[]).includes(unit);
}
