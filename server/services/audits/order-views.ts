/** Audit orders as the API shows them; payment details only to the buyer who paid. */
import { Op, type WhereOptions } from "sequelize";
import { afterCursor, orderBy, sqlTime, toPage, type SortKey } from "../../db/keyset.ts";
import { AuditOrder } from "../../models/audit-order.ts";
import { AuditOrderLot } from "../../models/audit-order-lot.ts";
import { AuditPayment } from "../../models/audit-payment.ts";
import { Organisation } from "../../models/organisation.ts";
import { User } from "../../models/user.ts";
import { Lot } from "../../models/lot.ts";
import { Deviation } from "../../models/deviation.ts";
import { AnalysisEvaluation } from "../../models/analysis-evaluation.ts";
import { Certificate } from "../../models/certificate.ts";
import { Contract } from "../../models/contract.ts";
import { contractInclude, type ContractWithParties } from "../specs/spec-access.ts";
import { orderReference } from "../../../shared/audits/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import { governingVersion } from "../lots/governing.ts";
import type { AuditOrderDetail, AuditOrderSummary } from "../../../shared/audits/views.ts";
import type { StoredVerdict } from "../../../shared/lots/views.ts";
import type { Role } from "../../../shared/auth/roles.ts";
import type { OrderSide } from "./order-access.ts";
import { can } from "../../../shared/auth/permissions.ts";

type Loaded = AuditOrder & {
  lots: (AuditOrderLot & { lot: Lot })[];
  laboratory: Organisation;
  orderer: User;
  contract: ContractWithParties;
};

export const orderInclude = [
  { model: AuditOrderLot, as: "lots", include: [{ model: Lot, as: "lot" }] },
  { model: Organisation, as: "laboratory" },
  { model: User, as: "orderer", attributes: ["id", "name", "email"] },
  { model: Contract, as: "contract", include: contractInclude },
];

/** Amounts are the paying buyer's business: others see zeros. */
export function summaryOf(o: Loaded, forBuyer: boolean): AuditOrderSummary {
  return {
    id: o.id,
    reference: orderReference(o.id),
    status: o.status,
    contractId: o.contractId,
    wineName: o.contract.wine.name,
    buyerName: o.contract.retailer.name,
    producerName: o.contract.producer.name,
    laboratoryName: o.laboratory.name,
    lotCodes: o.lots.map((l) => l.lot.lotCode),
    parameters: o.parameters,
    amountCents: forBuyer ? o.amountCents : 0,
    paidCents: forBuyer ? o.paidCents : 0,
    refundedCents: forBuyer ? o.refundedCents : 0,
    currency: o.currency,
    orderedBy: o.orderer.name,
    createdAt: o.createdAt.toISOString(),
    paidAt: o.paidAt ? o.paidAt.toISOString() : null,
    resultsSubmittedAt: o.resultsSubmittedAt ? o.resultsSubmittedAt.toISOString() : null,
  };
}

// By column: Sequelize orders a timestamp attribute by its select alias, which no index serves.
const NEWEST_FIRST: SortKey[] = [
  { attribute: "createdAt", sql: "`AuditOrder`.`created_at`", direction: "DESC" },
  { attribute: "id", sql: "`AuditOrder`.`id`", direction: "DESC" },
];

/** A page of orders, newest first: the page's ids by keyset, then those orders with their lots and parties. */
export async function pageOrders(where: WhereOptions, limit: number, cursor: string | undefined, forBuyer: (o: Loaded) => boolean) {
  const [keys, total] = await Promise.all([
    AuditOrder.findAll({
      where: { [Op.and]: [where, afterCursor(NEWEST_FIRST, cursor)] },
      attributes: ["id", "createdAt"],
      order: orderBy(NEWEST_FIRST),
      limit: limit + 1,
    }),
    AuditOrder.count({ where }),
  ]);
  return toPage(
    keys,
    limit,
    (o) => [sqlTime(o.createdAt), o.id],
    async (shown) => {
      const full = new Map(
        ((await AuditOrder.findAll({ where: { id: shown.map((o) => o.id) }, include: orderInclude })) as Loaded[]).map((o) => [o.id, o]),
      );
      return shown.map((k) => summaryOf(full.get(k.id)!, forBuyer(full.get(k.id)!)));
    },
    total,
  );
}

export async function detailOf(id: number, side: OrderSide, role: Role): Promise<AuditOrderDetail> {
  const o = (await AuditOrder.findByPk(id, { include: orderInclude })) as Loaded;
  const payments =
    side === "buyer"
      ? await AuditPayment.findAll({
          where: { auditOrderId: id },
          order: [
            ["createdAt", "ASC"],
            ["id", "ASC"],
          ],
        })
      : [];
  const analysisIds = o.lots.map((l) => l.analysisId).filter((x): x is number => x !== null);
  const evaluations = new Map(
    (await AnalysisEvaluation.findAll({ where: { analysisId: { [Op.in]: analysisIds.length ? analysisIds : [0] } } })).map((e) => [
      e.analysisId,
      e.verdicts as StoredVerdict[],
    ]),
  );
  const deviations = await Deviation.findAll({ where: { auditOrderId: id }, attributes: ["id"] });
  // The laboratory's signed reports, attached to its own analyses.
  const reports = await Certificate.findAll({
    where: { analysisId: { [Op.in]: analysisIds.length ? analysisIds : [0] } },
    attributes: ["id", "analysisId", "originalName"],
    order: [["id", "ASC"]],
  });
  // Results are asked for in the units the spec sheet speaks, the way both parties read them.
  const governing = o.lots[0] ? await governingVersion(o.contractId, o.lots[0].lot.vintage) : null;
  const specUnits = Object.fromEntries(
    (governing?.requirements ?? []).filter((r) => o.parameters.includes(r.parameter)).map((r) => [r.parameter, r.unit]),
  );
  // The laboratory works blind: the producer's declared values stay hidden from it.
  const showComparisons = side !== "laboratory";
  return {
    ...summaryOf(o, side === "buyer"),
    stage: o.stage,
    note: o.note,
    lines: side === "buyer" ? o.lines : [],
    payments: payments.map((p) => ({
      kind: p.kind,
      amountCents: p.amountCents,
      stripeRef: p.stripeRef,
      detail: p.detail,
      at: p.createdAt.toISOString(),
    })),
    lots: o.lots.map((l) => ({
      lotId: l.lotId,
      lotCode: l.lot.lotCode,
      vintage: l.lot.vintage,
      analysisId: l.analysisId,
      declaredAnalysisId: showComparisons ? l.declaredAnalysisId : null,
      comparisons: showComparisons ? (l.comparisons ?? []) : [],
      verdicts: l.analysisId ? (evaluations.get(l.analysisId) ?? []) : [],
      reports: reports.filter((r) => r.analysisId === l.analysisId).map((r) => ({ id: r.id, originalName: r.originalName })),
    })),
    deviationIds: deviations.map((d) => d.id),
    reportReference: o.reportReference,
    units: Object.fromEntries(o.parameters.map((p) => [p, specUnits[p] ?? findParameter(p)?.unit ?? ""])),
    actions: {
      pay: side === "buyer" && can(role, "audits.order") && (o.status === "awaiting_payment" || o.status === "payment_failed"),
      refund: side === "buyer" && can(role, "audits.order") && o.status === "paid",
      submitResults: side === "laboratory" && can(role, "audits.report") && o.status === "paid",
    },
  };
}
