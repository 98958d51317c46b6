/**
 * Paged lists: keyset cursors (each page continues after the last row's sort key), filters applied
 * in SQL before paging, a total that counts every match, and the readiness board's order (due date
 * soonest first, undated lots last, nothing beyond the chosen horizon). The parties are a retailer
 * and a producer of this file's own, so no other test's rows are on their lists.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, signInAs, type SignedInAgent, type TestApp } from "../support/api.ts";
import { agreedContract, analysed, inDays, member, organisation, platformAdmin, plannedLot, type Party } from "../support/factories.ts";
import type { LotSummary, ReadinessRow } from "../../shared/lots/views.ts";
import type { DeviationSummaryView } from "../../shared/deviations/views.ts";
import type { Page } from "../../shared/paging.ts";
import { createVersion } from "../../server/services/specs/spec-lifecycle.ts";
import { listSpecs } from "../../server/services/specs/spec-queries.ts";

let t: TestApp;
let buyer: Party;
let producer: Party;
let agent: SignedInAgent;
let contractId: number;
const password = `pw-${randomUUID()}`;
const L = (p: string) => `/api/orgs/${buyer.orgId}${p}`;

/** Every page of a list, following the cursors; fails if a page comes back other than 200. */
async function allPages<T>(path: string, from: string | null = null): Promise<{ pages: Page<T>[]; rows: T[] }> {
  const pages: Page<T>[] = [];
  let cursor: string | null = from;
  do {
    const sep = path.includes("?") ? "&" : "?";
    const res = await agent.agent.get(`${path}${cursor ? `${sep}cursor=${encodeURIComponent(cursor)}` : ""}`);
    expect(res.status).toBe(200);
    pages.push(res.body as Page<T>);
    cursor = (res.body as Page<T>).nextCursor;
  } while (cursor && pages.length < 50);
  return { pages, rows: pages.flatMap((p) => p.items) };
}

beforeAll(async () => {
  t = buildTestApp();
  const admin = await platformAdmin(DEMO.platformAdmin);
  const retailerId = await organisation(admin, { kind: "retailer", name: `Paging Retail ${randomUUID().slice(0, 6)}` });
  const producerId = await organisation(admin, { kind: "producer", name: `Paging Estate ${randomUUID().slice(0, 6)}`, country: "FR" });
  const email = `paging.${randomUUID().slice(0, 8)}@example.test`;
  buyer = await member(retailerId, "buyer_technologist", { email, password });
  producer = await member(producerId, "producer_quality");
  ({ contractId } = await agreedContract(buyer, producer, { vintageFrom: 2020 }));
  agent = await signInAs(t.app, email, password);
  // Seven lots over three vintages; four are dated within the month, one far off, two undated.
  const lots: [string, number, string | null][] = [
    ["PG-A", 2025, inDays(9)],
    ["PG-B", 2025, inDays(3)],
    ["PG-C", 2024, inDays(9)],
    ["PG-D", 2024, null],
    ["PG-E", 2023, inDays(200)],
    ["PG-F", 2025, null],
    ["PG-G", 2023, inDays(20)],
  ];
  for (const [lotCode, vintage, plannedDate] of lots) {
    const { id } = await plannedLot(producer, contractId, { lotCode, vintage, plannedDate });
    // Three of them fail volatile acidity, so the deviations list has rows to page.
    if (["PG-A", "PG-C", "PG-E"].includes(lotCode)) await analysed(producer, id, "pre_filling", { volatile_acidity: "0.95" });
  }
});

describe("the lots list", () => {
  it("when the lots are read three at a time, then the pages hold every lot once, newest vintage first, and each says the total", async () => {
    const { pages, rows } = await allPages<LotSummary>(L("/lots?limit=3"));
    expect(pages.map((p) => p.items.length)).toEqual([3, 3, 1]);
    expect(pages.map((p) => p.total)).toEqual([7, 7, 7]);
    expect(pages.at(-1)!.nextCursor).toBeNull();
    expect(rows.map((l) => l.lotCode)).toEqual(["PG-A", "PG-B", "PG-F", "PG-C", "PG-D", "PG-E", "PG-G"]);
  });

  it("when a filter is set, then it applies before paging and the total counts only what matches", async () => {
    const { pages, rows } = await allPages<LotSummary>(L(`/lots?limit=1&contract=${contractId}&q=PG-E`));
    expect(rows.map((l) => l.lotCode)).toEqual(["PG-E"]);
    expect(pages[0]!.total).toBe(1);
  });

  it("when a lot is added between two pages, then the next page neither repeats nor skips a lot that was there", async () => {
    const first = (await agent.agent.get(L("/lots?limit=2"))).body as Page<LotSummary>;
    await plannedLot(producer, contractId, { lotCode: "PG-AA", vintage: 2026, plannedDate: null });
    const rest = await allPages<LotSummary>(L("/lots?limit=2"), first.nextCursor);
    const seen = [...first.items, ...rest.rows].map((l) => l.lotCode);
    expect(new Set(seen).size).toBe(seen.length);
    for (const code of ["PG-A", "PG-B", "PG-C", "PG-D", "PG-E", "PG-F", "PG-G"]) expect(seen).toContain(code);
  });

  it("when the cursor is not one the list gave, or the page is too large, then the answer is 400 on that field", async () => {
    const forged = await agent.agent.get(L("/lots?cursor=bm90LWEtY3Vyc29y"));
    expect(forged.status).toBe(400);
    expect(forged.body.errors[0]).toMatchObject({ path: "query.cursor" });
    const huge = await agent.agent.get(L("/lots?limit=5000"));
    expect(huge.status).toBe(400);
    expect(huge.body.errors[0]).toMatchObject({ path: "query.limit", message: "A page holds at most 200 rows." });
  });
});

describe("the readiness board", () => {
  it("when the horizon is 30 days, then dated lots come soonest first, undated ones after them, and a lot due later is left out", async () => {
    const { rows, pages } = await allPages<ReadinessRow>(L("/readiness?limit=2&horizon=30"));
    expect(rows.map((r) => r.lotCode)).toEqual(["PG-B", "PG-A", "PG-C", "PG-G", "PG-AA", "PG-D", "PG-F"]);
    expect(pages[0]!.total).toBe(7);
  });

  it("when the horizon is a year, then the lot due in 200 days is on the board, before the undated ones", async () => {
    const { rows } = await allPages<ReadinessRow>(L("/readiness?horizon=365"));
    expect(rows.map((r) => r.lotCode)).toEqual(["PG-B", "PG-A", "PG-C", "PG-G", "PG-E", "PG-AA", "PG-D", "PG-F"]);
  });
});

describe("the deviations list", () => {
  it("when the deviations are read two at a time, then every one comes once, newest first", async () => {
    const { rows, pages } = await allPages<DeviationSummaryView>(L("/deviations?limit=2"));
    expect(rows.map((d) => d.lotCode)).toEqual(["PG-E", "PG-C", "PG-A"]);
    expect(pages.map((p) => p.items.length)).toEqual([2, 1]);
    const open = await allPages<DeviationSummaryView>(L("/deviations?limit=2&overdue=false&status=open"));
    expect(open.pages[0]!.total).toBe(3);
  });
});

describe("notifications", () => {
  it("when the buyer's notifications are read two at a time, then each comes once, newest first, and the unread count covers them all", async () => {
    const { rows, pages } = await allPages<{ id: number; read: boolean }>("/api/me/notifications?limit=2");
    expect(rows.length).toBeGreaterThanOrEqual(3);
    expect(rows.map((n) => n.id)).toEqual([...rows.map((n) => n.id)].sort((a, b) => b - a));
    expect(pages[0]!.total).toBe(rows.length);
    expect((pages[0] as unknown as { unread: number }).unread).toBe(rows.filter((n) => !n.read).length);
  });
});

describe("the spec versions list", () => {
  it("when versions are read two at a time, then each comes once, newest change first, and the producer's list leaves the buyer's draft out", async () => {
    await agreedContract(buyer, producer, { vintageFrom: 2021 });
    const { contractId: third } = await agreedContract(buyer, producer, { vintageFrom: 2022 });
    const draft = await createVersion(buyer.orgId, third, buyer.user, { from: "blank" });
    const { rows, pages } = await allPages<{ id: number; updatedAt: string; status: string }>(L("/specs?limit=2"));
    expect(rows).toHaveLength(4);
    expect(pages.map((p) => p.items.length)).toEqual([2, 2]);
    expect(rows.map((v) => v.updatedAt)).toEqual([...rows.map((v) => v.updatedAt)].sort().reverse());
    expect(rows.map((v) => v.id)).toContain(draft.id);
    const mine = (await listSpecs(producer.orgId, { limit: 200 })).items.map((v) => v.id);
    expect(mine).toHaveLength(3);
    expect(mine).not.toContain(draft.id);
  });
});
