/** Reading deviations: the list with filters, one deviation with its thread, and an attachment. */
import { Op, type WhereOptions } from "sequelize";
import { afterCursor, orderBy, sqlTime, toPage, type SortKey } from "../../db/keyset.ts";
import type { Page } from "../../../shared/paging.ts";
import type { DeviationListQuery } from "../../../shared/deviations/schemas.ts";
import { Deviation } from "../../models/deviation.ts";
import { DeviationAttachment } from "../../models/deviation-attachment.ts";
import { DeviationMessage } from "../../models/deviation-message.ts";
import { DeviationMessageEdit } from "../../models/deviation-message-edit.ts";
import { Lot } from "../../models/lot.ts";
import { AnalysisEvaluation } from "../../models/analysis-evaluation.ts";
import { User } from "../../models/user.ts";
import { notFound } from "../../errors.ts";
import type { ContractWithParties } from "../specs/spec-access.ts";
import { partyContracts } from "../specs/party-contracts.ts";
import { AuditOrder } from "../../models/audit-order.ts";
import { readStoredFile } from "../../integrations/storage/stored-files.ts";
import type { DeviationDetail, DeviationSummaryView, MessageView } from "../../../shared/deviations/views.ts";
import type { StoredVerdict } from "../../../shared/lots/views.ts";
import type { SessionUser, SessionMembership } from "../session-service.ts";
import { CLOSED, deviationFor, isOverdue, participants } from "./deviation-access.ts";
import { can } from "../../../shared/auth/permissions.ts";
import type { OrganisationKind } from "../../../shared/auth/roles.ts";

function summaryView(d: Deviation, lot: Lot, c: ContractWithParties): DeviationSummaryView {
  return {
    id: d.id,
    kind: d.kind,
    status: d.status,
    parameters: d.parameters,
    summary: d.summary,
    lotId: lot.id,
    lotCode: lot.lotCode,
    vintage: lot.vintage,
    contractId: c.id,
    contractReference: c.reference,
    wineName: c.wine.name,
    producerName: c.producer.name,
    respondBy: d.respondBy ? d.respondBy.toISOString() : null,
    overdue: isOverdue(d),
    outcome: d.decision?.outcome ?? null,
    createdAt: d.createdAt.toISOString(),
    updatedAt: d.updatedAt.toISOString(),
  };
}

// By column, not attribute: Sequelize orders a timestamp attribute by its select alias, which no index serves.
const NEWEST_FIRST: SortKey[] = [
  { attribute: "createdAt", sql: "`Deviation`.`created_at`", direction: "DESC" },
  { attribute: "id", sql: "`Deviation`.`id`", direction: "DESC" },
];

/** Overdue: still open and past its respond-by date (as `isOverdue` says), written in SQL so the filter pages. */
const overdueWhere = (overdue: boolean, now: Date): WhereOptions<Deviation> =>
  overdue
    ? { status: { [Op.notIn]: CLOSED }, respondBy: { [Op.lt]: now } }
    : { [Op.or]: [{ status: CLOSED }, { respondBy: null }, { respondBy: { [Op.gte]: now } }] };

/** A page of the deviations the organisation may see, newest first: its contracts' and, for a laboratory, its audits'. */
export async function listDeviations(orgId: number, f: DeviationListQuery, kind: OrganisationKind): Promise<Page<DeviationSummaryView>> {
  // Only a laboratory reads deviations through its audits; the others skip that lookup.
  const labOrders =
    kind === "laboratory" ? await AuditOrder.findAll({ where: { laboratoryOrgId: orgId }, attributes: ["id", "contractId"] }) : [];
  const contracts = await partyContracts(
    orgId,
    labOrders.map((o) => o.contractId),
  );
  const byId = new Map(contracts.map((c) => [c.id, c]));
  const own = contracts.filter((c) => c.retailerOrgId === orgId || c.producerOrgId === orgId).map((c) => c.id);
  const ids = f.contract ? [f.contract].filter((id) => own.includes(id)) : own;
  const labWhere = labOrders.length
    ? [{ auditOrderId: labOrders.map((o) => o.id), ...(f.contract ? { contractId: f.contract } : {}) }]
    : [];
  const filter: WhereOptions<Deviation> = {
    [Op.and]: [
      { [Op.or]: [{ contractId: ids }, ...labWhere] },
      f.status ? { status: f.status } : {},
      f.lot ? { lotId: f.lot } : {},
      f.overdue ? overdueWhere(f.overdue === "true", new Date()) : {},
    ],
  };
  const [rows, total] = await Promise.all([
    Deviation.findAll({
      where: { [Op.and]: [filter, afterCursor(NEWEST_FIRST, f.cursor)] },
      // Only what a summary shows: a thread's text and a decision's reasons stay in the table.
      attributes: [
        "id",
        "kind",
        "status",
        "parameters",
        "summary",
        "lotId",
        "contractId",
        "respondBy",
        "decision",
        "createdAt",
        "updatedAt",
      ],
      include: [{ model: Lot, as: "lot", attributes: ["id", "lotCode", "vintage"] }],
      order: orderBy(NEWEST_FIRST),
      limit: f.limit + 1,
      // Plain rows: a page of model instances costs more than the query.
      raw: true,
      nest: true,
    }),
    Deviation.count({ where: filter }),
  ]);
  return toPage(
    rows,
    f.limit,
    (d) => [sqlTime(d.createdAt), d.id],
    (page) => page.map((d) => summaryView(d, (d as Deviation & { lot: Lot }).lot, byId.get(d.contractId)!)),
    total,
  );
}

export async function getDeviation(orgId: number, id: number, user: SessionUser, membership: SessionMembership): Promise<DeviationDetail> {
  const { deviation, contract, side } = await deviationFor(orgId, id);
  const lot = (await Lot.findByPk(deviation.lotId))!;
  const evaluation = deviation.analysisId ? await AnalysisEvaluation.findOne({ where: { analysisId: deviation.analysisId } }) : null;
  const people = await participants(contract);
  const messages = (await DeviationMessage.findAll({
    where: { deviationId: id },
    include: [
      { model: User, as: "author", attributes: ["id", "name"] },
      { model: DeviationMessageEdit, as: "edits" },
      { model: DeviationAttachment, as: "attachments" },
    ],
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
  })) as (DeviationMessage & { author: User; edits: DeviationMessageEdit[]; attachments: DeviationAttachment[] })[];
  const decider = deviation.decidedBy ? await User.findByPk(deviation.decidedBy, { attributes: ["name"] }) : null;
  const open = !CLOSED.includes(deviation.status);
  const role = membership.role;
  return {
    ...summaryView(deviation, lot, contract),
    side,
    analysisId: deviation.analysisId,
    verdicts: ((evaluation?.verdicts ?? []) as StoredVerdict[]).filter((v) => deviation.parameters.includes(v.parameter)),
    decision: deviation.decision,
    decidedAt: deviation.decidedAt ? deviation.decidedAt.toISOString() : null,
    decidedBy: decider?.name ?? null,
    messages: messages.map((m): MessageView => ({
      id: m.id,
      parentId: m.parentId,
      kind: m.kind,
      author: m.author.name,
      organisation:
        m.organisationId === contract.retailerOrgId
          ? contract.retailer.name
          : m.organisationId === contract.producerOrgId
            ? contract.producer.name
            : "Laboratory",
      side: m.organisationId === contract.retailerOrgId ? "buyer" : m.organisationId === contract.producerOrgId ? "producer" : "laboratory",
      body: m.body,
      proposal: m.proposal,
      quote: m.quote,
      mentions: people.filter((p) => m.mentions.includes(p.userId)).map((p) => p.handle),
      edits: m.edits.map((e) => ({ previousBody: e.previousBody, editedAt: e.editedAt.toISOString() })),
      attachments: m.attachments.map((a) => ({ id: a.id, originalName: a.originalName, sizeBytes: a.sizeBytes, sha256: a.sha256 })),
      mine: m.authorUserId === user.id,
      createdAt: m.createdAt.toISOString(),
      editedAt: m.editedAt ? m.editedAt.toISOString() : null,
    })),
    participants: people.map(({ handle, name, organisation }) => ({ handle, name, organisation })),
    actions: {
      comment: open && can(role, "deviations.discuss"),
      propose: open && can(role, "deviations.discuss"),
      accept: open && deviation.status !== "agreed" && can(role, "deviations.discuss"),
      decide: open && side === "buyer" && can(role, "deviations.decide"),
      close: deviation.status === "decided" && side === "buyer" && can(role, "deviations.decide"),
    },
  };
}

export async function readAttachment(orgId: number, attachmentId: number) {
  const a = await DeviationAttachment.findByPk(attachmentId);
  const message = a ? await DeviationMessage.findByPk(a.messageId) : null;
  if (!a || !message) throw notFound("The attachment");
  await deviationFor(orgId, message.deviationId).catch(() => {
    throw notFound("The attachment");
  });
  return { body: await readStoredFile(a.storedName), mime: a.mime, filename: a.originalName };
}
