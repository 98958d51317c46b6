/**
 * Decides one result against its governing requirement, per ISO/IEC 17025:2017 7.8.6 under the
 * decision rule the requirement names. Missing, not-required and censored results get their own,
 * explained outcomes; a censored result is never treated as a number.
 */
import { conformanceProbability, describeRule, guardWidth, statementForSide, worse, type Statement } from "./decision.ts";
import { parameter, type ParameterId } from "./parameters.ts";
import { formatReading, type Reading } from "./parse.ts";
import { convert, UNITS, type UnitId } from "./units.ts";
import { displayValue } from "./display.ts";
import type { GoverningBound, GoverningRequirement } from "./requirement.ts";

export const ENGINE_VERSION = "1.2.0";

export type Outcome = Statement | "missing" | "not required" | "inconclusive";

export interface ReportedUncertainty {
  /**
   * Expanded uncertainty U with coverage factor k (k = 2 when the lab does not say), a standard
   * uncertainty u, or a relative expanded uncertainty in % of the result (again with k, default 2).
   */
  kind: "expanded" | "standard" | "relative";
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

function boundText(parameterId: string, b: GoverningBound, unitId: UnitId, factor: number): string {
  const where =
    b.source.kind === "buyer"
      ? "the buyer's specification"
      : `${b.source.limit.marketName}: ${b.source.limit.citation.document}, ${b.source.limit.citation.article}`;
  return `${displayValue(parameterId, b.value * factor, unitId)} ${UNITS[unitId].label} (${where})`;
}

interface Wording {
  limitsText: string;
  lowerText: string;
  upperText: string;
  ruleText: string;
  /** Unit the explanation speaks in, and the factor from the canonical unit to it. */
  unitLabel: string;
  unitId: UnitId;
  factor: number;
}

/** The wording of a requirement's limits, built once per requirement and display unit rather than per result. */
const TEXTS = new WeakMap<GoverningRequirement, Map<UnitId, Wording>>();
function textsFor(req: GoverningRequirement, displayUnit: UnitId): Wording {
  let byUnit = TEXTS.get(req);
  if (!byUnit) TEXTS.set(req, (byUnit = new Map()));
  let t = byUnit.get(displayUnit);
  if (!t) {
    const factor = convert(1, req.unit, displayUnit);
    const unitLabel = UNITS[displayUnit].label;
    const lowerText = req.lower ? boundText(req.parameter, req.lower, displayUnit, factor) : "";
    const upperText = req.upper ? boundText(req.parameter, req.upper, displayUnit, factor) : "";
    const limitsText = [lowerText && `at least ${lowerText}`, upperText && `at most ${upperText}`].filter(Boolean).join(" and ");
    t = { limitsText, lowerText, upperText, ruleText: describeRule(req.rule), unitLabel, unitId: displayUnit, factor };
    byUnit.set(displayUnit, t);
  }
  return t;
}

/** The standard uncertainty of a result in the parameter's canonical unit: the laboratory's, else the catalogue default. */
export function usedUncertainty(
  parameterId: ParameterId,
  canonicalUnit: UnitId,
  value: number,
  input: Pick<ResultInput, "unit" | "uncertainty" | "densityGPerMl">,
): UsedUncertainty {
  const def = parameter(parameterId);
  if (input.uncertainty && input.uncertainty.value >= 0) {
    const k = input.uncertainty.kind === "standard" ? 1 : (input.uncertainty.k ?? 2);
    if (!(k > 0)) throw new RangeError(`A coverage factor must be above 0; k = ${k} was given.`);
    if (input.uncertainty.kind === "relative") {
      return {
        u: (Math.abs(value) * input.uncertainty.value) / 100 / k,
        source: "laboratory",
        basis: `laboratory's relative expanded uncertainty of ${input.uncertainty.value} % with k = ${k}`,
      };
    }
    const inCanonical = convert(input.uncertainty.value, input.unit, canonicalUnit, { densityGPerMl: input.densityGPerMl });
    return {
      u: Math.abs(inCanonical) / k,
      source: "laboratory",
      basis:
        input.uncertainty.kind === "expanded" ? `laboratory's expanded uncertainty U with k = ${k}` : "laboratory's standard uncertainty",
    };
  }
  if ("defaultUncertainty" in def && def.defaultUncertainty) {
    const d = def.defaultUncertainty;
    return {
      u: d.kind === "absolute" ? d.u : d.u * Math.abs(value),
      source: "default",
      basis: `no uncertainty reported; default used: ${d.basis}`,
    };
  }
  return { u: 0, source: "none", basis: "no uncertainty reported and no default exists for this parameter; the result is taken as exact" };
}

const uncertaintyFor = (req: GoverningRequirement, value: number, input: ResultInput) =>
  usedUncertainty(req.parameter, req.unit, value, input);

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

/** True when a guard band of width w on each side leaves no value that could pass (concentrations are never negative). */
export function guardLeavesNothing(req: Pick<GoverningRequirement, "lower" | "upper">, w: number): boolean {
  const hi = req.upper ? req.upper.value - w : Infinity;
  const lo = req.lower ? req.lower.value + w : 0;
  return hi < lo || hi < 0;
}

type Decided = Omit<Verdict, "parameter" | "unit" | "governing" | "ruleText" | "informativeOutcome">;

/** Builds every verdict with the same fields in the same order (a fixed shape keeps this fast). */
function makeVerdict(req: GoverningRequirement, ruleText: string, d: Decided, informativeOutcome?: Outcome): Verdict {
  const v: Verdict = {
    parameter: req.parameter,
    outcome: d.outcome,
    explanation: d.explanation,
    resultText: d.resultText,
    value: d.value,
    unit: req.unit,
    decidingSide: d.decidingSide,
    governing: { lower: req.lower, upper: req.upper },
    uncertainty: d.uncertainty,
    guardBand: d.guardBand,
    conformanceProbability: d.conformanceProbability,
    ruleText,
  };
  if (informativeOutcome !== undefined) v.informativeOutcome = informativeOutcome;
  return v;
}

/**
 * ctx.displayUnit (one of the parameter's units, e.g. the unit the buyer wrote the spec in) is the
 * unit of the explanation and resultText; value, bounds and uncertainty stay in the canonical unit.
 */
export function evaluate(
  req: GoverningRequirement,
  input: ResultInput | null,
  ctx: { requiredAtStage: boolean; displayUnit?: UnitId } = { requiredAtStage: true },
): Verdict {
  const def = parameter(req.parameter);
  const texts = textsFor(req, ctx.displayUnit ?? req.unit);
  if (!input) {
    return makeVerdict(req, texts.ruleText, {
      outcome: ctx.requiredAtStage ? "missing" : "not required",
      explanation: ctx.requiredAtStage
        ? `No result for ${def.name}, which this stage requires.`
        : `${def.name} is not required at this stage.`,
      resultText: null,
      value: null,
      decidingSide: null,
      uncertainty: null,
      guardBand: null,
      conformanceProbability: null,
    });
  }
  const d = decide(req, input, texts);
  if (ctx.requiredAtStage) return makeVerdict(req, texts.ruleText, d);
  const explanation = `${def.name} is not required at this stage; for information: ${d.outcome} — ${d.explanation}`;
  return makeVerdict(req, texts.ruleText, { ...d, outcome: "not required", explanation }, d.outcome);
}

function decided(
  outcome: Outcome,
  explanation: string,
  resultText: string | null,
  value: number | null,
  decidingSide: "lower" | "upper" | null,
  uncertainty: UsedUncertainty | null,
  guardBand: number | null,
  conformanceProbability: number | null,
): Decided {
  return { outcome, explanation, resultText, value, decidingSide, uncertainty, guardBand, conformanceProbability };
}

function decide(req: GoverningRequirement, input: ResultInput, texts: Wording): Decided {
  const r = input.reading;
  const factor = convert(1, input.unit, req.unit, { densityGPerMl: input.densityGPerMl });
  const { limitsText, lowerText, upperText, unitLabel, unitId, factor: show } = texts;
  const trim = (x: number) => displayValue(req.parameter, x, unitId);

  if (r.kind === "presence") {
    const name = parameter(req.parameter).name;
    return r.present
      ? decided("fail", `${name}: present, where none is allowed.`, "present", null, "upper", null, null, null)
      : decided("pass", `${name}: absent.`, "absent", null, null, null, null, null);
  }

  if (r.kind === "value") {
    const x = r.value * factor;
    const unc = uncertaintyFor(req, x, input);
    const w = guardWidth(req.rule, unc.u);
    const { statement, side } = statementAt(req, x, w);
    const p = conformanceProbability(x, unc.u, req.lower?.value, req.upper?.value);
    const decidedBy = side ? ` The ${side} limit decides: ${side === "upper" ? upperText : lowerText}.` : "";
    const guard = w > 0 ? ` Guard band w = ${trim(w * show)} ${unitLabel}.` : "";
    const shown = trim(x * show);
    const hopeless =
      w > 0 && guardLeavesNothing(req, w)
        ? ` Warning: with this uncertainty no result can show conformity under this rule (the guard band leaves no acceptance zone); a method with a smaller uncertainty is needed.`
        : "";
    return decided(
      statement,
      `${shown} ${unitLabel} against ${limitsText || "no limit"}: ${statement}.${decidedBy}${guard}${hopeless}`,
      shown,
      x,
      side,
      unc,
      w,
      p,
    );
  }

  // Censored: the true value lies in an interval; decide only if every value in it gives the same kind of answer.
  const canonicalText = formatReading(
    r.kind === "below"
      ? { kind: "below", limit: r.limit === null ? null : r.limit * factor * show }
      : { kind: "above", limit: r.limit * factor * show },
    parameter(req.parameter).digits,
  );
  if (r.kind === "below" && r.limit === null) {
    return decided(
      "inconclusive",
      "Reported as not detected without a limit of quantification, so conformity cannot be shown. Ask the laboratory for its limit of quantification.",
      canonicalText,
      null,
      null,
      null,
      null,
      null,
    );
  }
  const lo = r.kind === "below" ? 0 : r.limit * factor;
  const hi = r.kind === "below" ? r.limit! * factor : Infinity;
  // Every value the result allows meets the limits ("<1.0" against "not more than 1.0"): it conforms,
  // whatever the guard band, for the band is about a measured value and there is none here.
  if ((!req.upper || hi <= req.upper.value) && (!req.lower || lo >= req.lower.value)) {
    return decided(
      "pass",
      `${canonicalText} ${unitLabel}: every value in that range meets ${limitsText}.`,
      canonicalText,
      null,
      null,
      null,
      0,
      null,
    );
  }
  // The reporting limit carries no usable uncertainty; the guard band uses the default for a value at the limit.
  const unc = uncertaintyFor(req, r.kind === "below" ? hi : lo, { ...input, uncertainty: null });
  const w = guardWidth(req.rule, unc.u);
  const ends = [statementAt(req, lo, w), statementAt(req, hi, w)];
  const worst = worse(ends[0]!.statement, ends[1]!.statement);
  const centre = req.lower && req.upper ? (req.lower.value + req.upper.value) / 2 : req.upper ? lo : hi;
  const candidates = [...ends, statementAt(req, Math.min(Math.max(centre, lo), hi), w)].map((e) => e.statement);
  const best = candidates.reduce((a, b) => (worse(a, b) === a ? b : a));
  const side = ends.find((e) => e.statement === worst)?.side ?? null;
  if (passing(worst)) {
    return decided(
      worst,
      `${canonicalText} ${unitLabel}: every value below the reporting limit meets ${limitsText}.`,
      canonicalText,
      null,
      worst === "pass" ? null : side,
      null,
      w,
      null,
    );
  }
  if (!passing(best)) {
    return decided(
      best,
      `${canonicalText} ${unitLabel}: every value in that range breaks ${limitsText}.`,
      canonicalText,
      null,
      side,
      null,
      w,
      null,
    );
  }
  const advice =
    r.kind === "below" ? "A method with a lower limit of quantification is needed." : "Dilute and re-analyse within the method's range.";
  return decided(
    "inconclusive",
    `${canonicalText} ${unitLabel} cannot be decided against ${limitsText}: the true value may lie on either side. ${advice}`,
    canonicalText,
    null,
    side,
    null,
    w,
    null,
  );
}
