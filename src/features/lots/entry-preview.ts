/**
 * The live verdicts of the results form: what the user has typed, turned into the same entries the
 * form submits and judged by the same judge the server stores with, so the preview cannot disagree.
 */
import { parseDecimal, type UnitId } from "../../../shared/engine/index.ts";
import { judgeAnalysis, judgeFor, readResult, type Judge, type Judgement, type ReadResult } from "../../../shared/lots/judge.ts";
import type { ResultEntry } from "../../../shared/lots/schemas.ts";
import type { AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import type { LotDetail } from "../../../shared/lots/views.ts";
import type { RequirementView } from "../../../shared/specs/views.ts";

export interface EntryLine {
  raw: string;
  unit: string;
  /** Expanded uncertainty U (k = 2) as typed. */
  u: string;
}

/** The lines with a result, as the form submits them. */
export function entryResults(requirements: readonly RequirementView[], lines: Record<string, EntryLine>): ResultEntry[] {
  return requirements
    .filter((r) => lines[r.parameter]?.raw.trim())
    .map((r) => {
      const l = lines[r.parameter]!;
      const u = l.u.trim() ? parseDecimal(l.u) : null;
      return {
        parameter: r.parameter,
        raw: l.raw.trim(),
        unit: l.unit as UnitId,
        uncertainty: u === null ? null : { kind: "expanded", value: u, k: 2 },
        method: r.method,
      };
    });
}

export const judgeForLot = (lot: Pick<LotDetail, "contract" | "vintage" | "market" | "governing">): Judge =>
  judgeFor({
    wine: lot.contract.wine,
    lot: { vintage: lot.vintage, market: lot.market },
    requirements: lot.governing?.requirements ?? null,
  });

/** The judgement, with the results as read for it: the form shows parse errors and plausibility from the same reading. */
export function previewJudgement(
  judge: Judge,
  stage: AnalysisStage,
  results: readonly ResultEntry[],
): Judgement & { read: readonly ReadResult[] } {
  const read = results.map((r) => readResult(r));
  return { ...judgeAnalysis(judge, stage, read), read };
}
