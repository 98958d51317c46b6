/**
 * Units the engine understands, with branded number types so that a value in one unit cannot be
 * passed where another is expected. Casts to a brand happen only in this file and in parse.ts.
 */

export const UNITS = {
  "ng/L": { dimension: "mass", toMgPerL: 1e-6, label: "ng/L" },
  "µg/L": { dimension: "mass", toMgPerL: 1e-3, label: "µg/L" },
  "mg/L": { dimension: "mass", toMgPerL: 1, label: "mg/L" },
  "g/L": { dimension: "mass", toMgPerL: 1000, label: "g/L" },
  "g/100 mL": { dimension: "mass", toMgPerL: 10_000, label: "g/100 mL" },
  // In wine law "ppm" is used as mg/L (e.g. 27 CFR 4.22(b)(1) "parts per million of total sulfur dioxide").
  ppm: { dimension: "mass", toMgPerL: 1, label: "ppm" },
  // Per kilogram: converted with the wine's density (kg/L); contaminant law uses these.
  "µg/kg": { dimension: "mass-per-kg", toMgPerKg: 1e-3, label: "µg/kg" },
  "mg/kg": { dimension: "mass-per-kg", toMgPerKg: 1, label: "mg/kg" },
  "meq/L": { dimension: "acid", label: "meq/L" },
  "g/L as tartaric acid": { dimension: "acid", gramsPerEq: 75.04, label: "g/L as tartaric acid" },
  "g/L as sulfuric acid": { dimension: "acid", gramsPerEq: 49.04, label: "g/L as sulfuric acid" },
  "g/L as acetic acid": { dimension: "acid", gramsPerEq: 60.05, label: "g/L as acetic acid" },
  "g/100 mL as acetic acid": { dimension: "acid", gramsPerEq: 6.005, label: "g/100 mL as acetic acid" },
  "% vol": { dimension: "alcohol", label: "% vol" },
  "g/L ethanol": { dimension: "alcohol", label: "g/L ethanol" },
  "CFU/mL": { dimension: "count", toPerMl: 1, label: "CFU/mL" },
  "CFU/100 mL": { dimension: "count", toPerMl: 0.01, label: "CFU/100 mL" },
  "CFU/L": { dimension: "count", toPerMl: 0.001, label: "CFU/L" },
  NTU: { dimension: "turbidity", label: "NTU" },
  pH: { dimension: "ph", label: "pH" },
  "g/mL": { dimension: "density", toGPerMl: 1, label: "g/mL" },
  "kg/m³": { dimension: "density", toGPerMl: 0.001, label: "kg/m³" },
  "%": { dimension: "percent", label: "%" },
  bar: { dimension: "pressure", label: "bar" },
  presence: { dimension: "presence", label: "present / absent" },
} as const;

export type UnitId = keyof typeof UNITS;
export type Dimension = (typeof UNITS)[UnitId]["dimension"];

declare const unitBrand: unique symbol;
/** A number known to be in unit U. */
export type Quantity<U extends UnitId> = number & { readonly [unitBrand]: U };

export type MgPerL = Quantity<"mg/L">;
export type GPerL = Quantity<"g/L">;
export type MeqPerL = Quantity<"meq/L">;
export type PercentVol = Quantity<"% vol">;
export type PH = Quantity<"pH">;

/** The only way to give a plain number a unit. */
export const quantity = <U extends UnitId>(value: number, _unit: U): Quantity<U> => value as Quantity<U>;

export const isUnit = (u: string): u is UnitId => Object.prototype.hasOwnProperty.call(UNITS, u);

/**
 * Density of pure ethanol at 20 °C: 789.24 kg/m³, the sum of the A coefficients of the
 * international alcohol tables (Council Directive 76/766/EEC Annex = OIML R 22).
 */
export const ETHANOL_DENSITY_G_PER_ML = 0.78924;

export class UnitError extends Error {}

/** Converts within one dimension. mg/kg ↔ mg/L needs the wine's density in g/mL (= kg/L). */
export function convert(value: number, from: UnitId, to: UnitId, opts: { densityGPerMl?: number } = {}): number {
  // Data from outside (a file, an old row) may name a unit that does not exist; say which.
  if (!isUnit(from)) throw new UnitError(`"${String(from)}" is not a unit Cellarpact knows.`);
  if (!isUnit(to)) throw new UnitError(`"${String(to)}" is not a unit Cellarpact knows.`);
  if (!Number.isFinite(value)) throw new UnitError(`${value} is not a finite number.`);
  if (from === to) return value;
  const a = UNITS[from];
  const b = UNITS[to];
  const density = opts.densityGPerMl ?? 1;
  const massLike = (d: Dimension) => d === "mass" || d === "mass-per-kg";
  if (massLike(a.dimension) && massLike(b.dimension)) {
    const mgPerL = "toMgPerL" in a ? value * a.toMgPerL : value * (a as { toMgPerKg: number }).toMgPerKg * density;
    return "toMgPerL" in b ? mgPerL / b.toMgPerL : mgPerL / density / (b as { toMgPerKg: number }).toMgPerKg;
  }
  if (a.dimension !== b.dimension) throw new UnitError(`cannot convert ${from} to ${to}`);
  switch (a.dimension) {
    case "acid": {
      const meq = "gramsPerEq" in a ? (value * 1000) / a.gramsPerEq : value;
      return "gramsPerEq" in b ? (meq * b.gramsPerEq) / 1000 : meq;
    }
    case "alcohol":
      // % vol is mL ethanol per 100 mL: g/L = %vol × 10 × ρ(ethanol).
      return from === "% vol" ? value * 10 * ETHANOL_DENSITY_G_PER_ML : value / (10 * ETHANOL_DENSITY_G_PER_ML);
    case "count":
      return (value * (a as { toPerMl: number }).toPerMl) / (b as { toPerMl: number }).toPerMl;
    case "density":
      return (value * (a as { toGPerMl: number }).toGPerMl) / (b as { toGPerMl: number }).toGPerMl;
    default:
      throw new UnitError(`cannot convert ${from} to ${to}`);
  }
}
