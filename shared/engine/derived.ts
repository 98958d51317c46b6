/** Values derived from others by published definitions; each function names its source. */
import { quantity, type GPerL, type MeqPerL, type MgPerL, type PercentVol, type PH } from "./units.ts";

/**
 * pKa of the SO2·H2O / HSO3− pair used for molecular SO2. 1.81 reproduces the widely used
 * free-SO2-for-molecular tables (e.g. pH 3.5 and 0.8 mg/L molecular → 40 mg/L free); some
 * references use 1.77.
 */
export const DEFAULT_SO2_PKA = 1.81;

/** Bound SO2 = total − free. */
export function boundSo2(total: MgPerL, free: MgPerL): MgPerL {
  if (free > total) throw new RangeError("free SO2 cannot exceed total SO2");
  return quantity(total - free, "mg/L");
}

/** Molecular SO2 = free / (1 + 10^(pH − pKa)) (Henderson–Hasselbalch on the first dissociation). */
export function molecularSo2(free: MgPerL, ph: PH, pKa = DEFAULT_SO2_PKA): MgPerL {
  return quantity(free / (1 + 10 ** (ph - pKa)), "mg/L");
}

/** The free SO2 that gives a target molecular SO2 at this pH. */
export function freeSo2ForMolecular(targetMolecular: MgPerL, ph: PH, pKa = DEFAULT_SO2_PKA): MgPerL {
  return quantity(targetMolecular * (1 + 10 ** (ph - pKa)), "mg/L");
}

/** Sugar-free extract = total dry extract − total sugars (OIV-MA-AS2-03B). */
export function sugarFreeExtract(totalDryExtract: GPerL, totalSugars: GPerL): GPerL {
  return quantity(totalDryExtract - totalSugars, "g/L");
}

/**
 * Reduced extract = total dry extract − sugars above 1 g/L − potassium sulphate above 1 g/L
 * − mannitol − other added substances (OIV-MA-AS2-03B).
 */
export function reducedExtract(
  totalDryExtract: GPerL,
  totalSugars: GPerL,
  extra: { potassiumSulphate?: GPerL; mannitol?: GPerL; otherAdded?: GPerL } = {},
): GPerL {
  const over1 = (x: number | undefined) => Math.max(0, (x ?? 0) - 1);
  return quantity(
    totalDryExtract - over1(totalSugars) - over1(extra.potassiumSulphate) - (extra.mannitol ?? 0) - (extra.otherAdded ?? 0),
    "g/L",
  );
}

/** Fixed acidity = total acidity − volatile acidity, both in meq/L (OIV-MA-AS313-03). */
export function fixedAcidity(total: MeqPerL, volatile: MeqPerL): MeqPerL {
  return quantity(total - volatile, "meq/L");
}

/**
 * Sugar that ferments to 1 % vol: the convention "16.83 grams of sugars per litre of grape must are
 * equivalent to 1 % by volume of alcohol" (Arrêté du 3 mai 1996, article 2, JORF).
 */
export const SUGAR_PER_PERCENT_VOL = 16.83;

/** Potential alcohol: the % vol the sugar still present would give if it all fermented. */
export function potentialAlcohol(sugar: GPerL, gramsPerPercentVol = SUGAR_PER_PERCENT_VOL): PercentVol {
  if (!(sugar >= 0)) throw new RangeError(`A sugar content of ${sugar} g/L cannot be converted.`);
  return quantity(sugar / gramsPerPercentVol, "% vol");
}

/** Total alcohol = actual alcohol + potential alcohol (the definitions of Reg. (EU) No 1308/2013, Annex II, Part IV; point from memory). */
export function totalAlcohol(actual: PercentVol, sugar: GPerL): PercentVol {
  return quantity(actual + potentialAlcohol(sugar), "% vol");
}

/** Must weight from the relative density at 20 °C: °Oechsle = (d − 1) × 1000 (the scale's definition, from memory). */
export function oechsleFromDensity(relativeDensity: number): number {
  return (relativeDensity - 1) * 1000;
}

/** °Baumé for liquids heavier than water, d = 145 / (145 − °Bé) (the "American" modulus 145; from memory). */
export function baumeFromDensity(relativeDensity: number): number {
  return 145 * (1 - 1 / relativeDensity);
}

/** °Brix from the relative density, with the common approximation °Bx ≈ 261.3 × (1 − 1/d) (common practice; good to a few tenths near grape musts). */
export function brixFromDensity(relativeDensity: number): number {
  return 261.3 * (1 - 1 / relativeDensity);
}
