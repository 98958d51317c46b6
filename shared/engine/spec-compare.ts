/** Comparing spec versions: a per-parameter diff, and a backtest of past results under a draft. */
import { convert, type UnitId } from "./units.ts";
import { findParameter } from "./parameters.ts";
import { buildRequirement, type BuyerRequirement } from "./requirement.ts";
import { evaluate, type Outcome, type ResultInput } from "./evaluate.ts";
import type { MarketId, WineProfile } from "./markets/index.ts";

export type DiffKind = "added" | "removed" | "tightened" | "loosened" | "tightened and loosened" | "unchanged";

export interface SideChange {
  side: "lower" | "upper";
  before: number | null;
  after: number | null;
  change: "tightened" | "loosened" | "unchanged";
}

export interface ParameterDiff {
  parameter: string;
  name: string;
  kind: DiffKind;
  /** Values in the parameter's canonical unit. */
  sides: SideChange[];
  /** Other fields that changed: unit, target, decision rule. */
  otherChanges: string[];
}

const canonical = (row: BuyerRequirement, v: number | null | undefined) => {
  const p = findParameter(row.parameter);
  return typeof v === "number" && p ? convert(v, row.unit as UnitId, p.unit) : null;
};

function sideChange(side: "lower" | "upper", before: number | null, after: number | null): SideChange {
  const eq = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
  let change: SideChange["change"];
  if (before === null && after === null) change = "unchanged";
  else if (before === null) change = "tightened";
  else if (after === null) change = "loosened";
  else if (eq(before, after)) change = "unchanged";
  else change = (side === "upper" ? after < before : after > before) ? "tightened" : "loosened";
  return { side, before, after, change };
}

/** Diff of two versions' requirement rows, compared in canonical units. */
export function diffSpecs(before: readonly BuyerRequirement[], after: readonly BuyerRequirement[]): ParameterDiff[] {
  const a = new Map(before.map((r) => [r.parameter, r]));
  const b = new Map(after.map((r) => [r.parameter, r]));
  const ids = [...new Set([...a.keys(), ...b.keys()])];
  return ids.map((id) => {
    const name = findParameter(id)?.name ?? id;
    const x = a.get(id);
    const y = b.get(id);
    if (!x) return { parameter: id, name, kind: "added", sides: [], otherChanges: [] };
    if (!y) return { parameter: id, name, kind: "removed", sides: [], otherChanges: [] };
    const sides = [
      sideChange("lower", canonical(x, x.lower), canonical(y, y.lower)),
      sideChange("upper", canonical(x, x.upper), canonical(y, y.upper)),
    ];
    const t = sides.some((s) => s.change === "tightened");
    const l = sides.some((s) => s.change === "loosened");
    const otherChanges: string[] = [];
    if (x.unit !== y.unit) otherChanges.push(`unit ${x.unit} → ${y.unit}`);
    const tx = canonical(x, x.target);
    const ty = canonical(y, y.target);
    if (tx !== ty && !(tx !== null && ty !== null && Math.abs(tx - ty) < 1e-9)) otherChanges.push("target");
    if (JSON.stringify(x.rule) !== JSON.stringify(y.rule)) otherChanges.push("decision rule");
    const kind: DiffKind = t && l ? "tightened and loosened" : t ? "tightened" : l ? "loosened" : "unchanged";
    return { parameter: id, name, kind, sides, otherChanges };
  });
}

export interface PastResult {
  lotId: string;
  lotCode: string;
  vintage: number;
  parameter: string;
  input: ResultInput;
  profile: WineProfile;
}

export interface BacktestChange {
  lotId: string;
  lotCode: string;
  vintage: number;
  parameter: string;
  before: Outcome;
  after: Outcome;
}

export interface BacktestSummary {
  checked: number;
  newlyFailing: BacktestChange[];
  newlyPassing: BacktestChange[];
  /** e.g. "3 lots of the 2024 vintage would now fail Volatile acidity". */
  sentences: string[];
}

const failing = (o: Outcome) => o === "fail" || o === "conditional fail";
const passingOutcome = (o: Outcome) => o === "pass" || o === "conditional pass";

/**
 * Backtest in steps, so a caller can show progress on a long history: each yield reports how many
 * results are done; the generator returns the summary.
 */
export function* backtestSteps(
  results: readonly PastResult[],
  current: readonly BuyerRequirement[],
  draft: readonly BuyerRequirement[],
  markets: readonly MarketId[],
  stepSize = 500,
): Generator<{ done: number; total: number }, BacktestSummary> {
  const byParam = (rows: readonly BuyerRequirement[]) => new Map(rows.map((r) => [r.parameter, r]));
  const cur = byParam(current);
  const dra = byParam(draft);
  const cache = new Map<string, ReturnType<typeof buildRequirement> | null>();
  const requirementFor = (which: "current" | "draft", row: BuyerRequirement | undefined, profile: WineProfile) => {
    if (!row) return null;
    const key = `${which}|${row.parameter}|${JSON.stringify(profile)}`;
    if (!cache.has(key)) {
      try {
        cache.set(key, buildRequirement(row, markets, profile));
      } catch {
        cache.set(key, null);
      }
    }
    return cache.get(key)!;
  };
  const newlyFailing: BacktestChange[] = [];
  const newlyPassing: BacktestChange[] = [];
  for (let i = 0; i < results.length; i++) {
    const r = results[i]!;
    const a = requirementFor("current", cur.get(r.parameter), r.profile);
    const b = requirementFor("draft", dra.get(r.parameter), r.profile);
    const before: Outcome = a ? evaluate(a, r.input).outcome : "not required";
    const after: Outcome = b ? evaluate(b, r.input).outcome : "not required";
    const change = { lotId: r.lotId, lotCode: r.lotCode, vintage: r.vintage, parameter: r.parameter, before, after };
    if (failing(after) && !failing(before)) newlyFailing.push(change);
    if (passingOutcome(after) && failing(before)) newlyPassing.push(change);
    if ((i + 1) % stepSize === 0) yield { done: i + 1, total: results.length };
  }
  return {
    checked: results.length,
    newlyFailing,
    newlyPassing,
    sentences: summarise(newlyFailing, "fail").concat(summarise(newlyPassing, "pass")),
  };
}

export function backtest(...args: Parameters<typeof backtestSteps>): BacktestSummary {
  const it = backtestSteps(...args);
  for (;;) {
    const step = it.next();
    if (step.done) return step.value;
  }
}

function summarise(changes: readonly BacktestChange[], verb: "fail" | "pass"): string[] {
  const groups = new Map<string, Set<string>>();
  for (const c of changes) {
    const key = `${c.vintage}|${c.parameter}`;
    if (!groups.has(key)) groups.set(key, new Set());
    groups.get(key)!.add(c.lotId);
  }
  return [...groups.entries()].map(([key, lots]) => {
    const [vintage, param] = key.split("|");
    const n = lots.size;
    return `${n} lot${n === 1 ? "" : "s"} of the ${vintage} vintage would now ${verb} ${findParameter(param!)?.name ?? param}`;
  });
}
