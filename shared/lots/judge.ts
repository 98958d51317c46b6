/**
 * The one judge of an analysis. The browser's live preview, the server's stored evaluation, the
 * demo seeders, the readiness board, the certificate and the trends all come through here, so a
 * lot reads the same everywhere: which markets apply, how each spec row is built against the law,
 * how each result is decided, which outcome is worst and what counts as failing.
 */
import {
  buildRequirement,
  convert,
  ENGINE_VERSION,
  evaluate,
  findParameter,
  MARKET_PACKS,
  parseReading,
  type GoverningBound,
  type NumberFormat,
  type GoverningRequirement,
  type MarketId,
  type Outcome,
  type ParameterId,
  type Reading,
  type ReportedUncertainty,
  type TransitValue,
  type UnitId,
  type WineProfile,
} from "../engine/index.ts";
import { wineProfile, type WineFacts } from "../specs/profile.ts";
import type { RequirementView } from "../specs/views.ts";
import { specStageFor, type AnalysisStage } from "./vocabulary.ts";
import type { StoredBound, StoredVerdict } from "./views.ts";

/** A result as the laboratory wrote it, read once: the stored reading and the verdict both come from `reading`. */
export interface ReadResult {
  parameter: string;
  raw: string;
  unit: UnitId;
  uncertainty: ReportedUncertainty | null;
  /** null when the text cannot be read; `error` then says why. */
  reading: Reading | null;
  error?: string;
}

/** `numberFormat`: how the laboratory writes numbers, when it said; it decides a number that reads two ways ("1.234"). */
export function readResult(
  r: { parameter: string; raw: string; unit: UnitId; uncertainty?: ReportedUncertainty | null },
  numberFormat?: NumberFormat | null,
): ReadResult {
  const parsed = parseReading(r.raw, {
    presence: findParameter(r.parameter)?.kind === "presence",
    unit: r.unit,
    ...(numberFormat ? { numberFormat } : {}),
  });
  const base = { parameter: r.parameter, raw: r.raw, unit: r.unit, uncertainty: r.uncertainty ?? null };
  // "0.82 ± 0.05" carries its own expanded uncertainty.
  return parsed.ok
    ? { ...base, uncertainty: base.uncertainty ?? parsed.uncertainty ?? null, reading: parsed.reading }
    : { ...base, reading: null, error: parsed.error };
}

/** From best to worst: a missing required result outweighs a conditional pass, a fail outweighs everything. */
export const OUTCOME_RANK: readonly Outcome[] = [
  "not required",
  "pass",
  "conditional pass",
  "missing",
  "inconclusive",
  "conditional fail",
  "fail",
];

export const worstOf = (outcomes: Iterable<Outcome>): Outcome => {
  let w: Outcome = "not required";
  for (const o of outcomes) if (OUTCOME_RANK.indexOf(o) > OUTCOME_RANK.indexOf(w)) w = o;
  return w;
};

/** A result that opens a deviation: outside the limit, with or without the uncertainty taken into account. */
export const isFailing = (o: Outcome) => o === "fail" || o === "conditional fail";

/** The lot's own market when it names one Cellarpact knows; otherwise every market of the wine. */
export function judgedMarkets(lotMarket: string | null | undefined, wineMarkets: readonly MarketId[]): MarketId[] {
  return lotMarket && lotMarket in MARKET_PACKS ? [lotMarket as MarketId] : [...wineMarkets];
}

export interface JudgeContext {
  wine: WineFacts & { markets: readonly MarketId[] };
  lot: { vintage: number; market: string | null };
  /** The rows of the spec version that governs the lot; null when none is agreed. */
  requirements: readonly RequirementView[] | null;
}

/** A judge for one lot under one spec version: the rows are built against the law once, then reused per analysis. */
export interface Judge {
  markets: MarketId[];
  built: Map<string, GoverningRequirement>;
  rows: readonly RequirementView[];
  profile: WineProfile;
  /** The sample's density at 20 °C in g/mL, when its analysis measured one; mg/kg limits and results use it alike. */
  densityGPerMl?: number;
}

export function judgeFor(ctx: JudgeContext): Judge {
  const markets = judgedMarkets(ctx.lot.market, ctx.wine.markets);
  const profile = wineProfile(ctx.wine, ctx.lot.vintage);
  const rows = ctx.requirements ?? [];
  return { markets, rows, profile, built: new Map(rows.map((r) => [r.parameter, buildRequirement(r, markets, profile)])) };
}

/** The same judge for one sample of measured density: every row built again with it (once per density, for a batch). */
const BY_DENSITY = new WeakMap<Judge, Map<number, Judge>>();
function withDensity(judge: Judge, densityGPerMl: number): Judge {
  let cache = BY_DENSITY.get(judge);
  if (!cache) BY_DENSITY.set(judge, (cache = new Map()));
  let j = cache.get(densityGPerMl);
  if (!j)
    cache.set(
      densityGPerMl,
      (j = {
        ...judge,
        densityGPerMl,
        built: new Map(judge.rows.map((r) => [r.parameter, buildRequirement(r, judge.markets, judge.profile, { densityGPerMl })])),
      }),
    );
  return j;
}

/** The density the analysis measured, in g/mL; undefined when it has none. */
function measuredDensity(results: readonly ReadResult[]): number | undefined {
  const d = results.find((r) => r.parameter === "density" && r.reading?.kind === "value");
  if (!d || d.reading?.kind !== "value") return undefined;
  const g = convert(d.reading.value, d.unit, "g/mL");
  return g > 0.5 && g < 2 ? g : undefined;
}

function storedBound(b: GoverningBound | undefined): StoredBound | null {
  if (!b) return null;
  return b.source.kind === "buyer"
    ? { value: b.value, source: "buyer" }
    : { value: b.value, source: "law", market: b.source.limit.market, citation: b.source.limit.citation };
}

/** The verdict of one spec row, given the result for it (or none). */
export function judgeRow(judge: Judge, row: RequirementView, stage: AnalysisStage, result: ReadResult | undefined): StoredVerdict {
  const req = judge.built.get(row.parameter)!;
  const input = result?.reading
    ? {
        reading: result.reading,
        unit: result.unit,
        uncertainty: result.uncertainty,
        ...(judge.densityGPerMl ? { densityGPerMl: judge.densityGPerMl } : {}),
      }
    : null;
  const v = evaluate(req, input, { requiredAtStage: row.stages.includes(specStageFor(stage)), displayUnit: row.unit });
  return {
    parameter: row.parameter,
    severity: row.severity,
    outcome: v.outcome,
    ...(v.informativeOutcome ? { informativeOutcome: v.informativeOutcome } : {}),
    explanation: v.explanation,
    resultText: v.resultText,
    value: v.value,
    unit: v.unit,
    displayUnit: row.unit,
    decidingSide: v.decidingSide,
    lower: storedBound(v.governing.lower),
    upper: storedBound(v.governing.upper),
    uncertainty: v.uncertainty,
    guardBand: v.guardBand,
    conformanceProbability: v.conformanceProbability,
    ruleText: v.ruleText,
    legalLimits: req.legalLimits.map((l) => ({
      market: l.market,
      side: l.side,
      value: l.value,
      citation: l.citation,
      confirmed: l.confirmed,
    })),
  };
}

/** How many verdicts of each outcome, leaving out rows the stage does not require. */
export type OutcomeCounts = Partial<Record<Outcome, number>>;

export function outcomeCounts(verdicts: readonly { outcome: Outcome }[]): OutcomeCounts {
  const counts: OutcomeCounts = {};
  for (const v of verdicts) if (v.outcome !== "not required") counts[v.outcome] = (counts[v.outcome] ?? 0) + 1;
  return counts;
}

/** "4 pass, 1 conditional pass, 2 missing", worst last; "nothing required" when empty. */
export function countsText(counts: OutcomeCounts): string {
  const parts = OUTCOME_RANK.filter((o) => counts[o]).map((o) => `${counts[o]} ${o}`);
  return parts.join(", ") || "nothing required at this stage";
}

export interface Judgement {
  verdicts: StoredVerdict[];
  worst: Outcome;
  counts: OutcomeCounts;
  /** Parameters whose verdict opens a deviation. */
  failing: string[];
  marketVersions: Record<string, string>;
  engineVersion: string;
}

/**
 * Judges one analysis. `onlyReported` is for an independent audit, which speaks only for the
 * parameters ordered: the spec's other rows are then not "missing" from it.
 */
export function judgeAnalysis(
  judge0: Judge,
  stage: AnalysisStage,
  results: readonly ReadResult[],
  opts: { onlyReported?: boolean } = {},
): Judgement {
  const density = measuredDensity(results);
  const judge = density !== undefined && density !== 1 ? withDensity(judge0, density) : judge0;
  const byParameter = new Map(results.map((r) => [r.parameter, r]));
  const rows = opts.onlyReported ? judge.rows.filter((r) => byParameter.has(r.parameter)) : judge.rows;
  const verdicts = rows.map((row) => judgeRow(judge, row, stage, byParameter.get(row.parameter)));
  return {
    verdicts,
    worst: worstOf(verdicts.map((v) => v.outcome)),
    counts: outcomeCounts(verdicts),
    failing: verdicts.filter((v) => isFailing(v.outcome)).map((v) => v.parameter),
    marketVersions: Object.fromEntries(judge.markets.map((m) => [m, MARKET_PACKS[m].version])),
    engineVersion: ENGINE_VERSION,
  };
}

/** The values of one analysis in canonical units, for comparing arrival with pre-shipment. */
export function transitValues(
  results: readonly { parameter: string; reading: Reading | null; unit: UnitId; uncertainty?: ReportedUncertainty | null }[],
) {
  const out: Partial<Record<ParameterId, TransitValue>> = {};
  for (const r of results) {
    const p = findParameter(r.parameter);
    if (!p || r.reading?.kind !== "value") continue;
    const value = convert(r.reading.value, r.unit, p.unit);
    const u = r.uncertainty
      ? convert(r.uncertainty.value, r.unit, p.unit) / (r.uncertainty.kind === "expanded" ? (r.uncertainty.k ?? 2) : 1)
      : undefined;
    out[p.id as ParameterId] = u === undefined ? { value } : { value, u };
  }
  return out;
}
