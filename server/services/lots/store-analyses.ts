/**
 * Stores analyses with their results and the engine's stored evaluation, opens deviations for
 * failing results and for transit drift, all inside the caller's transaction (never half-written).
 */
import { Op, type Transaction } from "sequelize";
import { database } from "../../db/database.ts";
import { insertInChunks } from "../../db/chunked-insert.ts";
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

export interface SampleToStore {
  lot: Lot;
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
  // Each result is read once: the stored reading and the verdict come from the same parse.
  const read: ReadResult[][] = samples.map((s) => s.results.map((r) => readResult(r, header.numberFormat)));

  const analyses = await Analysis.bulkCreate(
    samples.map((s) => ({
      lotId: s.lot.id,
      stage: header.stage,
      laboratoryName: header.laboratoryName,
      accreditation: header.accreditation ?? null,
      sampleDate: s.sampleDate,
      specVersionId: governingCache.get(s.lot.vintage)?.version.id ?? null,
      submittedBy: userId,
      auditOrderId: header.auditOrderId ?? null,
      rejudgedFromId: header.rejudgedFromId ?? null,
      numberFormat: header.numberFormat ?? null,
    })),
    { transaction: t },
  );
  // Raw multi-row inserts: building a model instance per result costs more than the insert itself.
  const qi = database().getQueryInterface();
  await insertInChunks(
    qi,
    t,
    "analysis_results",
    samples.flatMap((s, i) =>
      s.results.map((r, j) => ({
        analysis_id: analyses[i]!.id,
        parameter: r.parameter,
        raw_text: r.raw,
        // The schema refuses unreadable text before this point; "not detected" is the safe reading if one slips through.
        reading: JSON.stringify(read[i]![j]!.reading ?? { kind: "below", limit: null }),
        unit: r.unit,
        uncertainty: r.uncertainty ? JSON.stringify(r.uncertainty) : null,
        method: r.method ?? null,
      })),
    ),
  );

  const summary: StoredSummary = { analysisIds: analyses.map((a) => a.id), samples: [], failing: [], deviationIds: [] };
  const judges = new Map<string, Judge>();
  const judgeOf = (lot: Lot) => {
    const key = `${lot.vintage}|${lot.market}`;
    if (!judges.has(key))
      judges.set(key, judgeFor({ wine: contract.wine, lot, requirements: governingCache.get(lot.vintage)?.requirements ?? null }));
    return judges.get(key)!;
  };
  const evaluations = samples.map((s, i) => {
    const g = governingCache.get(s.lot.vintage);
    const e = judgeAnalysis(judgeOf(s.lot), header.stage, read[i]!, { onlyReported: !!header.auditOrderId });
    summary.samples.push({ analysisId: analyses[i]!.id, lotCode: s.lot.lotCode, counts: e.counts });
    if (e.failing.length) summary.failing.push({ analysisId: analyses[i]!.id, lotCode: s.lot.lotCode, parameters: e.failing });
    return {
      analysisId: analyses[i]!.id,
      specVersionId: g?.version.id ?? null,
      engineVersion: e.engineVersion,
      marketVersions: e.marketVersions,
      worstOutcome: e.worst,
      verdicts: e.verdicts,
      profile: judgeOf(s.lot).profile,
    };
  });
  const now = new Date();
  await insertInChunks(
    qi,
    t,
    "analysis_evaluations",
    evaluations.map((e) => ({
      analysis_id: e.analysisId,
      spec_version_id: e.specVersionId,
      engine_version: e.engineVersion,
      market_versions: JSON.stringify(e.marketVersions),
      worst_outcome: e.worstOutcome,
      verdicts: JSON.stringify(e.verdicts),
      profile: JSON.stringify(e.profile),
      created_at: now,
    })),
  );

  const lotOf = new Map(samples.map((s, i) => [analyses[i]!.id, s.lot]));
  const deviations: NewDeviation[] = summary.failing.map((f) => ({
    lotId: lotOf.get(f.analysisId)!.id,
    analysisId: f.analysisId,
    kind: "result" as const,
    parameters: f.parameters,
    summary: `Lot ${f.lotCode}: ${f.parameters.map((p) => findParameter(p)?.name ?? p).join(", ")} outside the agreed specification in the ${ANALYSIS_STAGE_LABELS[header.stage].toLowerCase()} analysis${header.auditOrderId ? ", by the independent laboratory" : ""}.`,
    auditOrderId: header.auditOrderId ?? null,
  }));
  if (header.stage === "on_arrival") deviations.push(...(await transitDeviations(t, samples, analyses, read)));
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
  analyses: Analysis[],
  read: ReadResult[][],
): Promise<NewDeviation[]> {
  const bulk = samples.map((s, i) => ({ s, analysis: analyses[i]!, arrival: read[i]! })).filter((x) => isBulk(x.s.lot.container));
  if (!bulk.length) return [];
  const before = await Analysis.findAll({
    where: { lotId: bulk.map((b) => b.s.lot.id), stage: "pre_shipment", id: { [Op.notIn]: analyses.map((a) => a.id) } },
    include: [{ model: AnalysisResult, as: "results" }],
    order: [
      ["sampleDate", "DESC"],
      ["id", "DESC"],
    ],
    transaction: t,
  });
  const found: NewDeviation[] = [];
  for (const { s, analysis, arrival } of bulk) {
    const pre = before.find((a) => a.lotId === s.lot.id) as (Analysis & { results: AnalysisResult[] }) | undefined;
    if (!pre) continue;
    const exceeded = compareTransit(transitValues(pre.results), transitValues(arrival)).filter((f) => f.exceeded);
    if (exceeded.length) {
      found.push({
        lotId: s.lot.id,
        analysisId: analysis.id,
        kind: "transit" as const,
        parameters: exceeded.map((f) => f.parameter),
        summary: `Lot ${s.lot.lotCode} changed in transit: ${exceeded.map((f) => f.message).join(" ")}`,
      });
    }
  }
  return found;
}
