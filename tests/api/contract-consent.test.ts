/**
 * A retailer cannot bind a producer alone: a contract waits for the producer's admin to accept it,
 * and no spec version reaches the producer before (common practice: both parties sign a
 * purchasing contract). Only the producer's admin accepts, once.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO, signInAs, type SignedInAgent } from "../support/api.ts";
import { QueryTypes } from "sequelize";
import { openAppAndMail, t } from "../support/app-and-mail.ts";
import { contract, party, type Party } from "../support/factories.ts";
import { createVersion, sendToProducer } from "../../server/services/specs/spec-lifecycle.ts";

openAppAndMail();

let buyer: Party;
let producer: Party;
let producerAdmin: SignedInAgent;
beforeAll(async () => {
  buyer = await party(DEMO.buyerTechnologist, "buyer_technologist");
  producer = await party(DEMO.producerQuality, "producer_quality");
  producerAdmin = await signInAs(t.app, DEMO.producerAdmin);
});

describe("the producer's consent", () => {
  it("when a retailer opens a contract, then the producer's admin is told, and no spec version can be sent until they accept", async () => {
    const { contractId, reference } = await contract(buyer, producer, { accepted: false });
    // Told in the app (a mail follows by the admin's own notification settings).
    const [told] = await t.sequelize.query<{ n: number }>(
      "SELECT COUNT(*) AS n FROM notifications n JOIN users u ON u.id = n.user_id WHERE u.email = ? AND n.title LIKE ?",
      { replacements: [DEMO.producerAdmin, `%opened contract ${reference}%`], type: QueryTypes.SELECT },
    );
    expect(Number(told!.n)).toBe(1);
    const { id: versionId } = await createVersion(buyer.orgId, contractId, buyer.user, { from: "template", templateId: "still-white" });
    await expect(sendToProducer(buyer.orgId, versionId, buyer.user)).rejects.toThrow(/has not accepted contract .* yet/);

    const detail = (await producerAdmin.agent.get(`/api/orgs/${producer.orgId}/contracts/${contractId}`)).body;
    expect(detail).toMatchObject({ producerAcceptedAt: null, canAccept: true });
    const accept = () =>
      producerAdmin.agent.post(`/api/orgs/${producer.orgId}/contracts/${contractId}/accept`).set("x-csrf-token", producerAdmin.csrf);
    expect((await accept()).status).toBe(204);
    expect((await accept()).status).toBe(409);
    await sendToProducer(buyer.orgId, versionId, buyer.user);
    const history = (await producerAdmin.agent.get(`/api/orgs/${producer.orgId}/history/contract/${contractId}`)).body as {
      action: string;
    }[];
    expect(history.map((h) => h.action)).toContain("contract.accepted");
  });

  it("when anyone but the producer's admin tries to accept, then it is refused", async () => {
    const { contractId } = await contract(buyer, producer, { accepted: false });
    const quality = await signInAs(t.app, DEMO.producerQuality);
    const retailerAdmin = await signInAs(t.app, DEMO.retailerAdmin);
    const other = await signInAs(t.app, DEMO.bulkProducerQuality);
    const post = (a: SignedInAgent, orgId: number) =>
      a.agent.post(`/api/orgs/${orgId}/contracts/${contractId}/accept`).set("x-csrf-token", a.csrf);
    expect((await post(quality, producer.orgId)).status).toBe(403);
    expect((await post(retailerAdmin, buyer.orgId)).status).toBe(403);
    const otherOrg = (await party(DEMO.bulkProducerQuality, "producer_quality")).orgId;
    expect([403, 404]).toContain((await post(other, otherOrg)).status);
  });
});
