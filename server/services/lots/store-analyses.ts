/**
 * Stores analyses with their results and the engine's stored evaluation, opens deviations for
 * failing results and for transit drift, all inside the caller's transaction (never half-written).
 */
import { Op, type Transaction } from "sequelize";
import { insertReturningIds, insertRows } from "../../db/bulk-insert.ts";
import { sqlTime } from "../../db/keyset.ts";
import { compareTransit, findParameter } from "../../../shared/engine/index.ts";
import {
  judgeAnalysis,
  judgeFor,
  readResult,
  transitValues,
  type Judge,
  type OutcomeCounts,
  type ReadResult,
} from "../../../shared/lots/judge.ts";
import { ANALYSIS_STAGE_LABELS, isBulk, type AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import type { ResultEntry } from "../../../shared/lots/schemas.ts";
import { Analysis } from "../../models/analysis.ts";
import { AnalysisResult } from "../../models/analysis-result.ts";
import { type Lot } from "../../models/lot.ts";
import { openDeviations, type NewDeviation } from "../deviations/open-deviations.ts";
import type { ContractWithParties } from "../specs/spec-access.ts";
import { governingVersion } from "./governing.ts";

export interface AnalysisHeader {
  stage: AnalysisStage;
  laboratoryName: string;
  accreditation?: string | null;
  /** Set for an independent laboratory's results on a paid audit: stored and evaluated alike, opened deviations link the audit. */
  auditOrderId?: number | null;
  /** The organisation acting, for the trail; the producer unless a laboratory submits. */
  actingOrgId?: number;
  /** Set when the results are those of an earlier analysis, judged again against the version now in force. */
  rejudgedFromId?: number | null;
  /** How the laboratory writes numbers; kept with the analysis so its text always reads the same. */
  numberFormat?: "point" | "comma" | null;
}

/** What storing needs of a lot: a model instance or a row just inserted. */
export type StoredLot = Pick<Lot, "id" | "vintage" | "market" | "lotCode" | "container">;

export interface SampleToStore {
  lot: StoredLot;
  sampleDate: string;
  results: ResultEntry[];
}

export interface StoredSummary {
  analysisIds: number[];
  /** What was stored for each sample, counted by outcome, in the order given. */
  samples: { analysisId: number; lotCode: string; counts: OutcomeCounts }[];
  failing: { analysisId: number; lotCode: string; parameters: string[] }[];
  deviationIds: number[];
}

const ANALYSIS_COLUMNS = [
  "lot_id",
  "stage",
  "laboratory_name",
  "accreditation",
  "sample_date",
  "spec_version_id",
  "submitted_by",
  "audit_order_id",
  "rejudged_from_id",
  "number_format",
  "created_at",
  "updated_at",
];
const RESULT_COLUMNS = ["analysis_id", "parameter", "raw_text", "reading", "unit", "uncertainty", "method"];
const EVALUATION_COLUMNS = [
  "analysis_id",
  "spec_version_id",
  "engine_version",
  "market_versions",
  "worst_outcome",
  "verdicts",
  "profile",
  "created_at",
];

/** A statement left running while other work goes on: its failure is kept for the await, never reported as unhandled. */
function whileWorking<T>(statement: Promise<T>): Promise<T> {
  statement.catch(() => undefined);
  return statement;
}

export async function storeAnalyses(
  t: Transaction,
  contract: ContractWithParties,
  userId: number,
  header: AnalysisHeader,
  samples: SampleToStore[],
): Promise<StoredSummary> {
  const governingCache = new Map<number, Awaited<ReturnType<typeof governingVersion>>>();
  const governing = async (vintage: number) => {
    if (!governingCache.has(vintage)) governingCache.set(vintage, await governingVersion(contract.id, vintage, t));
    return governingCache.get(vintage)!;
  };
  for (const s of samples) await governing(s.lot.vintage);
  // The connection runs its statements in order, so each insert is sent and the next piece of work
  // done while the server stores it; a failed insert still fails the transaction where it is awaited.
  const now = sqlTime(new Date());
  const insertingAnalyses = whileWorking(
    insertReturningIds(
      t,
      "analyses",
      ANALYSIS_COLUMNS,
      samples.map((s) => [
        s.lot.id,
        header.stage,
        header.laboratoryName,
        header.accreditation ?? null,
        s.sampleDate,
        governingCache.get(s.lot.vintage)?.version.id ?? null,
        userId,
        header.auditOrderId ?? null,
        header.rejudgedFromId ?? null,
        header.numberFormat ?? null,
        now,
        now,
      ]),
    ),
  );
  // Each result is read once: the stored reading and the verdict come from the same parse.
  const read: ReadResult[][] = samples.map((s) => s.results.map((r) => readResult(r, header.numberFormat)));
  const analysisIds = await insertingAnalyses;
  const insertingResults = whileWorking(
    insertRows(
      t,
      "analysis_results",
      RESULT_COLUMNS,
      samples.flatMap((s, i) =>
        s.results.map((r, j) => [
          analysisIds[i],
          r.parameter,
          r.raw,
          // The schema refuses unreadable text before this point; "not detected" is the safe reading if one slips through.
          JSON.stringify(read[i]![j]!.reading ?? { kind: "below", limit: null }),
          r.unit,
          r.uncertainty ? JSON.stringify(r.uncertainty) : null,
          r.method ?? null,
        ]),
      ),
    ),
  );

  const summary: StoredSummary = { analysisIds: analysisIds, samples: [], failing: [], deviationIds: [] };
  const judges = new Map<string, Judge>();
  const judgeOf = (lot: StoredLot) => {
    const key = `${lot.vintage}|${lot.market}`;
    if (!judges.has(key))
      judges.set(key, judgeFor({ wine: contract.wine, lot, requirements: governingCache.get(lot.vintage)?.requirements ?? null }));
    return judges.get(key)!;
  };
  const evaluations = samples.map((s, i) => {
    const g = governingCache.get(s.lot.vintage);
    const e = judgeAnalysis(judgeOf(s.lot), header.stage, read[i]!, { onlyReported: !!header.auditOrderId });
    summary.samples.push({ analysisId: analysisIds[i]!, lotCode: s.lot.lotCode, counts: e.counts });
    if (e.failing.length) summary.failing.push({ analysisId: analysisIds[i]!, lotCode: s.lot.lotCode, parameters: e.failing });
    return {
      analysisId: analysisIds[i]!,
      specVersionId: g?.version.id ?? null,
      engineVersion: e.engineVersion,
      marketVersions: e.marketVersions,
      worstOutcome: e.worst,
      verdicts: e.verdicts,
      profile: judgeOf(s.lot).profile,
    };
  });
  await insertingResults;
  await insertRows(
    t,
    "analysis_evaluations",
    EVALUATION_COLUMNS,
    evaluations.map((e) => [
      e.analysisId,
      e.specVersionId,
      e.engineVersion,
      JSON.stringify(e.marketVersions),
      e.worstOutcome,
      JSON.stringify(e.verdicts),
      JSON.stringify(e.profile),
      now,
    ]),
  );

  const lotOf = new Map(samples.map((s, i) => [analysisIds[i]!, s.lot]));
  const deviations: NewDeviation[] = summary.failing.map((f) => ({
    lotId: lotOf.get(f.analysisId)!.id,
    analysisId: f.analysisId,
    kind: "result" as const,
    parameters: f.parameters,
    summary: `Lot ${f.lotCode}: ${f.parameters.map((p) => findParameter(p)?.name ?? p).join(", ")} outside the agreed specification in the ${ANALYSIS_STAGE_LABELS[header.stage].toLowerCase()} analysis${header.auditOrderId ? ", by the independent laboratory" : ""}.`,
    auditOrderId: header.auditOrderId ?? null,
  }));
  if (header.stage === "on_arrival") deviations.push(...(await transitDeviations(t, samples, analysisIds, read)));
  summary.deviationIds = await openDeviations(
    t,
    contract,
    { userId, organisationId: header.actingOrgId ?? contract.producerOrgId },
    deviations,
  );
  return summary;
}

async function transitDeviations(
  t: Transaction,
  samples: SampleToStore[],
  analysisIds: number[],
  read: ReadResult[][],
): Promise<NewDeviation[]> {
  const bulk = samples.map((s, i) => ({ s, analysisId: analysisIds[i]!, arrival: read[i]! })).filter((x) => isBulk(x.s.lot.container));
  if (!bulk.length) return [];
  const before = await Analysis.findAll({
    where: { lotId: bulk.map((b) => b.s.lot.id), stage: "pre_shipment", id: { [Op.notIn]: analysisIds } },
    include: [{ model: AnalysisResult, as: "results" }],
    order: [
      ["sampleDate", "DESC"],
      ["id", "DESC"],
    ],
    transaction: t,
  });
  // Newest first, so the first analysis kept per lot is its latest before shipment.
  const latestBefore = new Map<number, Analysis & { results: AnalysisResult[] }>();
  for (const a of before) if (!latestBefore.has(a.lotId)) latestBefore.set(a.lotId, a as Analysis & { results: AnalysisResult[] });
  const found: NewDeviation[] = [];
  for (const { s, analysisId, arrival } of bulk) {
    const pre = latestBefore.get(s.lot.id);
    if (!pre) continue;
    const exceeded = compareTransit(transitValues(pre.results), transitValues(arrival)).filter((f) => f.exceeded);
    if (exceeded.length) {
      found.push({
        lotId: s.lot.id,
        analysisId,
        kind: "transit" as const,
        parameters: exceeded.map((f) => f.parameter),
        summary: `Lot ${s.lot.lotCode} changed in transit: ${exceeded.map((f) => f.message).join(" ")}`,
      });
    }
  }
  return found;
}
