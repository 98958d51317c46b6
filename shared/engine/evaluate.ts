/**
 * Decides one result against its governing requirement, per ISO/IEC 17025:2017 7.8.6 under the
 * decision rule the requirement names. Missing, not-required and censored results get their own,
 * explained outcomes; a censored result is never treated as a number.
 */
import { conformanceProbability, describeRule, guardWidth, statementForSide, worse, type Statement } from "./decision.ts";
import { parameter } from "./parameters.ts";
import { formatReading, type Reading } from "./parse.ts";
import { convert, UNITS, type UnitId } from "./units.ts";
import type { GoverningBound, GoverningRequirement } from "./requirement.ts";

export const ENGINE_VERSION = "1.0.0";

export type Outcome = Statement | "missing" | "not required" | "inconclusive";

export interface ReportedUncertainty {
  /** Expanded uncertainty U with coverage factor k (k = 2 when the lab does not say), or a standard uncertainty u. */
  kind: "expanded" | "standard";
  value: number;
  k?: number;
}

export interface ResultInput {
  reading: Reading;
  /** Unit of the reading and of its uncertainty. */
  unit: UnitId;
  uncertainty?: ReportedUncertainty | null;
  densityGPerMl?: number;
}

export interface UsedUncertainty {
  /** Standard uncertainty in the canonical unit. */
  u: number;
  source: "laboratory" | "default" | "none";
  basis: string;
}

export interface Verdict {
  parameter: string;
  outcome: Outcome;
  explanation: string;
  /** The result in the canonical unit, as text (keeps "< 0.5" censored). */
  resultText: string | null;
  value: number | null;
  unit: UnitId;
  decidingSide: "lower" | "upper" | null;
  governing: { lower?: GoverningBound; upper?: GoverningBound };
  uncertainty: UsedUncertainty | null;
  guardBand: number | null;
  conformanceProbability: number | null;
  ruleText: string;
  /** For a result given at a stage that does not require it: what the statement would have been. */
  informativeOutcome?: Outcome;
}

function boundText(b: GoverningBound, unit: string): string {
  const where = b.source.kind === "buyer" ? "the buyer's specification" : `${b.source.limit.marketName}: ${b.source.limit.citation.document}, ${b.source.limit.citation.article}`;
  return `${trim(b.value)} ${unit} (${where})`;
}

const trim = (x: number) => String(Number(x.toPrecision(6)));

function uncertaintyFor(req: GoverningRequirement, value: number, input: ResultInput): UsedUncertainty {
  const def = parameter(req.parameter);
  if (input.uncertainty && input.uncertainty.value >= 0) {
    const k = input.uncertainty.kind === "expanded" ? (input.uncertainty.k ?? 2) : 1;
    const inCanonical = convert(input.uncertainty.value, input.unit, req.unit, { densityGPerMl: input.densityGPerMl });
    return {
      u: Math.abs(inCanonical) / k,
      source: "laboratory",
      basis: input.uncertainty.kind === "expanded" ? `laboratory's expanded uncertainty U with k = ${k}` : "laboratory's standard uncertainty",
    };
  }
  if ("defaultUncertainty" in def && def.defaultUncertainty) {
    const d = def.defaultUncertainty;
    return { u: d.kind === "absolute" ? d.u : d.u * Math.abs(value), source: "default", basis: `no uncertainty reported; default used: ${d.basis}` };
  }
  return { u: 0, source: "none", basis: "no uncertainty reported and no default exists for this parameter; the result is taken as exact" };
}

/** Overall statement for a value: the worse of the two sides, and which side decided. */
function statementAt(req: GoverningRequirement, x: number, w: number): { statement: Statement; side: "lower" | "upper" | null } {
  let result: { statement: Statement; side: "lower" | "upper" | null } = { statement: "pass", side: null };
  const sides: ["upper" | "lower", Statement][] = [];
  if (req.upper) sides.push(["upper", statementForSide(req.rule, req.upper.value - x, w)]);
  if (req.lower) sides.push(["lower", statementForSide(req.rule, x - req.lower.value, w)]);
  for (const [side, s] of sides) if (s !== "pass" && worse(s, result.statement) === s) result = { statement: s, side };
  return result;
}

const passing = (s: Statement) => s === "pass" || s === "conditional pass";

export function evaluate(req: GoverningRequirement, input: ResultInput | null, ctx: { requiredAtStage: boolean } = { requiredAtStage: true }): Verdict {
  const def = parameter(req.parameter);
  const unitLabel = UNITS[req.unit].label;
  const base = {
    parameter: req.parameter,
    unit: req.unit,
    governing: { lower: req.lower, upper: req.upper },
    ruleText: describeRule(req.rule),
  };
  if (!input) {
    return {
      ...base,
      outcome: ctx.requiredAtStage ? "missing" : "not required",
      explanation: ctx.requiredAtStage ? `No result for ${def.name}, which this stage requires.` : `${def.name} is not required at this stage.`,
      resultText: null,
      value: null,
      decidingSide: null,
      uncertainty: null,
      guardBand: null,
      conformanceProbability: null,
    };
  }
  const verdict = decide(req, input, base, unitLabel);
  if (ctx.requiredAtStage) return verdict;
  return {
    ...verdict,
    outcome: "not required",
    informativeOutcome: verdict.outcome,
    explanation: `${def.name} is not required at this stage; for information: ${verdict.outcome} — ${verdict.explanation}`,
  };
}

function decide(req: GoverningRequirement, input: ResultInput, base: Pick<Verdict, "parameter" | "unit" | "governing" | "ruleText">, unitLabel: string): Verdict {
  const r = input.reading;
  const toCanonical = (x: number) => convert(x, input.unit, req.unit, { densityGPerMl: input.densityGPerMl });
  const limitsText = [req.lower && `at least ${boundText(req.lower, unitLabel)}`, req.upper && `at most ${boundText(req.upper, unitLabel)}`].filter(Boolean).join(" and ");

  if (r.kind === "presence") {
    return {
      ...base,
      outcome: r.present ? "fail" : "pass",
      explanation: r.present ? `${parameter(req.parameter).name}: present, where none is allowed.` : `${parameter(req.parameter).name}: absent.`,
      resultText: r.present ? "present" : "absent",
      value: null,
      decidingSide: r.present ? "upper" : null,
      uncertainty: null,
      guardBand: null,
      conformanceProbability: null,
    };
  }

  if (r.kind === "value") {
    const x = toCanonical(r.value);
    const unc = uncertaintyFor(req, x, input);
    const w = guardWidth(req.rule, unc.u);
    const { statement, side } = statementAt(req, x, w);
    const p = conformanceProbability(x, unc.u, req.lower?.value, req.upper?.value);
    const decided = side && req[side] ? ` The ${side} limit decides: ${boundText(req[side]!, unitLabel)}.` : "";
    return {
      ...base,
      outcome: statement,
      explanation: `${trim(x)} ${unitLabel} against ${limitsText || "no limit"}: ${statement}.${decided}${w > 0 ? ` Guard band w = ${trim(w)} ${unitLabel}.` : ""}`,
      resultText: `${trim(x)}`,
      value: x,
      decidingSide: side,
      uncertainty: unc,
      guardBand: w,
      conformanceProbability: p,
    };
  }

  // Censored: the true value lies in an interval; decide only if every value in it gives the same kind of answer.
  const canonicalText = formatReading(
    r.kind === "below" ? { kind: "below", limit: r.limit === null ? null : toCanonical(r.limit) } : { kind: "above", limit: toCanonical(r.limit) },
    parameter(req.parameter).digits,
  );
  const common = { ...base, resultText: canonicalText, value: null, uncertainty: null, conformanceProbability: null };
  if (r.kind === "below" && r.limit === null) {
    return {
      ...common,
      outcome: "inconclusive",
      explanation: "Reported as not detected without a limit of quantification, so conformity cannot be shown. Ask the laboratory for its limit of quantification.",
      decidingSide: null,
      guardBand: null,
    };
  }
  const lo = r.kind === "below" ? 0 : toCanonical(r.limit);
  const hi = r.kind === "below" ? toCanonical(r.limit!) : Infinity;
  // The reporting limit carries no usable uncertainty; the guard band uses the default for a value at the limit.
  const unc = uncertaintyFor(req, r.kind === "below" ? hi : lo, { ...input, uncertainty: null });
  const w = guardWidth(req.rule, unc.u);
  const ends = [statementAt(req, lo, w), statementAt(req, hi, w)];
  const worst = worse(ends[0]!.statement, ends[1]!.statement);
  const centre = req.lower && req.upper ? (req.lower.value + req.upper.value) / 2 : req.upper ? lo : hi;
  const bestCandidates = [...ends, statementAt(req, Math.min(Math.max(centre, lo), hi), w)];
  const best = bestCandidates.map((e) => e.statement).reduce((a, b) => (worse(a, b) === a ? b : a));
  const side = ends.find((e) => e.statement === worst)?.side ?? null;
  if (passing(worst)) {
    return { ...common, outcome: worst, explanation: `${canonicalText} ${unitLabel}: every value below the reporting limit meets ${limitsText}.`, decidingSide: worst === "pass" ? null : side, guardBand: w };
  }
  if (!passing(best)) {
    return { ...common, outcome: best, explanation: `${canonicalText} ${unitLabel}: every value in that range breaks ${limitsText}.`, decidingSide: side, guardBand: w };
  }
  return {
    ...common,
    outcome: "inconclusive",
    explanation: `${canonicalText} ${unitLabel} cannot be decided against ${limitsText}: the true value may lie on either side. ${r.kind === "below" ? "A method with a lower limit of quantification is needed." : "Dilute and re-analyse within the method's range."}`,
    decidingSide: side,
    guardBand: w,
  };
}
