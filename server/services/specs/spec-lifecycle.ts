/**
 * Changing spec sheets: drafts (with optimistic locking), sending, the producer's decision,
 * withdrawal, new versions and row comments. Every change is on the trail.
 */
import { Op, type Transaction } from "sequelize";
import type { TrailAction } from "../../../shared/trail/vocabulary.ts";
import { buildRequirement, findParameter, type MarketId } from "../../../shared/engine/index.ts";
import { specPath } from "../../../shared/paths.ts";
import { SPEC_TEMPLATES } from "../../../shared/specs/templates.ts";
import { wineProfile } from "../../../shared/specs/profile.ts";
import { STAGES, type Stage } from "../../../shared/specs/vocabulary.ts";
import type { CommentInput, NewVersionInput, SpecDraftInput, SpecRowInput } from "../../../shared/specs/schemas.ts";
import { SpecVersion } from "../../models/spec-version.ts";
import { SpecRequirement } from "../../models/spec-requirement.ts";
import { SpecComment } from "../../models/spec-comment.ts";
import { inTransaction } from "../../db/database.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { notify, usersWithRoles } from "../notification-service.ts";
import { conflict, notFound, validationFailed } from "../../errors.ts";
import { contractFor, versionFor, type ContractWithParties } from "./spec-access.ts";
import { requirementsOf } from "./spec-queries.ts";
import type { SessionUser } from "../session-service.ts";

const DEFAULT_STAGES: Stage[] = ["pre_filling", "final_check", "pre_shipment"];

async function writeRows(t: Transaction, specVersionId: number, rows: readonly SpecRowInput[]) {
  await SpecRequirement.destroy({ where: { specVersionId }, transaction: t });
  await SpecRequirement.bulkCreate(
    rows.map((r, position) => ({
      specVersionId,
      position,
      parameter: r.parameter,
      unit: r.unit,
      lower: r.lower ?? null,
      upper: r.upper ?? null,
      target: r.target ?? null,
      method: r.method ?? null,
      rule: r.rule,
      severity: r.severity,
      stages: r.stages,
    })),
    { transaction: t },
  );
}

const audit = (
  t: Transaction,
  user: SessionUser,
  orgId: number,
  action: TrailAction,
  version: SpecVersion,
  extra: { before?: unknown; after?: unknown; details?: Record<string, unknown> } = {},
) =>
  recordTrail(t, {
    actorUserId: user.id,
    organisationId: orgId,
    action,
    entityType: "spec_version",
    entityId: version.id,
    ...extra,
    details: { contractId: version.contractId, number: version.number, ...extra.details },
  });

/** A new draft: blank, from a template, or copied from an earlier version of the same contract. */
export async function createVersion(orgId: number, contractId: number, user: SessionUser, input: NewVersionInput): Promise<{ id: number }> {
  return inTransaction(async (t) => {
    const { contract, side } = await contractFor(orgId, contractId, t);
    if (side !== "buyer") throw notFound("The contract");
    const last = await SpecVersion.max<number, SpecVersion>("number", { where: { contractId }, transaction: t });
    let rows: SpecRowInput[] = [];
    let stages = DEFAULT_STAGES;
    let vintageFrom = new Date().getUTCFullYear();
    let vintageTo: number | null = null;
    let title: string | null = null;
    let basedOn: number | null = null;
    if (input.from === "template") {
      const template = SPEC_TEMPLATES.find((x) => x.id === input.templateId);
      if (!template) throw validationFailed([{ path: "templateId", message: "No such template." }]);
      rows = template.rows;
      stages = STAGES.filter((s) => DEFAULT_STAGES.includes(s) || rows.some((r) => r.stages.includes(s)));
      title = `${contract.wine.name}: ${template.name.toLowerCase()} template`;
    } else if (input.from === "version") {
      const source = await SpecVersion.findOne({ where: { id: input.versionId, contractId }, transaction: t });
      if (!source) throw validationFailed([{ path: "versionId", message: "That version does not belong to this contract." }]);
      rows = (await requirementsOf(source.id, t)).map(({ id: _id, ...r }) => ({ ...r, unit: r.unit as SpecRowInput["unit"] }));
      ({ vintageFrom, vintageTo, title } = source);
      // Cover every stage a copied row requires, so the copy opens valid and autosave can run.
      stages = STAGES.filter((s) => source.stages.includes(s) || rows.some((r) => r.stages.includes(s)));
      basedOn = source.id;
    }
    const version = await SpecVersion.create(
      {
        contractId,
        number: (last ?? 0) + 1,
        status: "draft",
        title,
        vintageFrom,
        vintageTo,
        stages,
        basedOnVersionId: basedOn,
        createdBy: user.id,
      },
      { transaction: t },
    );
    await writeRows(t, version.id, rows);
    await audit(t, user, orgId, "spec.version_created", version, { after: { rows }, details: { from: input.from } });
    return { id: version.id };
  });
}

/** Saves a draft only if nobody saved it since the caller read it; a stale save gets 409 and changes nothing. */
export async function saveDraft(
  orgId: number,
  specId: number,
  user: SessionUser,
  input: SpecDraftInput,
): Promise<{ lockVersion: number; updatedAt: string }> {
  return inTransaction(async (t) => {
    const { version, side } = await versionFor(orgId, specId, t, true);
    if (side !== "buyer") throw notFound("The spec version");
    if (version.status !== "draft") throw conflict("This version has been sent and can no longer change. Make a new version instead.");
    const [updated] = await SpecVersion.update(
      {
        lockVersion: input.lockVersion + 1,
        title: input.title ?? null,
        vintageFrom: input.vintageFrom,
        vintageTo: input.vintageTo ?? null,
        stages: input.stages,
      },
      { where: { id: specId, lockVersion: input.lockVersion }, transaction: t },
    );
    if (updated === 0) {
      throw conflict(
        `Someone saved this draft after you opened it (your copy is save ${input.lockVersion}, the stored one is save ${version.lockVersion}). Reload to see their changes; yours were not saved.`,
      );
    }
    const before = await requirementsOf(specId, t);
    await writeRows(t, specId, input.rows);
    await audit(t, user, orgId, "spec.draft_saved", version, { before: { rows: before }, after: { rows: input.rows } });
    const fresh = await SpecVersion.findByPk(specId, { transaction: t });
    return { lockVersion: fresh!.lockVersion, updatedAt: fresh!.updatedAt.toISOString() };
  });
}

/** Checks the whole version against the engine before it leaves the buyer: no impossible row. */
function assertSendable(contract: ContractWithParties, version: SpecVersion, rows: Awaited<ReturnType<typeof requirementsOf>>) {
  if (rows.length === 0) throw validationFailed([{ path: "rows", message: "Add at least one requirement before sending." }]);
  const profile = wineProfile(contract.wine, version.vintageFrom);
  const errors = rows.flatMap((row, i) =>
    buildRequirement(row, contract.wine.markets as MarketId[], profile)
      .issues.filter((x) => x.severity === "error")
      .map((x) => ({ path: `rows.${i}.${x.field}`, message: x.message })),
  );
  if (errors.length) throw validationFailed(errors);
}

export async function sendToProducer(orgId: number, specId: number, user: SessionUser) {
  await inTransaction(async (t) => {
    const { version, contract, side } = await versionFor(orgId, specId, t, true);
    if (side !== "buyer") throw notFound("The spec version");
    if (version.status !== "draft") throw conflict("Only a draft can be sent.");
    if (!contract.producerAcceptedAt)
      throw conflict(
        `${contract.producer.name} has not accepted contract ${contract.reference} yet; a spec reaches them once their admin accepts it.`,
      );
    assertSendable(contract, version, await requirementsOf(specId, t));
    await version.update({ status: "with_producer", sentAt: new Date(), lockVersion: version.lockVersion + 1 }, { transaction: t });
    await audit(t, user, orgId, "spec.sent", version);
    await notify(t, await usersWithRoles([contract.producerOrgId], ["producer_quality"], t), {
      kind: "spec",
      title: `Spec ${contract.reference} v${version.number} for ${contract.wine.name} is waiting for your review`,
      body: `${contract.retailer.name} has sent version ${version.number} of the technical specification for ${contract.wine.name}. Review it, comment on any row, and agree or ask for changes.`,
      link: specPath(version.id),
    });
  });
}

/** The producer agrees: this version governs; an earlier agreed version of the contract is replaced. */
export async function agree(orgId: number, specId: number, user: SessionUser) {
  await inTransaction(async (t) => {
    const { version, contract, side } = await versionFor(orgId, specId, t, true);
    if (side !== "producer") throw notFound("The spec version");
    if (version.status !== "with_producer") throw conflict("Only a version waiting for you can be agreed.");
    const replaced = await SpecVersion.findAll({
      where: { contractId: version.contractId, status: "agreed", id: { [Op.ne]: version.id } },
      transaction: t,
    });
    for (const old of replaced) {
      await old.update({ status: "replaced" }, { transaction: t });
      await audit(t, user, orgId, "spec.replaced", old, { details: { by: version.id } });
    }
    await version.update({ status: "agreed", decidedAt: new Date(), decidedBy: user.id }, { transaction: t });
    await audit(t, user, orgId, "spec.agreed", version);
    await notify(t, await usersWithRoles([contract.retailerOrgId], ["buyer_technologist"], t), {
      kind: "spec",
      title: `${contract.producer.name} agreed to spec ${contract.reference} v${version.number}`,
      body: `${contract.producer.name} has agreed to version ${version.number} of the specification for ${contract.wine.name}. It now governs the lots of the vintages it covers.`,
      link: specPath(version.id),
    });
  });
}

export async function requestChanges(orgId: number, specId: number, user: SessionUser, reason: string) {
  await inTransaction(async (t) => {
    const { version, contract, side } = await versionFor(orgId, specId, t, true);
    if (side !== "producer") throw notFound("The spec version");
    if (version.status !== "with_producer") throw conflict("Only a version waiting for you can be sent back.");
    await version.update({ status: "changes_requested", decidedAt: new Date(), decidedBy: user.id }, { transaction: t });
    await SpecComment.create(
      { specVersionId: specId, requirementId: null, authorUserId: user.id, organisationId: orgId, body: `Changes requested: ${reason}` },
      { transaction: t },
    );
    await audit(t, user, orgId, "spec.changes_requested", version, { details: { reason } });
    await notify(t, await usersWithRoles([contract.retailerOrgId], ["buyer_technologist"], t), {
      kind: "spec",
      title: `${contract.producer.name} asked for changes to spec ${contract.reference} v${version.number}`,
      body: `${contract.producer.name} has asked for changes to version ${version.number} of the specification for ${contract.wine.name}: ${reason}`,
      link: specPath(version.id),
    });
  });
}

export async function withdraw(orgId: number, specId: number, user: SessionUser) {
  await inTransaction(async (t) => {
    const { version, side } = await versionFor(orgId, specId, t, true);
    if (side !== "buyer") throw notFound("The spec version");
    if (!["with_producer", "changes_requested", "agreed"].includes(version.status))
      throw conflict("Only a sent or agreed version can be withdrawn; delete nothing, make a new version instead.");
    await version.update({ status: "withdrawn", decidedAt: new Date(), decidedBy: user.id }, { transaction: t });
    await audit(t, user, orgId, "spec.withdrawn", version);
  });
}

export async function addComment(orgId: number, specId: number, user: SessionUser, input: CommentInput) {
  return inTransaction(async (t) => {
    const { version, contract, side } = await versionFor(orgId, specId, t);
    if (version.status === "draft" || version.status === "withdrawn")
      throw conflict("Comments open once a version is sent, and close when it is withdrawn.");
    if (
      input.requirementId &&
      !(await SpecRequirement.count({ where: { id: input.requirementId, specVersionId: specId }, transaction: t }))
    ) {
      throw validationFailed([{ path: "requirementId", message: "That row is not part of this version." }]);
    }
    const comment = await SpecComment.create(
      { specVersionId: specId, requirementId: input.requirementId ?? null, authorUserId: user.id, organisationId: orgId, body: input.body },
      { transaction: t },
    );
    await audit(t, user, orgId, "spec.commented", version, {
      after: { body: input.body },
      details: { requirementId: input.requirementId ?? null },
    });
    // The other side hears of it: the producer's quality staff, or the buyer's technologists.
    const other =
      side === "buyer"
        ? usersWithRoles([contract.producerOrgId], ["producer_quality"], t)
        : usersWithRoles([contract.retailerOrgId], ["buyer_technologist"], t);
    const row = input.requirementId
      ? await SpecRequirement.findByPk(input.requirementId, { attributes: ["parameter"], transaction: t })
      : null;
    await notify(
      t,
      await other,
      {
        kind: "spec",
        title: `${user.name} commented on spec ${contract.reference} v${version.number}${row ? ` (${findParameter(row.parameter)?.name ?? row.parameter})` : ""}`,
        body: input.body,
        link: specPath(version.id),
      },
      user.id,
    );
    return { id: comment.id };
  });
}
