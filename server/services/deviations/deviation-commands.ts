/**
 * Negotiating deviations: a threaded discussion (replies, mentions, quoted results, attachments,
 * edit history) in which producers propose and only the buyer's technologist decides, with a reason.
 */
import { type Transaction } from "sequelize";
import type { TrailAction } from "../../../shared/trail/vocabulary.ts";
import { deviationPath } from "../../../shared/paths.ts";
import { Deviation } from "../../models/deviation.ts";
import { DeviationAttachment } from "../../models/deviation-attachment.ts";
import { DeviationMessage } from "../../models/deviation-message.ts";
import { DeviationMessageEdit } from "../../models/deviation-message-edit.ts";
import { Analysis } from "../../models/analysis.ts";
import { Lot } from "../../models/lot.ts";
import { AnalysisEvaluation } from "../../models/analysis-evaluation.ts";
import { inTransaction } from "../../db/database.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { notify, usersWithRoles } from "../notification-service.ts";
import { conflict, forbidden, notFound, validationFailed } from "../../errors.ts";
import { contractFor } from "../specs/spec-access.ts";
import { createVersion } from "../specs/spec-lifecycle.ts";
import { governingVersion } from "../lots/governing.ts";
import { openDeviations, responseDeadline } from "./open-deviations.ts";
import { discardFile, saveCheckedFile } from "../../integrations/storage/stored-files.ts";
import { DEVIATION_OUTCOME_LABELS, proposalText } from "../../../shared/deviations/vocabulary.ts";
import type { DecisionInput, MessageInput } from "../../../shared/deviations/schemas.ts";
import type { SessionUser } from "../session-service.ts";
import { CLOSED, partyDeviationFor, participants } from "./deviation-access.ts";

const audit = (
  t: Transaction,
  user: SessionUser,
  orgId: number,
  action: TrailAction,
  d: Deviation,
  details: Record<string, unknown>,
  after?: unknown,
) => recordTrail(t, { actorUserId: user.id, organisationId: orgId, action, entityType: "deviation", entityId: d.id, after, details });

export async function postMessage(orgId: number, id: number, user: SessionUser, input: MessageInput) {
  return inTransaction(async (t) => {
    const { deviation, contract } = await partyDeviationFor(orgId, id, t, true);
    if (CLOSED.includes(deviation.status)) throw conflict("This deviation has been decided; the discussion is closed.");
    let parent: DeviationMessage | null = null;
    if (input.parentId) {
      parent = await DeviationMessage.findOne({ where: { id: input.parentId, deviationId: id }, transaction: t });
      if (!parent) throw validationFailed([{ path: "parentId", message: "You can only reply to a message of this deviation." }]);
    }
    if (input.kind === "acceptance") {
      if (parent?.kind !== "proposal") throw validationFailed([{ path: "parentId", message: "Only a proposal can be accepted." }]);
      if (parent.organisationId === orgId)
        throw validationFailed([{ path: "parentId", message: "Accept the other party's proposal, not your own." }]);
    }
    let quote = null;
    if ("quote" in input && input.quote) {
      const evaluation = await AnalysisEvaluation.findOne({ where: { analysisId: input.quote.analysisId }, transaction: t });
      const analysis = evaluation ? await Analysis.findByPk(input.quote.analysisId, { transaction: t }) : null;
      const verdict = (evaluation?.verdicts ?? []).find((v) => v.parameter === input.quote!.parameter);
      if (!analysis || analysis.lotId !== deviation.lotId || !verdict)
        throw validationFailed([{ path: "quote", message: "Quote a result of this deviation's lot." }]);
      quote = { analysisId: analysis.id, parameter: verdict.parameter, resultText: verdict.resultText, outcome: verdict.outcome };
    }
    const people = await participants(contract, t);
    const handles = [...input.body.matchAll(/@([a-z0-9._-]+)/gi)].map((m) => m[1]!.toLowerCase());
    const mentioned = people.filter((p) => handles.includes(p.handle)).map((p) => p.userId);
    if (input.kind === "acceptance" && deviation.status === "agreed")
      throw conflict("A proposal has already been accepted; the buyer records the decision next.");
    // An acceptance states in full what was accepted, conditions included, whatever the note says.
    const body =
      input.kind === "acceptance" && parent?.proposal
        ? `Accepted: ${proposalText(parent.proposal)}.${input.body.trim() && !input.body.startsWith("Accepted:") ? ` ${input.body}` : ""}`
        : input.body;
    const message = await DeviationMessage.create(
      {
        deviationId: id,
        parentId: input.parentId ?? null,
        authorUserId: user.id,
        organisationId: orgId,
        kind: input.kind,
        body,
        proposal: input.kind === "proposal" ? input.proposal : null,
        quote,
        mentions: mentioned,
      },
      { transaction: t },
    );
    // Each message hands the turn to the other side, with a fresh response deadline; an acceptance
    // settles the discussion until the buyer records the decision (a new proposal reopens it).
    const status =
      input.kind === "acceptance" ? "agreed" : input.kind === "proposal" || deviation.status !== "agreed" ? "in_discussion" : "agreed";
    await deviation.update({ status, respondBy: responseDeadline(), deadlineWarnedAt: null }, { transaction: t });
    await audit(
      t,
      user,
      orgId,
      `deviation.${input.kind === "comment" ? "commented" : input.kind === "proposal" ? "proposed" : "accepted"}`,
      deviation,
      { messageId: message.id, ...(input.kind === "proposal" ? { outcome: input.proposal.outcome } : {}) },
      { body },
    );
    const parties = await usersWithRoles([contract.retailerOrgId, contract.producerOrgId], ["buyer_technologist", "producer_quality"], t);
    const what =
      input.kind === "proposal"
        ? `proposes: ${DEVIATION_OUTCOME_LABELS[input.proposal.outcome]}`
        : input.kind === "acceptance"
          ? "accepts the proposal"
          : "comments";
    await notify(
      t,
      parties.filter((p) => !mentioned.includes(p)),
      { kind: "comment", title: `Deviation #${id} (${contract.wine.name}): ${user.name} ${what}`, body, link: deviationPath(id) },
      user.id,
    );
    await notify(
      t,
      mentioned,
      { kind: "mention", title: `${user.name} mentioned you on deviation #${id}`, body: input.body, link: deviationPath(id) },
      user.id,
    );
    return { id: message.id };
  });
}

export async function editMessage(orgId: number, id: number, messageId: number, user: SessionUser, body: string) {
  await inTransaction(async (t) => {
    const { deviation } = await partyDeviationFor(orgId, id, t);
    const message = await DeviationMessage.findOne({ where: { id: messageId, deviationId: id }, transaction: t, lock: t.LOCK.UPDATE });
    if (!message) throw notFound("The message");
    if (message.authorUserId !== user.id) throw forbidden("Only the author can edit a message.");
    if (CLOSED.includes(deviation.status)) throw conflict("This deviation has been decided; messages can no longer change.");
    await DeviationMessageEdit.create({ messageId, previousBody: message.body, editedAt: new Date() }, { transaction: t });
    await message.update({ body, editedAt: new Date() }, { transaction: t });
    await audit(t, user, orgId, "deviation.message_edited", deviation, { messageId }, { body });
  });
}

/** Only the buyer's technologist decides, with a reason. A spec change starts a draft version from the governing one. */
export async function decide(orgId: number, id: number, user: SessionUser, input: DecisionInput) {
  const specVersionId = await inTransaction(async (t) => {
    const { deviation, contract, side } = await partyDeviationFor(orgId, id, t, true);
    if (side !== "buyer") throw forbidden("Only the buyer decides a deviation.");
    if (CLOSED.includes(deviation.status)) throw conflict("This deviation has already been decided.");
    const decision = { outcome: input.outcome, conditions: input.conditions, reason: input.reason };
    await deviation.update({ status: "decided", decision, decidedAt: new Date(), decidedBy: user.id }, { transaction: t });
    await DeviationMessage.create(
      {
        deviationId: id,
        parentId: null,
        authorUserId: user.id,
        organisationId: orgId,
        kind: "decision",
        body: input.reason,
        proposal: { outcome: input.outcome, conditions: input.conditions },
        quote: null,
        mentions: [],
      },
      { transaction: t },
    );
    await audit(t, user, orgId, "deviation.decided", deviation, { outcome: input.outcome, conditions: input.conditions.length }, decision);
    const parties = await usersWithRoles([contract.retailerOrgId, contract.producerOrgId], ["buyer_technologist", "producer_quality"], t);
    const conditions = input.conditions.length ? ` Conditions: ${input.conditions.map((c) => c.detail).join("; ")}.` : "";
    await notify(
      t,
      parties,
      {
        kind: "decision",
        title: `Deviation #${id} decided: ${DEVIATION_OUTCOME_LABELS[input.outcome]}`,
        body: `${input.reason}${conditions}`,
        link: deviationPath(id),
      },
      user.id,
    );
    return contract.id;
  });
  if (input.outcome !== "spec_change") return { specVersionId: null };
  // The new draft is the buyer's own work, made after the decision is safely recorded.
  const deviation = (await Deviation.findByPk(id))!;
  const lot = (await Lot.findByPk(deviation.lotId))!;
  const governing = await governingVersion(specVersionId, lot.vintage);
  const draft = await createVersion(
    orgId,
    specVersionId,
    user,
    governing ? { from: "version", versionId: governing.version.id } : { from: "blank" },
  );
  await deviation.update({ decision: { ...deviation.decision!, specVersionId: draft.id } });
  return { specVersionId: draft.id };
}

export async function closeDeviation(orgId: number, id: number, user: SessionUser) {
  await inTransaction(async (t) => {
    const { deviation, side } = await partyDeviationFor(orgId, id, t, true);
    if (side !== "buyer") throw forbidden("Only the buyer closes a deviation.");
    if (deviation.status !== "decided") throw conflict("Only a decided deviation can be closed.");
    await deviation.update({ status: "closed" }, { transaction: t });
    await audit(t, user, orgId, "deviation.closed", deviation, {});
  });
}

export async function openManualDeviation(
  orgId: number,
  user: SessionUser,
  input: { lotId: number; parameters: string[]; reason: string },
) {
  return inTransaction(async (t) => {
    const lot = await Lot.findByPk(input.lotId, { transaction: t });
    if (!lot) throw notFound("The lot");
    const { contract } = await contractFor(orgId, lot.contractId, t).catch(() => {
      throw notFound("The lot");
    });
    const [id] = await openDeviations(t, contract, { userId: user.id, organisationId: orgId }, [
      { lotId: lot.id, analysisId: null, kind: "manual", parameters: input.parameters, summary: `Lot ${lot.lotCode}: ${input.reason}` },
    ]);
    return { id: id! };
  });
}

export async function attachToMessage(
  orgId: number,
  id: number,
  messageId: number,
  user: SessionUser,
  file: { buffer: Buffer; originalname: string },
) {
  await partyDeviationFor(orgId, id);
  const message = await DeviationMessage.findOne({ where: { id: messageId, deviationId: id } });
  if (!message) throw notFound("The message");
  if (message.authorUserId !== user.id) throw forbidden("Attach files to your own messages.");
  const saved = await saveCheckedFile(file);
  try {
    return await inTransaction(async (t) => {
      const a = await DeviationAttachment.create({ messageId, ...saved, uploadedBy: user.id }, { transaction: t });
      await recordTrail(t, {
        actorUserId: user.id,
        organisationId: orgId,
        action: "deviation.attachment_added",
        entityType: "deviation",
        entityId: id,
        details: { messageId, sha256: saved.sha256, bytes: saved.sizeBytes },
      });
      return { id: a.id, sha256: saved.sha256 };
    });
  } catch (err) {
    await discardFile(saved.storedName);
    throw err;
  }
}
