/**
 * A requirement is the buyer's range intersected with the destination markets' law. The result
 * says which bound governs on each side and where it comes from.
 */
import { acceptsUnit, findParameter, type ParameterId } from "./parameters.ts";
import { convert, UNITS, type UnitId } from "./units.ts";
import {
  applicableLimits,
  undeterminedText,
  type AppliedLimit,
  type MarketId,
  type UndeterminedLimit,
  type WineProfile,
} from "./markets/index.ts";
import type { DecisionRule } from "./decision.ts";

export interface BuyerRequirement {
  parameter: string;
  /** Unit the buyer wrote lower, upper and target in. */
  unit: string;
  lower?: number | null;
  upper?: number | null;
  target?: number | null;
  rule: DecisionRule;
}

export type BoundSource = { kind: "buyer" } | { kind: "law"; limit: AppliedLimit };

export interface GoverningBound {
  /** In the parameter's canonical unit. */
  value: number;
  source: BoundSource;
}

export interface RequirementIssue {
  severity: "error" | "warning";
  field: "parameter" | "unit" | "lower" | "upper" | "target" | "rule";
  message: string;
}

export interface GoverningRequirement {
  parameter: ParameterId;
  /** Canonical unit of the parameter; every value below is in it. */
  unit: UnitId;
  lower?: GoverningBound;
  upper?: GoverningBound;
  target?: number;
  rule: DecisionRule;
  legalLimits: AppliedLimit[];
  undetermined: UndeterminedLimit[];
  issues: RequirementIssue[];
}

const fmt = (x: number) => String(Number(x.toPrecision(6)));

/** Checks the buyer's row on its own; the same messages serve the editor and the API. */
export function validateBuyerRequirement(row: BuyerRequirement): RequirementIssue[] {
  const issues: RequirementIssue[] = [];
  const p = findParameter(row.parameter);
  if (!p) return [{ severity: "error", field: "parameter", message: `Unknown parameter "${row.parameter}".` }];
  if (!acceptsUnit(p, row.unit)) {
    const label = Object.prototype.hasOwnProperty.call(UNITS, row.unit) ? row.unit : `"${row.unit}"`;
    issues.push({ severity: "error", field: "unit", message: `${label} is not a unit for ${p.name}; use ${p.units.join(", ")}.` });
    return issues;
  }
  const { lower, upper, target } = row;
  const has = (x: number | null | undefined): x is number => typeof x === "number" && Number.isFinite(x);
  if (p.kind === "presence") {
    if (has(lower) || has(upper) || has(target))
      issues.push({ severity: "error", field: "upper", message: `${p.name} is a present/absent result; it takes no numeric limits.` });
    return issues;
  }
  if (!has(lower) && !has(upper))
    issues.push({ severity: "error", field: "upper", message: "Give a lower limit, an upper limit, or both." });
  if (has(lower) && has(upper) && lower > upper)
    issues.push({
      severity: "error",
      field: "lower",
      message: `The lower limit (${fmt(lower)}) is above the upper limit (${fmt(upper)}).`,
    });
  if (has(target) && ((has(lower) && target < lower) || (has(upper) && target > upper))) {
    issues.push({ severity: "error", field: "target", message: "The target lies outside the range." });
  }
  for (const [field, v] of [
    ["lower", lower],
    ["upper", upper],
    ["target", target],
  ] as const) {
    if (has(v) && v < 0 && p.unit !== "pH") issues.push({ severity: "error", field, message: `${p.name} cannot be negative.` });
  }
  if (has(lower) && p.bounds === "upper")
    issues.push({ severity: "warning", field: "lower", message: `${p.name} usually has only an upper limit.` });
  if (has(upper) && p.bounds === "lower")
    issues.push({ severity: "warning", field: "upper", message: `${p.name} usually has only a lower limit.` });
  if (row.rule.kind !== "simple" && !(row.rule.guard.k > 0 && row.rule.guard.k <= 5)) {
    issues.push({ severity: "error", field: "rule", message: "The guard band factor k must be above 0 and at most 5." });
  }
  return issues;
}

/**
 * Builds the requirement that governs a result: the strictest of the buyer's bound and every
 * applicable legal limit of the destination markets, on each side.
 */
export function buildRequirement(
  row: BuyerRequirement,
  markets: readonly MarketId[],
  profile: WineProfile,
  opts: { densityGPerMl?: number } = {},
): GoverningRequirement {
  const issues = validateBuyerRequirement(row);
  const p = findParameter(row.parameter);
  if (!p || issues.some((i) => i.severity === "error" && (i.field === "parameter" || i.field === "unit"))) {
    throw new RequirementError(issues);
  }
  const id = p.id as ParameterId;
  const toCanonical = (x: number | null | undefined) =>
    typeof x === "number" && Number.isFinite(x) ? convert(x, row.unit as UnitId, p.unit, opts) : undefined;
  const { limits, undetermined } = applicableLimits(markets, profile, { parameter: id, densityGPerMl: opts.densityGPerMl });

  const buyerUpper = toCanonical(row.upper);
  const buyerLower = toCanonical(row.lower);
  const strictest = (side: "max" | "min") =>
    limits.filter((l) => l.side === side).sort((a, b) => (side === "max" ? a.value - b.value : b.value - a.value))[0];
  const lawMax = strictest("max");
  const lawMin = strictest("min");

  const pick = (
    buyer: number | undefined,
    law: AppliedLimit | undefined,
    stricter: (a: number, b: number) => boolean,
  ): GoverningBound | undefined => {
    if (buyer === undefined && !law) return undefined;
    if (law && (buyer === undefined || stricter(law.value, buyer))) return { value: law.value, source: { kind: "law", limit: law } };
    return { value: buyer!, source: { kind: "buyer" } };
  };
  const upper = pick(buyerUpper, lawMax, (a, b) => a < b);
  const lower = pick(buyerLower, lawMin, (a, b) => a > b);

  const unitLabel = UNITS[p.unit].label;
  if (lawMax && buyerUpper !== undefined && buyerUpper > lawMax.value) {
    issues.push({
      severity: "warning",
      field: "upper",
      message: `Your upper limit is looser than the law: ${lawMax.marketName} allows at most ${fmt(lawMax.value)} ${unitLabel} (${lawMax.citation.document}, ${lawMax.citation.article}). The legal limit governs.`,
    });
  }
  if (lawMin && buyerLower !== undefined && buyerLower < lawMin.value) {
    issues.push({
      severity: "warning",
      field: "lower",
      message: `Your lower limit is looser than the law: ${lawMin.marketName} requires at least ${fmt(lawMin.value)} ${unitLabel} (${lawMin.citation.document}, ${lawMin.citation.article}). The legal limit governs.`,
    });
  }
  if (upper && lower && lower.value > upper.value) {
    issues.push({
      severity: "error",
      field: "lower",
      message: "With the legal limits applied, the lower limit lies above the upper limit: no wine could conform.",
    });
  }
  for (const u of undetermined)
    issues.push({ severity: "warning", field: "parameter", message: `${undeterminedText(u)} State it on the contract to decide.` });
  return {
    parameter: id,
    unit: p.unit,
    lower,
    upper,
    target: toCanonical(row.target),
    rule: row.rule,
    legalLimits: limits,
    undetermined,
    issues,
  };
}

export class RequirementError extends Error {
  constructor(readonly issues: RequirementIssue[]) {
    super(issues.map((i) => i.message).join(" "));
  }
}
