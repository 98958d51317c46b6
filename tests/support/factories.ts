/**
 * Factories that make what a test needs through the services, as the people who use Cellarpact
 * would: a contract with an agreed spec version, a planned lot, a submitted analysis. A test that
 * uses them owns its rows and never leans on a demo row's id; demo people are found by e-mail.
 * They run in the test's process, on the database `buildTestApp` opened.
 */
import { randomUUID } from "node:crypto";
import { User } from "../../server/models/user.ts";
import { toSessionUser, type SessionUser } from "../../server/services/session-service.ts";
import { createContract } from "../../server/services/specs/contract-service.ts";
import { agree, createVersion, saveDraft, sendToProducer } from "../../server/services/specs/spec-lifecycle.ts";
import { getVersion } from "../../server/services/specs/spec-queries.ts";
import { registerLot, submitAnalysis } from "../../server/services/lots/submission-service.ts";
import { getLot } from "../../server/services/lots/lot-queries.ts";
import type { Role } from "../../shared/auth/roles.ts";
import type { NewContractInput } from "../../shared/specs/schemas.ts";
import { specStageFor, type AnalysisStage } from "../../shared/lots/vocabulary.ts";
import type { MarketId } from "../../shared/engine/index.ts";
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

const WINE: NewContractInput["wine"] = {
  name: "Factory Blanc",
  colour: "white",
  category: "still",
  region: "Loire Valley",
  markets: ["EU"],
  nominalSugarGPerL: 2.5,
  nominalAlcoholPercentVol: 12.5,
};

/** A contract between the two parties with version 1 drafted from a template, sent and agreed. */
export async function agreedContract(
  buyer: Party,
  producer: Party,
  opts: { wine?: Partial<NewContractInput["wine"]>; template?: string; vintageFrom?: number } = {},
): Promise<{ contractId: number; versionId: number; reference: string }> {
  const reference = `F-${randomUUID().slice(0, 8)}`;
  const { id: contractId } = await createContract(buyer.orgId, buyer.user, {
    reference,
    producerOrgId: producer.orgId,
    startsOn: "2024-01-01",
    endsOn: null,
    wine: { ...WINE, ...opts.wine },
  });
  const { id: versionId } = await createVersion(buyer.orgId, contractId, buyer.user, {
    from: "template",
    templateId: opts.template ?? "still-white",
  });
  const draft = await getVersion(buyer.orgId, versionId, buyer.role);
  await saveDraft(buyer.orgId, versionId, buyer.user, {
    lockVersion: draft.lockVersion,
    title: draft.title,
    vintageFrom: opts.vintageFrom ?? 2023,
    vintageTo: null,
    stages: draft.stages,
    rows: draft.requirements.map(({ id: _id, ...row }) => row),
  });
  await sendToProducer(buyer.orgId, versionId, buyer.user);
  await agree(producer.orgId, versionId, producer.user);
  return { contractId, versionId, reference };
}

/** A lot the producer plans to fill in three weeks. */
export async function plannedLot(
  producer: Party,
  contractId: number,
  opts: { vintage?: number; market?: MarketId; lotCode?: string } = {},
) {
  const plannedDate = new Date(Date.now() + 21 * 86_400_000).toISOString().slice(0, 10);
  return registerLot(producer.orgId, producer.user, {
    contractId,
    vintage: opts.vintage ?? 2025,
    lotCode: opts.lotCode ?? `FL-${randomUUID().slice(0, 6)}`,
    volumeLitres: 9000,
    container: "bottles",
    plannedDate,
    market: opts.market ?? "EU",
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
  return submitAnalysis(producer.orgId, lotId, producer.user, {
    idempotencyKey: randomUUID(),
    stage,
    laboratoryName: "Factory cellar laboratory",
    sampleDate: new Date().toISOString().slice(0, 10),
    results: passingResults(lot.governing!.requirements, specStageFor(stage), overrides),
  });
}
