/**
 * A recorded re-judgement: when a later spec version governs a lot, or the wine's facts for the law
 * have changed, someone on either side may have an analysis judged again. The results are copied into a new analysis that names
 * the one it re-judges; the first analysis and its stored evaluation stay exactly as they were,
 * so the first verdict remains reproducible. Nothing is ever re-judged without this request.
 */
import { inTransaction } from "../../db/database.ts";
import { Analysis } from "../../models/analysis.ts";
import { AnalysisResult } from "../../models/analysis-result.ts";
import { AnalysisEvaluation } from "../../models/analysis-evaluation.ts";
import { conflict, notFound } from "../../errors.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { lotFor } from "./lot-access.ts";
import { governingVersion } from "./governing.ts";
import { storeAnalyses } from "./store-analyses.ts";
import { profileDiffers, wineProfile } from "../../../shared/specs/profile.ts";
import type { SubmissionResult } from "../../../shared/lots/views.ts";
import type { ReportedUncertainty } from "../../../shared/engine/index.ts";
import type { SessionUser } from "../session-service.ts";

export async function rejudgeAnalysis(orgId: number, lotId: number, analysisId: number, user: SessionUser): Promise<SubmissionResult> {
  return inTransaction(async (t) => {
    const { lot, contract } = await lotFor(orgId, lotId, t);
    const analysis = (await Analysis.findOne({
      where: { id: analysisId, lotId },
      // Results in their own query, so the evaluation's verdicts are not copied into every result row.
      include: [
        { model: AnalysisResult, as: "results", separate: true, order: [["id", "ASC"]] },
        { model: AnalysisEvaluation, as: "evaluation" },
      ],
      transaction: t,
    })) as (Analysis & { results: AnalysisResult[]; evaluation: AnalysisEvaluation | null }) | null;
    if (!analysis || analysis.auditOrderId !== null) throw notFound("The analysis");
    const governing = await governingVersion(contract.id, lot.vintage, t);
    if (!governing) throw conflict(`No agreed specification covers vintage ${lot.vintage}, so there is nothing to judge against.`);
    const sameFacts = !profileDiffers(analysis.evaluation?.profile ?? null, wineProfile(contract.wine, lot.vintage));
    if (analysis.evaluation?.specVersionId === governing.version.id && sameFacts) {
      throw conflict(
        `This analysis was already judged against version ${governing.version.number}, the version in force, with the wine's facts as they stand.`,
      );
    }
    if (await Analysis.count({ where: { rejudgedFromId: analysis.id }, transaction: t }))
      throw conflict("This analysis has already been re-judged; see the re-judgement on the lot.");
    const results = analysis.results.map((r) => ({
      parameter: r.parameter,
      raw: r.rawText,
      unit: r.unit,
      uncertainty: (r.uncertainty as ReportedUncertainty | null) ?? null,
      method: r.method,
    }));
    const stored = await storeAnalyses(
      t,
      contract,
      user.id,
      {
        stage: analysis.stage,
        laboratoryName: analysis.laboratoryName,
        accreditation: analysis.accreditation,
        actingOrgId: orgId,
        rejudgedFromId: analysis.id,
        numberFormat: analysis.numberFormat ?? null,
      },
      [{ lot, sampleDate: analysis.sampleDate, results }],
    );
    const id = stored.analysisIds[0]!;
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: orgId,
      action: "analysis.rejudged",
      entityType: "lot",
      entityId: lot.id,
      details: {
        lotCode: lot.lotCode,
        rejudged: analysis.id,
        analysis: id,
        fromVersion: analysis.evaluation?.specVersionId ?? null,
        version: governing.version.number,
        factsChanged: !sameFacts,
        failing: stored.failing[0]?.parameters ?? [],
      },
    });
    return {
      analysisId: id,
      counts: stored.samples[0]!.counts,
      failing: stored.failing[0]?.parameters ?? [],
      deviationIds: stored.deviationIds,
    };
  });
}
