/**
 * Factories that make rows through the services, as the people who use Cellarpact would: an
 * organisation and its members, a contract with an agreed spec version, a planned lot, a submitted
 * analysis, a decided deviation, a laboratory's prices and an audit order. A test that uses them owns
 * its rows and never leans on a demo row's id; demo people are found by e-mail. The demo seeders are
 * built from the same factories. They run on the database the caller opened (`buildTestApp`, or a
 * seeder's `useDemoServices`).
 */
import { randomUUID } from "node:crypto";
import { AuditOrder } from "../../server/models/audit-order.ts";
import { User } from "../../server/models/user.ts";
import { Membership } from "../../server/models/membership.ts";
import { toSessionUser, type SessionUser } from "../../server/services/session-service.ts";
import { acceptContract, createContract } from "../../server/services/specs/contract-service.ts";
import { agree, createVersion, saveDraft, sendToProducer } from "../../server/services/specs/spec-lifecycle.ts";
import { getVersion } from "../../server/services/specs/spec-queries.ts";
import { registerLot, submitAnalysis } from "../../server/services/lots/submission-service.ts";
import { getLot } from "../../server/services/lots/lot-queries.ts";
import type { Role } from "../../shared/auth/roles.ts";
import { specStageFor, type AnalysisStage } from "../../shared/lots/vocabulary.ts";
import type { MarketId } from "../../shared/engine/index.ts";
import type { LotInput } from "../../shared/lots/schemas.ts";
import type { NewContractInput, NewVersionInput, SpecRowInput } from "../../shared/specs/schemas.ts";
import type { DecisionInput } from "../../shared/deviations/schemas.ts";
import type { OrganisationKind } from "../../shared/auth/roles.ts";
import type { ParameterId } from "../../shared/engine/index.ts";
import { analysisSubmissionSchema } from "../../shared/lots/schemas.ts";
import { createOrganisation } from "../../server/services/organisation-service.ts";
import { acceptInvitation, createInvitation } from "../../server/services/invitation-service.ts";
import { invitationMail } from "../../server/integrations/mail/templates.ts";
import { Organisation } from "../../server/models/organisation.ts";
import { inTransaction } from "../../server/db/database.ts";
import { decide } from "../../server/services/deviations/deviation-commands.ts";
import { setPriceList } from "../../server/services/audits/price-list-service.ts";
import { createOrder } from "../../server/services/audits/order-service.ts";
import { passingResults } from "./passing-results.ts";

/** Someone acting for an organisation. */
export interface Party {
  user: SessionUser;
  orgId: number;
  role: Role;
}

/** A demo person, by e-mail, acting in the organisation where they hold `role`. */
export async function party(email: string, role: Role): Promise<Party> {
  const user = await toSessionUser((await User.findOne({ where: { email } }))!);
  const membership = user.memberships.find((m) => m.role === role);
  if (!membership) throw new Error(`${email} holds no ${role} membership`);
  return { user, orgId: membership.organisationId, role };
}

/** A platform admin, by e-mail (they act for no organisation). */
export async function platformAdmin(email: string): Promise<SessionUser> {
  return toSessionUser((await User.findOne({ where: { email, isPlatformAdmin: true } }))!);
}

/** An organisation opened by a platform admin, as the platform page does; its first admin is invited by mail. */
export async function organisation(
  platformAdmin: SessionUser,
  input: { name?: string; kind: OrganisationKind; country?: string; adminEmail?: string },
): Promise<number> {
  const suffix = randomUUID().slice(0, 8);
  const { id } = await createOrganisation(
    {
      name: input.name ?? `Factory ${input.kind} ${suffix}`,
      kind: input.kind,
      country: input.country ?? "GB",
      adminEmail: input.adminEmail ?? `admin.${suffix}@example.test`,
    },
    platformAdmin,
  );
  return id;
}

/** A member who accepted an invitation into `orgId` and chose `password`. */
export async function member(orgId: number, role: Role, person: { name?: string; email?: string; password?: string } = {}): Promise<Party> {
  const email = person.email ?? `member.${randomUUID().slice(0, 8)}@example.test`;
  let token = "";
  await inTransaction(async (t) => {
    const org = (await Organisation.findByPk(orgId, { transaction: t }))!;
    await createInvitation(t, { organisation: org, email, role, invitedBy: null }, (link) => {
      token = link.slice(link.lastIndexOf("/") + 1);
      return invitationMail({ to: email, organisationName: org.name, role, inviterName: "Cellarpact", link, expiresDays: 1 });
    });
  });
  const { user } = await acceptInvitation(token, person.name ?? "Factory Member", person.password ?? `pw-${randomUUID()}`);
  return { user, orgId, role };
}

const WINE: NewContractInput["wine"] = {
  name: "Factory Blanc",
  colour: "white",
  category: "still",
  region: "Loire Valley",
  markets: ["EU"],
  nominalSugarGPerL: 2.5,
  nominalAlcoholPercentVol: 12.5,
};

/**
 * A contract between the two parties with version 1 sent and agreed: drafted from a template, or
 * from `rows` when given (then the version's stages are the rows' stages).
 */
export async function agreedContract(
  buyer: Party,
  producer: Party,
  opts: { wine?: Partial<NewContractInput["wine"]>; reference?: string } & VersionOptions = {},
): Promise<{ contractId: number; versionId: number; reference: string }> {
  const { contractId, reference } = await contract(buyer, producer, opts);
  const { versionId } = await agreedVersion(buyer, producer, contractId, opts);
  return { contractId, versionId, reference };
}

/**
 * A contract the buyer opened with the producer and the producer's admin accepted (unless
 * `accepted: false`), with no spec version yet.
 */
export async function contract(
  buyer: Party,
  producer: Party,
  opts: { wine?: Partial<NewContractInput["wine"]>; reference?: string; accepted?: boolean } = {},
) {
  const reference = opts.reference ?? `F-${randomUUID().slice(0, 8)}`;
  const { id: contractId } = await createContract(buyer.orgId, buyer.user, {
    reference,
    producerOrgId: producer.orgId,
    startsOn: "2024-01-01",
    endsOn: null,
    wine: { ...WINE, ...opts.wine },
  });
  if (opts.accepted !== false) await acceptContract(producer.orgId, contractId, (await adminOf(producer.orgId)).user);
  return { contractId, reference };
}

/** The organisation's admin: its first one, or one invited for the purpose. */
export async function adminOf(orgId: number): Promise<Party> {
  const first = await Membership.findOne({ where: { organisationId: orgId, role: "org_admin" }, order: [["id", "ASC"]] });
  if (!first) return member(orgId, "org_admin");
  return { user: await toSessionUser((await User.findByPk(first.userId))!), orgId, role: "org_admin" };
}

interface VersionOptions {
  /** Where the draft starts; a template by default, or a blank sheet when `rows` are given. */
  from?: NewVersionInput;
  template?: string;
  /** The draft's rows, in place of what it started with. */
  rows?: SpecRowInput[];
  vintageFrom?: number;
}

/** A new version of the contract's spec, sent by the buyer and agreed by the producer. */
export async function agreedVersion(buyer: Party, producer: Party, contractId: number, opts: VersionOptions = {}) {
  const from =
    opts.from ?? (opts.rows ? { from: "blank" as const } : { from: "template" as const, templateId: opts.template ?? "still-white" });
  const { id: versionId } = await createVersion(buyer.orgId, contractId, buyer.user, from);
  const draft = await getVersion(buyer.orgId, versionId, buyer.role);
  const rows = opts.rows ?? draft.requirements.map(({ id: _id, ...row }) => row);
  await saveDraft(buyer.orgId, versionId, buyer.user, {
    lockVersion: draft.lockVersion,
    title: draft.title,
    vintageFrom: opts.vintageFrom ?? 2023,
    vintageTo: null,
    stages: opts.rows ? [...new Set(rows.flatMap((r) => r.stages))] : draft.stages,
    rows,
  });
  await sendToProducer(buyer.orgId, versionId, buyer.user);
  await agree(producer.orgId, versionId, producer.user);
  return { versionId, number: draft.number };
}

/** The date n days from today (negative: before), as YYYY-MM-DD. */
export const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** A lot the producer plans to fill, in three weeks unless `plannedDate` says otherwise. */
export async function plannedLot(producer: Party, contractId: number, opts: Partial<Omit<LotInput, "contractId">> = {}) {
  return registerLot(producer.orgId, producer.user, {
    vintage: 2025,
    lotCode: `FL-${randomUUID().slice(0, 6)}`,
    volumeLitres: 9000,
    container: "bottles",
    plannedDate: inDays(21),
    market: "EU" as MarketId,
    ...opts,
    contractId,
  });
}

/** The producer's analysis at a stage, passing every row unless `overrides` says otherwise. */
export async function analysed(
  producer: Party,
  lotId: number,
  stage: AnalysisStage = "pre_filling",
  overrides: Record<string, string> = {},
) {
  const lot = await getLot(producer.orgId, lotId, producer.role);
  const { response } = await submitAnalysis(producer.orgId, lotId, producer.user, {
    idempotencyKey: randomUUID(),
    stage,
    laboratoryName: "Factory cellar laboratory",
    sampleDate: new Date().toISOString().slice(0, 10),
    results: passingResults(lot.governing!.requirements, specStageFor(stage), overrides),
  });
  return response;
}

/** An analysis with exactly these results, as a laboratory reported them: `[parameter, value, unit]`. */
export async function reported(
  producer: Party,
  lotId: number,
  a: {
    stage: AnalysisStage;
    laboratoryName: string;
    accreditation?: string | null;
    sampleDate: string;
    results: [parameter: string, raw: string, unit: string][];
    idempotencyKey?: string;
  },
) {
  const { response } = await submitAnalysis(
    producer.orgId,
    lotId,
    producer.user,
    analysisSubmissionSchema.parse({
      idempotencyKey: a.idempotencyKey ?? randomUUID(),
      stage: a.stage,
      laboratoryName: a.laboratoryName,
      accreditation: a.accreditation ?? null,
      sampleDate: a.sampleDate,
      results: a.results.map(([parameter, raw, unit]) => ({ parameter, raw, unit, uncertainty: null, method: null })),
    }),
  );
  return response;
}

/** The buyer's technologist decides a deviation. */
export async function decided(buyer: Party, deviationId: number, decision: DecisionInput) {
  return decide(buyer.orgId, deviationId, buyer.user, decision);
}

/** A laboratory's price list, in cents per parameter. */
export async function priced(lab: Party, prices: [parameter: ParameterId, cents: number][]) {
  return setPriceList(lab.orgId, lab.user, { items: prices.map(([parameter, priceCents]) => ({ parameter, priceCents })) });
}

/**
 * The order's payment started, as the checkout service records the Checkout Session Stripe opened;
 * for tests that deliver signed events without running the Stripe fake. Only such an order can be paid.
 */
export async function paymentStarted(orderId: number): Promise<string> {
  const sessionId = `cs_test_${randomUUID().replaceAll("-", "")}`;
  await AuditOrder.update({ checkoutSessionId: sessionId }, { where: { id: orderId } });
  return sessionId;
}

/** An audit order the buyer placed and has not paid yet. */
export async function auditOrder(
  buyer: Party,
  o: {
    contractId: number;
    laboratoryOrgId: number;
    lotIds: number[];
    parameters: ParameterId[];
    stage: AnalysisStage;
    note?: string | null;
  },
) {
  return (await createOrder(buyer.orgId, buyer.user, { idempotencyKey: randomUUID(), note: null, ...o })).response;
}
