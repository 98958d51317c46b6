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
