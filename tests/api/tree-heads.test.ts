/**
 * Signed tree heads (RFC 9162 §4.10) and Merkle proofs (§2.1.3, §2.1.4) over the trail, through
 * the API: a member keeps a head, checks that an entry about their organisation is in it, and
 * later checks that the grown trail is consistent with the head they kept — which a rewritten
 * history cannot be, even with every hash and the checkpoint recomputed in the database.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import request from "supertest";
import { DEMO, signInAs, type SignedInAgent } from "../support/api.ts";
import { mail, openAppAndMail, t } from "../support/app-and-mail.ts";
import { party } from "../support/factories.ts";
import { inTransaction } from "../../server/db/database.ts";
import { recordTrail } from "../../server/services/trail/trail-service.ts";
import { verifyTreeHead } from "../../server/services/trail/tree-heads.ts";
import { mailDailyTreeHead } from "../../server/services/trail/tree-head-mail.ts";
import { verifyConsistency, verifyInclusion } from "../../server/lib/merkle.ts";
import type { ConsistencyProof, InclusionProof, KeptHeadCheck, SignedTreeHead } from "../../shared/trail/views.ts";

openAppAndMail();

let tech: SignedInAgent;
let orgId: number;
const hex = (s: string) => Buffer.from(s, "hex");
beforeAll(async () => {
  tech = await signInAs(t.app, DEMO.buyerTechnologist);
  orgId = (await party(DEMO.buyerTechnologist, "buyer_technologist")).orgId;
});

async function record(n: number) {
  const someone = await party(DEMO.buyerTechnologist, "buyer_technologist");
  for (let i = 0; i < n; i++)
    await inTransaction((tx) =>
      recordTrail(tx, {
        actorUserId: someone.user.id,
        organisationId: orgId,
        action: "user.profile_updated",
        entityType: "thing",
        entityId: i,
      }),
    );
}

describe("signed tree heads", () => {
  it("when a member takes the head, then its Ed25519 signature verifies with the published key", async () => {
    const head = (await tech.agent.get(`/api/orgs/${orgId}/trail/tree-head`)).body as SignedTreeHead;
    const key = (await request(t.app).get("/api/trail/public-key")).body;
    expect(head).toMatchObject({ algorithm: "Ed25519", keyId: key.keyId });
    expect(verifyTreeHead(head, key.publicKeyPem)).toBe(true);
    expect(verifyTreeHead({ ...head, treeSize: head.treeSize + 1 }, key.publicKeyPem)).toBe(false);
  });

  it("when a member asks for an entry about their organisation, then its inclusion proof leads to the head's root; another's entry is not theirs to ask", async () => {
    await record(3);
    const head = (await tech.agent.get(`/api/orgs/${orgId}/trail/tree-head`)).body as SignedTreeHead;
    const [mine] = await t.sequelize.query<{ seq: number }>("SELECT MAX(seq) AS seq FROM trail_entries WHERE organisation_id = ?", {
      replacements: [orgId],
      type: QueryTypes.SELECT,
    });
    const proof = (await tech.agent.get(`/api/orgs/${orgId}/trail/inclusion?seq=${mine!.seq}&treeSize=${head.treeSize}`))
      .body as InclusionProof;
    expect(verifyInclusion(proof.leafIndex, proof.treeSize, hex(proof.leafHash), proof.path.map(hex), hex(head.rootHash))).toBe(true);
    const [other] = await t.sequelize.query<{ seq: number }>(
      "SELECT MIN(seq) AS seq FROM trail_entries WHERE organisation_id <> ? OR organisation_id IS NULL",
      { replacements: [orgId], type: QueryTypes.SELECT },
    );
    expect((await tech.agent.get(`/api/orgs/${orgId}/trail/inclusion?seq=${other!.seq}&treeSize=${head.treeSize}`)).status).toBe(404);
    expect((await tech.agent.get(`/api/orgs/${orgId}/trail/inclusion?seq=0&treeSize=x`)).status).toBe(400);
  });

  it("when the trail grows, then it is consistent with a kept head; when history is rewritten, it no longer is", async () => {
    const kept = (await tech.agent.get(`/api/orgs/${orgId}/trail/tree-head`)).body as SignedTreeHead;
    await record(4);
    const now = (await tech.agent.get(`/api/orgs/${orgId}/trail/tree-head`)).body as SignedTreeHead;
    const grown = (await tech.agent.get(`/api/orgs/${orgId}/trail/consistency?from=${kept.treeSize}&to=${now.treeSize}`))
      .body as ConsistencyProof;
    expect(grown.fromRoot).toBe(kept.rootHash);
    expect(verifyConsistency(kept.treeSize, now.treeSize, hex(kept.rootHash), hex(now.rootHash), grown.path.map(hex))).toBe(true);

    // Someone with database access rewrites an early entry's hash (and could recompute everything after it).
    const [early] = await t.sequelize.query<{ seq: number; hash: string }>(
      "SELECT seq, hash FROM trail_entries ORDER BY seq LIMIT 1 OFFSET 1",
      {
        type: QueryTypes.SELECT,
      },
    );
    await t.sequelize.query("UPDATE trail_entries SET hash = ? WHERE seq = ?", { replacements: ["f".repeat(64), early!.seq] });
    try {
      const rewritten = (await tech.agent.get(`/api/orgs/${orgId}/trail/consistency?from=${kept.treeSize}&to=${now.treeSize}`))
        .body as ConsistencyProof;
      expect(rewritten.fromRoot).not.toBe(kept.rootHash);
      expect(verifyConsistency(kept.treeSize, now.treeSize, hex(kept.rootHash), hex(rewritten.toRoot), rewritten.path.map(hex))).toBe(
        false,
      );
    } finally {
      await t.sequelize.query("UPDATE trail_entries SET hash = ? WHERE seq = ?", { replacements: [early!.hash, early!.seq] });
    }
  });

  it("when a member sends back a head they kept, then it checks out; altered, cut or rewritten, it does not", async () => {
    const kept = (await tech.agent.get(`/api/orgs/${orgId}/trail/tree-head`)).body as SignedTreeHead;
    await record(2);
    const check = async (head: SignedTreeHead) =>
      (await tech.agent.post(`/api/orgs/${orgId}/trail/check-head`).set("x-csrf-token", tech.csrf).send(head)).body as KeptHeadCheck;
    expect(await check(kept)).toMatchObject({ signatureValid: true, consistent: true, keptSize: kept.treeSize, reason: null });
    expect(await check({ ...kept, treeSize: kept.treeSize - 1 })).toMatchObject({ signatureValid: false, consistent: false });

    const [early] = await t.sequelize.query<{ seq: number; hash: string }>(
      "SELECT seq, hash FROM trail_entries ORDER BY seq LIMIT 1 OFFSET 2",
      {
        type: QueryTypes.SELECT,
      },
    );
    await t.sequelize.query("UPDATE trail_entries SET hash = ? WHERE seq = ?", { replacements: ["e".repeat(64), early!.seq] });
    try {
      expect((await check(kept)).reason).toMatch(/rewritten/);
    } finally {
      await t.sequelize.query("UPDATE trail_entries SET hash = ? WHERE seq = ?", { replacements: [early!.hash, early!.seq] });
    }
    expect(await check({ ...kept, rootHash: "x" } as SignedTreeHead)).toMatchObject({ status: 400 });
  });

  it("when the daily pass runs, then each organisation's admins get today's signed head by mail, once a day", async () => {
    await t.sequelize.query("DELETE FROM trail_tree_heads");
    const day = new Date();
    const sent = await mailDailyTreeHead(day);
    expect(sent).toBeGreaterThan(0);
    expect(await mailDailyTreeHead(day)).toBe(0);
    await mail.deliver();
    const got = mail.to(DEMO.retailerAdmin).filter((m) => m.subject.startsWith("Cellarpact trail, signed head of"));
    expect(got.length).toBeGreaterThan(0);
    const head = JSON.parse(got.at(-1)!.text.slice(got.at(-1)!.text.indexOf("{"))) as SignedTreeHead;
    const key = (await request(t.app).get("/api/trail/public-key")).body;
    expect(verifyTreeHead(head, key.publicKeyPem)).toBe(true);
  });
});
