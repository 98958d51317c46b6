/**
 * Comparing a producer's declared result with an independent laboratory's (ISO 13528 scores).
 * En uses expanded uncertainties (|En| ≤ 1 satisfactory); z uses the standard deviation for
 * proficiency assessment (|z| ≤ 2 satisfactory, 2 < |z| < 3 questionable, |z| ≥ 3 unsatisfactory);
 * zeta uses standard uncertainties and reads like z.
 */

export type ScoreReading = "satisfactory" | "questionable" | "unsatisfactory";

/** En = (x − X) / √(U_x² + U_X²), with X the reference (the independent laboratory). */
export function enNumber(x: number, expandedUx: number, reference: number, expandedUref: number): { en: number; reading: ScoreReading } {
  const d = Math.hypot(expandedUx, expandedUref);
  if (d === 0) throw new RangeError("En needs at least one non-zero uncertainty");
  const en = (x - reference) / d;
  return { en, reading: Math.abs(en) <= 1 ? "satisfactory" : "unsatisfactory" };
}

const zReading = (z: number): ScoreReading => (Math.abs(z) <= 2 ? "satisfactory" : Math.abs(z) < 3 ? "questionable" : "unsatisfactory");

/** z = (x − X) / σ_pt. */
export function zScore(x: number, reference: number, sigmaPt: number): { z: number; reading: ScoreReading } {
  if (!(sigmaPt > 0)) throw new RangeError("σ_pt must be positive");
  const z = (x - reference) / sigmaPt;
  return { z, reading: zReading(z) };
}

/** ζ = (x − X) / √(u_x² + u_X²), standard uncertainties. */
export function zetaScore(x: number, ux: number, reference: number, uref: number): { zeta: number; reading: ScoreReading } {
  const d = Math.hypot(ux, uref);
  if (d === 0) throw new RangeError("ζ needs at least one non-zero uncertainty");
  const zeta = (x - reference) / d;
  return { zeta, reading: zReading(zeta) };
}
