/**
 * Decision rules in the sense of ISO/IEC 17025:2017 3.7 and 7.8.6, with the guard bands and the
 * non-binary statements of ILAC-G8:09/2019 §4.2, and the conformance probability of JCGM 106:2012
 * clause 7 for a normal distribution.
 */
import { normalCdf } from "./normal.ts";

/** How the guard band w is sized. */
export type GuardBand =
  /** w = U = k·u with coverage factor k (2 gives about 95 %); ILAC-G8 §4.2.2. */
  | { kind: "expanded"; k: number }
  /** w = k·u for a chosen risk, e.g. k = 1.64 for at most 5 % one-sided (Eurachem/CITAC guide). */
  | { kind: "multiple-of-u"; k: number };

export type DecisionRule =
  /** Simple acceptance (w = 0): the result itself is compared with the limit. ILAC-G8 §4.2.1. */
  | { kind: "simple" }
  /** Guarded acceptance, binary: pass only inside the limits narrowed by w. ILAC-G8 §4.2.2. */
  | { kind: "guarded"; guard: GuardBand }
  /** Non-binary statements: pass, conditional pass, conditional fail, fail. ILAC-G8 §4.2.3. */
  | { kind: "non-binary"; guard: GuardBand };

export const DEFAULT_DECISION_RULE: DecisionRule = { kind: "non-binary", guard: { kind: "expanded", k: 2 } };

export type Statement = "pass" | "conditional pass" | "conditional fail" | "fail";

export function guardWidth(rule: DecisionRule, u: number): number {
  if (rule.kind === "simple") return 0;
  return rule.guard.k * u;
}

/** A short name for tables and lists, e.g. "Non-binary, w = U (k = 2)". */
export function ruleLabel(rule: DecisionRule): string {
  if (rule.kind === "simple") return "Simple acceptance";
  const g = rule.guard.kind === "expanded" ? `w = U (k = ${rule.guard.k})` : `w = ${rule.guard.k}·u`;
  return `${rule.kind === "guarded" ? "Guarded acceptance" : "Non-binary"}, ${g}`;
}

export function describeRule(rule: DecisionRule): string {
  if (rule.kind === "simple") return "Simple acceptance: the result is compared with the limit itself (no guard band).";
  const g = rule.guard.kind === "expanded" ? `w = U = ${rule.guard.k}·u` : `w = ${rule.guard.k}·u`;
  return rule.kind === "guarded"
    ? `Guarded acceptance (${g}): a result passes only when it lies at least w inside the limit.`
    : `Non-binary statements (${g}): pass, conditional pass within w inside the limit, conditional fail within w beyond it, fail further out.`;
}

/**
 * Statement for one side. distanceInside = how far the result lies inside the limit (negative when
 * beyond it), in the parameter's unit; the limit value itself conforms.
 */
export function statementForSide(rule: DecisionRule, distanceInside: number, w: number): Statement {
  if (rule.kind === "simple") return distanceInside >= 0 ? "pass" : "fail";
  if (rule.kind === "guarded") return distanceInside >= w ? "pass" : "fail";
  if (distanceInside >= w) return "pass";
  if (distanceInside >= 0) return "conditional pass";
  if (distanceInside >= -w) return "conditional fail";
  return "fail";
}

const ORDER: Statement[] = ["pass", "conditional pass", "conditional fail", "fail"];
export const worse = (a: Statement, b: Statement): Statement => (ORDER.indexOf(a) >= ORDER.indexOf(b) ? a : b);

/**
 * Probability that the true value lies within [lower, upper], for a normal distribution with mean y
 * and standard uncertainty u (JCGM 106:2012, 7.3 and 7.4). A missing side is open.
 */
export function conformanceProbability(y: number, u: number, lower?: number, upper?: number): number {
  if (u <= 0) return (lower === undefined || y >= lower) && (upper === undefined || y <= upper) ? 1 : 0;
  const hi = upper === undefined ? 1 : normalCdf((upper - y) / u);
  const lo = lower === undefined ? 0 : normalCdf((lower - y) / u);
  return Math.max(0, hi - lo);
}
