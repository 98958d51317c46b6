/**
 * The independent laboratory's results for a paid audit: stored and judged against the spec like any
 * analysis, then compared with what the producer declared (En and z, the laboratory as reference).
 * A discrepancy, like a failing result, opens a deviation that names the audit.
 */
import { Op, type Transaction } from "sequelize";
import { orderPath } from "../../../shared/paths.ts";
import { type AuditOrder } from "../../models/audit-order.ts";
import { AuditOrderLot } from "../../models/audit-order-lot.ts";
import { Analysis } from "../../models/analysis.ts";
import { AnalysisResult } from "../../models/analysis-result.ts";
import { Lot } from "../../models/lot.ts";
import { Organisation } from "../../models/organisation.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { idempotent } from "../idempotency.ts";
import { notify, usersWithRoles } from "../notification-service.ts";
import { conflict, notFound, validationFailed, type FieldError } from "../../errors.ts";
import { contractFor } from "../specs/spec-access.ts";
import { storeAnalyses } from "../lots/store-analyses.ts";
import { openDeviations } from "../deviations/open-deviations.ts";
import { orderFor } from "./order-access.ts";
import {
  compareWithReference,
  findParameter,
  parseReading,
  type ParameterId,
  type ResultComparison,
  type UnitId,
} from "../../../shared/engine/index.ts";
import { orderReference, orderStatus } from "../../../shared/audits/vocabulary.ts";
import type { LabResultsInput } from "../../../shared/audits/schemas.ts";
import type { AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import type { ResultEntry } from "../../../shared/lots/schemas.ts";
import type { SessionUser } from "../session-service.ts";

type WithResults = Analysis & { results: AnalysisResult[] };

/** The producer's own analysis to compare with: its latest at the audited stage, else its latest at all. */
async function declaredAnalysis(t: Transaction, lotId: number, stage: AnalysisStage): Promise<WithResults | null> {
  const stages = stage === "pre_filling" ? ["pre_filling", "retest"] : [stage];
  const find = (where: object) =>
    Analysis.findOne({
      where: { lotId, auditOrderId: null, ...where },
      include: [{ model: AnalysisResult, as: "results" }],
      order: [
        ["sampleDate", "DESC"],
        ["id", "DESC"],
      ],
      transaction: t,
    }) as Promise<WithResults | null>;
  return (await find({ stage: { [Op.in]: stages } })) ?? (await find({}));
}

function compareLot(declared: WithResults | null, results: ResultEntry[]): ResultComparison[] {
  return results.map((r) => {
    const mine = declared?.results.find((d) => d.parameter === r.parameter);
    const parsed = parseReading(r.raw, { presence: findParameter(r.parameter)?.kind === "presence" });
    const independent = {
      reading: parsed.ok ? parsed.reading : ({ kind: "below", limit: null } as const),
      unit: r.unit as UnitId,
      uncertainty: r.uncertainty ?? null,
    };
    return compareWithReference(
      r.parameter as ParameterId,
      mine ? { reading: mine.reading, unit: mine.unit as UnitId, uncertainty: mine.uncertainty } : null,
      independent,
    );
  });
}

function checkCoverage(order: AuditOrder, lotIds: number[], input: LabResultsInput): FieldError[] {
  const errors: FieldError[] = [];
  const ordered = new Set(lotIds);
  input.lots.forEach((l, i) => {
    if (!ordered.has(l.lotId)) errors.push({ path: `lots.${i}.lotId`, message: "This lot is not part of the order." });
    const given = new Set(l.results.map((r) => r.parameter));
    l.results.forEach((r, j) => {
      if (!order.parameters.includes(r.parameter))
        errors.push({
          path: `lots.${i}.results.${j}.parameter`,
          message: `${findParameter(r.parameter)?.name ?? r.parameter} was not ordered.`,
        });
    });
    const missing = order.parameters.filter((p) => !given.has(p));
    if (missing.length)
      errors.push({ path: `lots.${i}.results`, message: `Missing ${missing.map((p) => findParameter(p)?.name ?? p).join(", ")}.` });
  });
  const sent = new Set(input.lots.map((l) => l.lotId));
  if (sent.size !== input.lots.length) errors.push({ path: "lots", message: "A lot appears twice." });
  for (const id of lotIds) if (!sent.has(id)) errors.push({ path: "lots", message: "Every lot of the order needs its results." });
  return errors;
}

export async function submitLabResults(labOrgId: number, orderId: number, user: SessionUser, input: LabResultsInput) {
  const { idempotencyKey, ...body } = input;
  return idempotent(labOrgId, idempotencyKey, { orderId, ...body }, async (t) => {
    const { order, side } = await orderFor(labOrgId, orderId, t, true);
    if (side !== "laboratory") throw notFound("The audit order");
    if (order.status !== "paid")
      throw conflict(order.resultsSubmittedAt ? "Results for this order are already in." : "This order is not awaiting results.");
    const orderLots = await AuditOrderLot.findAll({
      where: { auditOrderId: order.id },
      include: [{ model: Lot, as: "lot" }],
      transaction: t,
    });
    const errors = checkCoverage(
      order,
      orderLots.map((l) => l.lotId),
      input,
    );
    if (errors.length) throw validationFailed(errors);

    const lab = (await Organisation.findByPk(labOrgId, { transaction: t }))!;
    const { contract } = await contractFor(order.buyerOrgId, order.contractId, t);
    const byLot = new Map(orderLots.map((l) => [l.lotId, l as AuditOrderLot & { lot: Lot }]));
    const stored = await storeAnalyses(
      t,
      contract,
      user.id,
      {
        stage: order.stage,
        laboratoryName: lab.name,
        accreditation: body.accreditation ?? null,
        auditOrderId: order.id,
        actingOrgId: labOrgId,
      },
      body.lots.map((l) => ({ lot: byLot.get(l.lotId)!.lot, sampleDate: body.sampleDate, results: l.results })),
    );

    const discrepancies = [];
    for (const [i, l] of body.lots.entries()) {
      const row = byLot.get(l.lotId)!;
      const declared = await declaredAnalysis(t, l.lotId, order.stage);
      const comparisons = compareLot(declared, l.results);
      await row.update({ analysisId: stored.analysisIds[i]!, declaredAnalysisId: declared?.id ?? null, comparisons }, { transaction: t });
      const off = comparisons.filter((c) => c.outcome === "discrepant");
      if (off.length) {
        discrepancies.push({
          lotId: l.lotId,
          analysisId: stored.analysisIds[i]!,
          kind: "audit" as const,
          parameters: off.map((c) => c.parameter),
          summary: `Lot ${row.lot.lotCode}: ${lab.name} disagrees with the declared results for ${off.map((c) => `${findParameter(c.parameter)?.name ?? c.parameter} (En = ${c.en?.toFixed(2)}${c.z !== null ? `, z = ${c.z.toFixed(2)}` : ""})`).join(", ")} (audit ${orderReference(order.id)}).`,
          auditOrderId: order.id,
        });
      }
    }
    const discrepancyIds = await openDeviations(t, contract, { userId: user.id, organisationId: labOrgId }, discrepancies);

    const submittedAt = new Date();
    await order.update(
      {
        resultsSubmittedAt: submittedAt,
        reportReference: body.reportReference ?? null,
        status: orderStatus({ ...order.get(), resultsSubmittedAt: submittedAt }),
      },
      { transaction: t },
    );
    const deviationIds = [...stored.deviationIds, ...discrepancyIds];
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: labOrgId,
      action: "audit_order.results_submitted",
      entityType: "audit_order",
      entityId: order.id,
      after: body,
      details: {
        reference: orderReference(order.id),
        lots: body.lots.length,
        failing: stored.failing.map((f) => f.parameters).flat(),
        discrepancies: discrepancies.flatMap((d) => d.parameters),
        deviations: deviationIds,
      },
    });
    const readers = await usersWithRoles(
      [order.buyerOrgId, order.producerOrgId],
      ["buyer_technologist", "buyer_finance", "producer_quality"],
      t,
    );
    await notify(t, readers, {
      kind: "audit",
      title: `Independent results in for ${orderReference(order.id)}: ${contract.wine.name}`,
      body:
        discrepancies.length || stored.failing.length
          ? `${discrepancies.length} lot(s) disagree with the declared results; ${stored.failing.length} lot(s) fail the spec.`
          : "The independent results agree with the declared ones and meet the spec.",
      link: orderPath(order.id),
    });
    return {
      analysisIds: stored.analysisIds,
      failing: stored.failing,
      discrepancies: discrepancies.map((d) => ({ lotId: d.lotId, parameters: d.parameters })),
      deviationIds,
    };
  });
}
