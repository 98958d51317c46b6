/** Opening a purchasing contract: the wine a retailer buys from a producer. */
import { Organisation } from "../../models/organisation.ts";
import { Contract } from "../../models/contract.ts";
import { Wine } from "../../models/wine.ts";
import { inTransaction } from "../../db/database.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { conflict, forbidden, validationFailed } from "../../errors.ts";
import { contractFor } from "./spec-access.ts";
import { lawFactsText, type WineLawFacts } from "../../../shared/specs/law-facts.ts";
import type { NewContractInput } from "../../../shared/specs/schemas.ts";
import type { SessionUser } from "../session-service.ts";
import { notify, usersWithRoles } from "../notification-service.ts";
import { contractPath } from "../../../shared/paths.ts";

/**
 * The producer's admin accepts a contract a retailer opened with them: from then on the retailer's
 * spec versions reach the producer. A retailer cannot bind a producer alone.
 */
export async function acceptContract(orgId: number, contractId: number, user: SessionUser): Promise<void> {
  await inTransaction(async (t) => {
    const { contract, side } = await contractFor(orgId, contractId, t);
    if (side !== "producer") throw forbidden("Only the producer accepts a contract.");
    if (contract.producerAcceptedAt) throw conflict(`Contract ${contract.reference} was accepted already.`);
    await Contract.update({ producerAcceptedAt: new Date(), producerAcceptedBy: user.id }, { where: { id: contract.id }, transaction: t });
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: orgId,
      action: "contract.accepted",
      entityType: "contract",
      entityId: contract.id,
      details: { reference: contract.reference, retailer: contract.retailer.name },
    });
    await notify(t, await usersWithRoles([contract.retailerOrgId], ["buyer_technologist"], t), {
      kind: "spec",
      title: `${contract.producer.name} accepted contract ${contract.reference}`,
      body: `You can now send ${contract.producer.name} the specification for ${contract.wine.name}.`,
      link: contractPath(contract.id),
    });
  });
}

/** Producers a buyer can contract with. */
export async function listProducers() {
  const rows = await Organisation.findAll({ where: { kind: "producer" }, order: [["name", "ASC"]], attributes: ["id", "name", "country"] });
  return rows.map((o) => ({ id: o.id, name: o.name, country: o.country }));
}

export async function createContract(retailerOrgId: number, user: SessionUser, input: NewContractInput): Promise<{ id: number }> {
  return inTransaction(async (t) => {
    const producer = await Organisation.findByPk(input.producerOrgId, { transaction: t });
    if (!producer || producer.kind !== "producer")
      throw validationFailed([{ path: "producerOrgId", message: "Choose a producer organisation." }]);
    if (await Contract.findOne({ where: { retailerOrgId, reference: input.reference }, transaction: t })) {
      throw conflict(`Your organisation already has a contract ${input.reference}.`);
    }
    const w = input.wine;
    const wine = await Wine.create(
      {
        retailerOrgId,
        producerOrgId: producer.id,
        name: w.name,
        colour: w.colour,
        category: w.category,
        region: w.region,
        markets: w.markets,
        nominalSugarGPerL: w.nominalSugarGPerL ?? null,
        nominalAlcoholPercentVol: w.nominalAlcoholPercentVol ?? null,
        lawFacts: w.lawFacts ?? null,
      },
      { transaction: t },
    );
    const contract = await Contract.create(
      {
        reference: input.reference,
        retailerOrgId,
        producerOrgId: producer.id,
        wineId: wine.id,
        startsOn: input.startsOn,
        endsOn: input.endsOn ?? null,
      },
      { transaction: t },
    );
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: retailerOrgId,
      action: "contract.created",
      entityType: "contract",
      entityId: contract.id,
      after: input,
      details: { reference: input.reference, wine: w.name, producer: producer.name },
    });
    const retailer = (await Organisation.findByPk(retailerOrgId, { transaction: t }))!;
    await notify(t, await usersWithRoles([producer.id], ["org_admin"], t), {
      kind: "spec",
      title: `${retailer.name} opened contract ${input.reference} for ${w.name}: accept it to receive its specifications`,
      body: `${retailer.name} names your organisation as the producer of ${w.name} under contract ${input.reference}. No specification reaches you until you accept.`,
      link: contractPath(contract.id),
    });
    return { id: contract.id };
  });
}

/**
 * The buyer states what the law needs to know about the wine (organic, PDO/PGI, listings for higher
 * limits). Verdicts already stored keep the facts they were judged on; the lot page offers a re-judgement.
 */
export async function updateLawFacts(
  orgId: number,
  contractId: number,
  user: SessionUser,
  lawFacts: WineLawFacts,
): Promise<{ lawFacts: WineLawFacts }> {
  return inTransaction(async (t) => {
    const { contract, side } = await contractFor(orgId, contractId, t);
    if (side !== "buyer") throw forbidden("Only the buyer states the wine's facts for the law.");
    const before = contract.wine.lawFacts ?? {};
    await contract.wine.update({ lawFacts }, { transaction: t });
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: orgId,
      action: "wine.law_facts_changed",
      entityType: "contract",
      entityId: contract.id,
      before,
      after: lawFacts,
      details: { wine: contract.wine.name, facts: lawFactsText(lawFacts).join("; ") || "none stated" },
    });
    return { lawFacts };
  });
}
