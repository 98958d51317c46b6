/** Runs the engine over one analysis against the governing version, producing verdicts to store. */
import {
  buildRequirement,
  ENGINE_VERSION,
  evaluate,
  MARKET_PACKS,
  parseReading,
  findParameter,
  type GoverningBound,
  type MarketId,
  type Outcome,
  type ReportedUncertainty,
  type UnitId,
} from "../../../shared/engine/index.ts";
import { wineProfile, type WineFacts } from "../../../shared/specs/profile.ts";
import { specStageFor, type AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import type { StoredBound, StoredVerdict } from "../../../shared/lots/views.ts";
import type { RequirementView } from "../../../shared/specs/views.ts";

export interface EvaluatedResult {
  parameter: string;
  raw: string;
  unit: string;
  uncertainty?: ReportedUncertainty | null;
}

// A lot is as good as its worst required result; a missing required result outweighs a conditional pass.
const ORDER: Outcome[] = ["not required", "pass", "conditional pass", "missing", "inconclusive", "conditional fail", "fail"];
export const worstOf = (outcomes: Outcome[]): Outcome => outcomes.reduce<Outcome>((w, o) => (ORDER.indexOf(o) > ORDER.indexOf(w) ? o : w), "not required");

function storedBound(b: GoverningBound | undefined): StoredBound | null {
  if (!b) return null;
  return b.source.kind === "buyer" ? { value: b.value, source: "buyer" } : { value: b.value, source: "law", market: b.source.limit.market, citation: b.source.limit.citation };
}

export function evaluateAnalysis(
  wine: WineFacts & { markets: MarketId[] },
  lot: { vintage: number; market: string },
  stage: AnalysisStage,
  requirements: RequirementView[] | null,
  results: EvaluatedResult[],
): { verdicts: StoredVerdict[]; worst: Outcome; marketVersions: Record<string, string>; engineVersion: string } {
  const markets = (MARKET_PACKS[lot.market as MarketId] ? [lot.market] : wine.markets) as MarketId[];
  const profile = wineProfile(wine, lot.vintage);
  const byParameter = new Map(results.map((r) => [r.parameter, r]));
  const verdicts: StoredVerdict[] = (requirements ?? []).map((row) => {
    const requiredAtStage = row.stages.includes(specStageFor(stage));
    const req = buildRequirement(row, markets, profile);
    const r = byParameter.get(row.parameter);
    const parsed = r ? parseReading(r.raw, { presence: findParameter(r.parameter)?.kind === "presence" }) : null;
    const v = evaluate(req, r && parsed?.ok ? { reading: parsed.reading, unit: r.unit as UnitId, uncertainty: r.uncertainty ?? null } : null, { requiredAtStage, displayUnit: row.unit as UnitId });
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
      legalLimits: req.legalLimits.map((l) => ({ market: l.market, side: l.side, value: l.value, citation: l.citation })),
    };
  });
  return {
    verdicts,
    worst: worstOf(verdicts.map((v) => v.outcome)),
    marketVersions: Object.fromEntries(markets.map((m) => [m, MARKET_PACKS[m].version])),
    engineVersion: ENGINE_VERSION,
  };
}
