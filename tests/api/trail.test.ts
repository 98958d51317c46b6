import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { buildTestApp, DEMO, signInAs, type TestApp } from "../support/api.ts";
import { party } from "../support/factories.ts";
import { inTransaction } from "../../server/db/database.ts";
import { recordTrail, verifyOrganisationEntries, verifyTrailChain, GENESIS_HASH } from "../../server/services/trail/trail-service.ts";
import { sha256 } from "../../server/lib/crypto.ts";

let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
// Leave the chain intact for the files that run after this one.
afterAll(async () => {
  await restore(base);
  await t.close();
});

interface Snapshot {
  events: Record<string, unknown>[];
  head: Record<string, unknown>;
}

const sql = (q: string, replacements?: unknown[]) => t.sequelize.query(q, { replacements, type: QueryTypes.RAW });

async function snapshot(): Promise<Snapshot> {
  const events = await t.sequelize.query<Record<string, unknown>>("SELECT * FROM trail_entries ORDER BY seq", { type: QueryTypes.SELECT });
  const [head] = await t.sequelize.query<Record<string, unknown>>("SELECT * FROM trail_head", { type: QueryTypes.SELECT });
  return { events, head: head! };
}

/** Puts the table back exactly as it was, so each tamper case starts from an intact chain. */
async function restore(s: Snapshot) {
  await sql("DELETE FROM trail_entries");
  for (const e of s.events) {
    const cols = Object.keys(e);
    await sql(
      `INSERT INTO trail_entries (${cols.join(",")}) VALUES (${cols.map(() => "?").join(",")})`,
      cols.map((c) => (c === "details" && e[c] !== null && typeof e[c] !== "string" ? JSON.stringify(e[c]) : e[c])),
    );
  }
  await sql("UPDATE trail_head SET last_seq = ?, last_hash = ? WHERE id = 1", [s.head.last_seq, s.head.last_hash]);
}

let base: Snapshot;
let buyerOrg: number;
beforeAll(async () => {
  const someone = await party(DEMO.buyerTechnologist, "buyer_technologist");
  buyerOrg = someone.orgId;
  for (let i = 0; i < 5; i++) {
    await inTransaction((tx) =>
      recordTrail(tx, {
        actorUserId: someone.user.id,
        organisationId: someone.orgId,
        action: "user.profile_updated",
        entityType: "thing",
        entityId: i,
        before: { v: i },
        after: { v: i + 1 },
        details: { i },
      }),
    );
  }
  base = await snapshot();
});
beforeEach(() => restore(base));

describe("the hash-chained trail (RFC 9162 §2.1-style chaining; OWASP ASVS V16 log integrity)", () => {
  it("when nothing was touched, then the whole chain verifies", async () => {
    const v = await verifyTrailChain();
    expect(v.ok).toBe(true);
    expect(v.checked).toBe(base.events.length);
  });

  it("when the first entry is checked, then it links to the all-zero genesis hash", () => {
    expect(base.events[0]!.prev_hash).toBe(GENESIS_HASH);
    expect(sha256("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"); // FIPS 180-2, Appendix B.1
  });

  const victim = () => Number(base.events[base.events.length - 3]!.seq);

  for (const [column, value] of [
    ["action", "'test.forged'"],
    ["actor_user_id", "999"],
    ["organisation_id", "4"],
    ["entity_id", "'77'"],
    ["after_digest", `'${"a".repeat(64)}'`],
    ["details", `'{"i":42}'`],
    ["occurred_at", "occurred_at + INTERVAL 1 SECOND"],
    ["hash", `'${"b".repeat(64)}'`],
  ] as const) {
    it(`when ${column} of one entry is changed through raw SQL, then verification reports that entry`, async () => {
      await sql(`UPDATE trail_entries SET ${column} = ${value} WHERE seq = ?`, [victim()]);
      const v = await verifyTrailChain();
      expect(v.ok).toBe(false);
      expect(v.firstBroken?.seq).toBe(victim());
    });
  }

  it("when an entry in the middle is deleted, then verification reports the missing sequence number", async () => {
    await sql("DELETE FROM trail_entries WHERE seq = ?", [victim()]);
    const v = await verifyTrailChain();
    expect(v.firstBroken).toEqual({ seq: victim(), reason: `entry ${victim()} is missing` });
  });

  it("when the tail is cut off, then the checkpoint outside the table catches it", async () => {
    const last = Number(base.events.at(-1)!.seq);
    await sql("DELETE FROM trail_entries WHERE seq >= ?", [last - 1]);
    const v = await verifyTrailChain();
    expect(v.ok).toBe(false);
    expect(v.firstBroken?.seq).toBe(last - 1);
  });

  it("when an entry is rewritten with a recomputed hash, then the next entry's link exposes it", async () => {
    const seq = victim();
    const row = base.events.find((e) => Number(e.seq) === seq)!;
    await sql("UPDATE trail_entries SET hash = ? WHERE seq = ?", [sha256(`forged${row.hash}`), seq]);
    const v = await verifyTrailChain();
    expect(v.ok).toBe(false);
    expect(v.firstBroken?.seq).toBe(seq);
  });
});

describe("an organisation's own entries", () => {
  const ofBuyer = () => base.events.filter((e) => Number(e.organisation_id) === buyerOrg);
  const lastOfBuyer = () => Number(ofBuyer().at(-1)!.seq);

  it("when nothing was touched, then every entry about the organisation checks, and only those", async () => {
    const v = await verifyOrganisationEntries(buyerOrg);
    expect(v).toMatchObject({ ok: true, checked: ofBuyer().length });
    expect(v.checked).toBeLessThan(base.events.length);
  });

  it("when one of its entries is changed, then that entry is reported", async () => {
    const seq = Number(ofBuyer().at(-2)!.seq);
    await sql("UPDATE trail_entries SET details = '{\"i\":42}' WHERE seq = ?", [seq]);
    expect((await verifyOrganisationEntries(buyerOrg)).firstBroken?.seq).toBe(seq);
  });

  it("when one of its entries is rewritten with a recomputed hash, then the link of the entry after it exposes it", async () => {
    const seq = Number(ofBuyer().at(-2)!.seq);
    const row = base.events.find((e) => Number(e.seq) === seq)!;
    await sql("UPDATE trail_entries SET hash = ? WHERE seq = ?", [sha256(`forged${row.hash}`), seq]);
    const v = await verifyOrganisationEntries(buyerOrg);
    expect(v.ok).toBe(false);
    expect([seq, seq + 1]).toContain(v.firstBroken?.seq);
  });

  it("when its latest entry is cut off the tail, then the checkpoint catches it", async () => {
    await sql("DELETE FROM trail_entries WHERE seq >= ?", [lastOfBuyer()]);
    expect((await verifyOrganisationEntries(buyerOrg)).ok).toBe(false);
  });

  it("when a member asks the API, then it checks their organisation's entries, not the platform's chain", async () => {
    const tech = await signInAs(t.app, DEMO.buyerTechnologist);
    // Signing in is itself recorded, so the count is read after it.
    const [{ n }] = (await t.sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM trail_entries WHERE organisation_id = ?", {
      replacements: [buyerOrg],
      type: QueryTypes.SELECT,
    })) as [{ n: number }];
    const v = (await tech.agent.get(`/api/orgs/${buyerOrg}/trail/verify`)).body;
    expect(v).toMatchObject({ ok: true, checked: Number(n) });
    expect(Number(n)).toBeLessThan(Number(v.lastSeq));
  });
});
