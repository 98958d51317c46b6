/**
 * Comparing a producer's declared result with an independent laboratory's (ISO 13528 scores).
 * En uses expanded uncertainties (|En| ≤ 1 satisfactory); z uses the standard deviation for
 * proficiency assessment (|z| ≤ 2 satisfactory, 2 < |z| < 3 questionable, |z| ≥ 3 unsatisfactory);
 * zeta uses standard uncertainties and reads like z.
 */

import { usedUncertainty, type ReportedUncertainty, type UsedUncertainty } from "./evaluate.ts";
import { parameter, type ParameterId } from "./parameters.ts";
import type { Reading } from "./parse.ts";
import { convert, UNITS, type UnitId } from "./units.ts";

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

/** One result as reported, for comparison: the reading, its unit and the uncertainty the laboratory gave, if any. */
export interface ComparedResult {
  reading: Reading;
  unit: UnitId;
  uncertainty?: ReportedUncertainty | null;
}

export type ComparisonOutcome = "agrees" | "questionable" | "discrepant" | "not comparable";

export interface ResultComparison {
  parameter: ParameterId;
  outcome: ComparisonOutcome;
  /** Both values, the uncertainties and σ_pt in the parameter's canonical unit. */
  unit: UnitId;
  /** The unit people read it in (the independent laboratory's); the explanation uses it. */
  displayUnit: UnitId;
  declared: number | null;
  independent: number | null;
  difference: number | null;
  /** Expanded uncertainties (k = 2) used for En, and where each came from. */
  declaredU: number | null;
  independentU: number | null;
  uncertaintySources: { declared: UsedUncertainty["source"]; independent: UsedUncertainty["source"] } | null;
  en: number | null;
  z: number | null;
  /** σ_pt used for z: the catalogue's standard uncertainty at the independent value (fitness for purpose). */
  sigmaPt: number | null;
  explanation: string;
}

const COVERAGE = 2;
const outcomeOf = (en: ScoreReading, z: ScoreReading | null): ComparisonOutcome =>
  en === "unsatisfactory" || z === "unsatisfactory" ? "discrepant" : z === "questionable" ? "questionable" : "agrees";

/**
 * Compares the producer's declared result with an independent laboratory's, taken as the reference value.
 * En uses both expanded uncertainties (the catalogue default, k = 2, where a laboratory gave none);
 * z uses σ_pt = the catalogue's standard uncertainty at the reference value, a fitness-for-purpose choice
 * (ISO 13528 allows σ_pt "by perception of experts"; Cellarpact's choice, stated on every comparison).
 */
export function compareWithReference(
  parameterId: ParameterId,
  declared: ComparedResult | null,
  independent: ComparedResult,
): ResultComparison {
  const def = parameter(parameterId);
  const unit = def.unit;
  const displayUnit = independent.unit;
  const empty = {
    unit,
    displayUnit,
    declared: null,
    independent: null,
    difference: null,
    declaredU: null,
    independentU: null,
    uncertaintySources: null,
    en: null,
    z: null,
    sigmaPt: null,
  };
  if (!declared)
    return {
      parameter: parameterId,
      outcome: "not comparable",
      ...empty,
      explanation: "The producer declared no result for this parameter at this stage.",
    };
  if (declared.reading.kind !== "value" || independent.reading.kind !== "value") {
    const bothBelow = declared.reading.kind === "below" && independent.reading.kind === "below";
    const samePresence =
      declared.reading.kind === "presence" &&
      independent.reading.kind === "presence" &&
      declared.reading.present === independent.reading.present;
    if (bothBelow || samePresence)
      return { parameter: parameterId, outcome: "agrees", ...empty, explanation: "Both laboratories report the same qualitative result." };
    return {
      parameter: parameterId,
      outcome: "not comparable",
      ...empty,
      explanation:
        "At least one result is not a number (below a limit, above a range, or presence/absence), so no score can be computed; compare the reports by hand.",
    };
  }
  const x = convert(declared.reading.value, declared.unit, unit);
  const ref = convert(independent.reading.value, independent.unit, unit);
  const uDeclared = usedUncertainty(parameterId, unit, x, declared);
  const uRef = usedUncertainty(parameterId, unit, ref, independent);
  const fitness = usedUncertainty(parameterId, unit, ref, { unit, uncertainty: null });
  const sources = { declared: uDeclared.source, independent: uRef.source };
  const values = { unit, displayUnit, declared: x, independent: ref, difference: x - ref, uncertaintySources: sources };
  if (uDeclared.u === 0 && uRef.u === 0) {
    return {
      parameter: parameterId,
      outcome: "not comparable",
      ...empty,
      ...values,
      explanation: "Neither result carries an uncertainty and the catalogue has no default for this parameter, so En cannot be computed.",
    };
  }
  const en = enNumber(x, COVERAGE * uDeclared.u, ref, COVERAGE * uRef.u);
  const z = fitness.u > 0 ? zScore(x, ref, fitness.u) : null;
  const outcome = outcomeOf(en.reading, z?.reading ?? null);
  const fmt = (v: number) => String(Number(v.toPrecision(3)));
  const shown = (v: number) => fmt(convert(v, unit, displayUnit));
  const explanation =
    `Declared ${shown(x)} against independent ${shown(ref)} ${UNITS[displayUnit].label}: En = ${fmt(en.en)} (|En| ≤ 1 agrees)` +
    (z ? `, z = ${fmt(z.z)} with σ_pt = ${shown(fitness.u)} (|z| ≤ 2 agrees, 2–3 questionable, ≥ 3 discrepant).` : ".") +
    (uDeclared.source === "default" || uRef.source === "default"
      ? " A catalogue default uncertainty stood in where a laboratory reported none."
      : "");
  return {
    parameter: parameterId,
    outcome,
    ...values,
    declaredU: COVERAGE * uDeclared.u,
    independentU: COVERAGE * uRef.u,
    en: en.en,
    z: z?.z ?? null,
    sigmaPt: fitness.u > 0 ? fitness.u : null,
    explanation,
  };
}
