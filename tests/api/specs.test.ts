import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { buildTestApp, CONTRACT, DEMO, ORG, signInAs, type SignedInAgent, type TestApp } from "../support/api.ts";
import { specDraftSchema } from "../../shared/specs/schemas.ts";
import { findParameter } from "../../shared/engine/index.ts";

let t: TestApp;
let buyer: SignedInAgent;
let producer: SignedInAgent;
let valsorda: SignedInAgent;
// API tests work on the Valsorda contract; the browser journey has Sentier Rouge to itself.
const VALSORDA = 4;
const KESTREL = 3;

beforeAll(async () => {
  t = buildTestApp();
  buyer = await signInAs(t.app, DEMO.buyerTechnologist);
  producer = await signInAs(t.app, DEMO.producerQuality);
  valsorda = await signInAs(t.app, DEMO.valsordaQuality);
});
afterAll(() => t.close());

const buyerUrl = (p: string) => `/api/orgs/${ORG.retailer}${p}`;
const producerUrl = (p: string) => `/api/orgs/${ORG.troisSentes}${p}`;
const valsordaUrl = (p: string) => `/api/orgs/${ORG.valsorda}${p}`;

async function newDraft(from: object = { from: "template", templateId: "still-red" }) {
  const res = await buyer.agent
    .post(buyerUrl(`/contracts/${VALSORDA}/specs`))
    .set("x-csrf-token", buyer.csrf)
    .send(from);
  expect(res.status).toBe(201);
  return (await buyer.agent.get(buyerUrl(`/specs/${res.body.id}`))).body;
}

const draftBody = (
  v: { lockVersion: number; vintageFrom: number; stages: string[]; requirements: Record<string, unknown>[] },
  rows = v.requirements,
) => ({
  lockVersion: v.lockVersion,
  title: "Test",
  vintageFrom: v.vintageFrom,
  vintageTo: null,
  stages: v.stages,
  rows: rows.map(({ id: _id, ...r }) => r),
});

describe("spec sheet lifecycle and authorization", () => {
  it("when the buyer drafts from a template, saves, sends and the producer comments and agrees, then the version governs and is immutable", async () => {
    const v = await newDraft();
    expect(v.status).toBe("draft");
    expect(v.requirements.length).toBeGreaterThan(5);
    // The producer cannot see a draft at all, and a producer not on the contract never sees it.
    expect((await valsorda.agent.get(valsordaUrl(`/specs/${v.id}`))).status).toBe(404);
    expect((await producer.agent.get(producerUrl(`/specs/${v.id}`))).status).toBe(404);

    const saved = await buyer.agent
      .put(buyerUrl(`/specs/${v.id}`))
      .set("x-csrf-token", buyer.csrf)
      .send(draftBody(v));
    expect(saved.status).toBe(200);
    expect(saved.body.lockVersion).toBe(v.lockVersion + 1);

    expect((await buyer.agent.post(buyerUrl(`/specs/${v.id}/send`)).set("x-csrf-token", buyer.csrf)).status).toBe(204);
    const again = await buyer.agent
      .put(buyerUrl(`/specs/${v.id}`))
      .set("x-csrf-token", buyer.csrf)
      .send(draftBody({ ...v, lockVersion: saved.body.lockVersion }));
    expect(again.status).toBe(409);

    const seen = (await valsorda.agent.get(valsordaUrl(`/specs/${v.id}`))).body;
    expect(seen.actions).toMatchObject({ decide: true, comment: true, edit: false });
    const comment = await valsorda.agent
      .post(valsordaUrl(`/specs/${v.id}/comments`))
      .set("x-csrf-token", valsorda.csrf)
      .send({ requirementId: seen.requirements[0].id, body: "Our 2024 lots ran at 13.8 % vol." });
    expect(comment.status).toBe(201);
    // The buyer cannot agree on the producer's behalf: wrong role.
    expect((await buyer.agent.post(buyerUrl(`/specs/${v.id}/agree`)).set("x-csrf-token", buyer.csrf)).status).toBe(403);
    expect((await valsorda.agent.post(valsordaUrl(`/specs/${v.id}/agree`)).set("x-csrf-token", valsorda.csrf)).status).toBe(204);
    expect((await buyer.agent.get(buyerUrl(`/specs/${v.id}`))).body.status).toBe("agreed");
  });

  it("when another producer or another retailer asks for the contract or version, then 404", async () => {
    const other = await signInAs(t.app, DEMO.bulkProducerQuality);
    const v = (await buyer.agent.get(buyerUrl(`/contracts/${KESTREL}`))).body.versions[0];
    expect((await other.agent.get(`/api/orgs/${ORG.kestrelFlats}/specs/${v.id}`)).status).toBe(200);
    expect((await producer.agent.get(producerUrl(`/specs/${v.id}`))).status).toBe(404);
    expect((await producer.agent.get(producerUrl(`/contracts/${KESTREL}`))).status).toBe(404);
    expect((await producer.agent.get(producerUrl(`/contracts/${KESTREL}/results?parameters=free_so2`))).status).toBe(404);
    expect((await producer.agent.post(producerUrl(`/specs/${v.id}/agree`)).set("x-csrf-token", producer.csrf)).status).toBe(404);
    const lab = await signInAs(t.app, DEMO.labAdmin);
    expect((await lab.agent.get(`/api/orgs/${ORG.lab}/specs/${v.id}`)).status).toBe(404);
    expect((await lab.agent.get(`/api/orgs/${ORG.lab}/specs`)).body).toEqual({ items: [], nextCursor: null, total: 0 });
  });

  it("when only the owning buyer may edit, then the producer gets 403 for the role and 404 for a draft it cannot see", async () => {
    const v = await newDraft({ from: "blank" });
    expect(
      (
        await valsorda.agent
          .put(valsordaUrl(`/specs/${v.id}`))
          .set("x-csrf-token", valsorda.csrf)
          .send(draftBody(v))
      ).status,
    ).toBe(403);
    const finance = await signInAs(t.app, DEMO.buyerFinance);
    expect(
      (
        await finance.agent
          .put(buyerUrl(`/specs/${v.id}`))
          .set("x-csrf-token", finance.csrf)
          .send(draftBody(v))
      ).status,
    ).toBe(403);
  });

  it("when two saves race on one draft, then exactly one succeeds and the other gets 409 with nothing overwritten", async () => {
    const v = await newDraft();
    const rowsA = v.requirements.slice(0, 3);
    const rowsB = v.requirements.slice(0, 5);
    const [a, b] = await Promise.all([
      buyer.agent
        .put(buyerUrl(`/specs/${v.id}`))
        .set("x-csrf-token", buyer.csrf)
        .send(draftBody(v, rowsA)),
      buyer.agent
        .put(buyerUrl(`/specs/${v.id}`))
        .set("x-csrf-token", buyer.csrf)
        .send(draftBody(v, rowsB)),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? rowsA : rowsB;
    const stored = (await buyer.agent.get(buyerUrl(`/specs/${v.id}`))).body;
    expect(stored.requirements.map((r: { parameter: string }) => r.parameter)).toEqual(
      winner.map((r: { parameter: string }) => r.parameter),
    );
    expect((a.status === 409 ? a : b).body.detail).toMatch(/Reload to see their changes/);
  });
});

describe("bad input: the API enforces every editor validation with the same message", () => {
  const cases: [string, (rows: Record<string, unknown>[]) => Record<string, unknown>[], Record<string, unknown>?][] = [
    ["lower above upper", (rows) => [{ ...rows[0], lower: 15, upper: 12 }]],
    ["target outside the range", (rows) => [{ ...rows[0], lower: 12, upper: 14, target: 15 }]],
    ["unit that does not fit", (rows) => [{ ...rows[0], unit: "mg/L" }]],
    ["no limit at all", (rows) => [{ ...rows[0], lower: null, upper: null }]],
    ["duplicate parameter", (rows) => [rows[0]!, rows[0]!]],
    ["row stage outside the version", (rows) => [{ ...rows[0], stages: ["on_arrival"] }], { stages: ["pre_filling"] }],
    ["last vintage before the first", (rows) => rows, { vintageTo: 2000 }],
  ];
  for (const [name, mutate, extra] of cases) {
    it(`when a draft has ${name}, then the API answers 400 with the message the editor shows`, async () => {
      const v = await newDraft();
      const body = { ...draftBody(v, mutate(v.requirements)), ...extra };
      const client = specDraftSchema.safeParse(body);
      expect(client.success).toBe(false);
      const clientMessages = client.error!.issues.map((i) => i.message).sort();
      const res = await buyer.agent
        .put(buyerUrl(`/specs/${v.id}`))
        .set("x-csrf-token", buyer.csrf)
        .send(body);
      expect(res.status).toBe(400);
      expect((res.body.errors as { message: string }[]).map((e) => e.message).sort()).toEqual(clientMessages);
    });
  }

  it("when a draft's range becomes impossible with the law applied, then sending is refused per row", async () => {
    const v = await newDraft({ from: "blank" });
    const body = draftBody(v, [
      {
        parameter: "total_acidity",
        unit: "g/L as tartaric acid",
        lower: 2,
        upper: 3,
        rule: { kind: "simple" },
        severity: "major",
        stages: ["pre_filling"],
        method: null,
      },
    ]);
    expect(
      (
        await buyer.agent
          .put(buyerUrl(`/specs/${v.id}`))
          .set("x-csrf-token", buyer.csrf)
          .send(body)
      ).status,
    ).toBe(200);
    const sent = await buyer.agent.post(buyerUrl(`/specs/${v.id}/send`)).set("x-csrf-token", buyer.csrf);
    expect(sent.status).toBe(400);
    expect(sent.body.errors[0]).toMatchObject({ path: "rows.0.lower", message: expect.stringMatching(/no wine could conform/) });
  });
});

describe("past results for a backtest", () => {
  it("when the buyer asks for the last lots' results of some parameters, then only those come back, within the window", async () => {
    const all = await buyer.agent.get(
      buyerUrl(`/contracts/${CONTRACT.sentierRouge}/results?lots=2000&parameters=free_so2,volatile_acidity`),
    );
    expect(all.status).toBe(200);
    expect(all.body.truncated).toBe(false);
    expect(new Set(all.body.rows.map((r: { parameter: string }) => r.parameter))).toEqual(new Set(["free_so2", "volatile_acidity"]));
    const two = await buyer.agent.get(buyerUrl(`/contracts/${CONTRACT.sentierRouge}/results?lots=2&parameters=free_so2`));
    expect(two.body.lots).toBe(2);
    const lotsSeen = new Set(two.body.rows.map((r: { lotId: string }) => r.lotId));
    expect(lotsSeen.size).toBeLessThanOrEqual(2);
    // The window is the newest lots: no lot in it is of an older vintage than any lot left out.
    const vintagesIn = two.body.rows.map((r: { vintage: number }) => r.vintage);
    const vintagesAll = all.body.rows.map((r: { vintage: number }) => r.vintage);
    expect(Math.min(...vintagesIn)).toBeGreaterThanOrEqual(Math.max(...vintagesAll) - 1);
    expect(two.body.rows.every((r: { parameter: string }) => r.parameter === "free_so2")).toBe(true);
  });

  it("when the window or the parameters are out of bounds, then 400 names the field", async () => {
    const wide = await buyer.agent.get(buyerUrl(`/contracts/${CONTRACT.sentierRouge}/results?lots=100000&parameters=free_so2`));
    expect(wide.status).toBe(400);
    expect(wide.body.errors[0]).toMatchObject({ path: "query.lots", message: "The window holds at most 2000 lots." });
    const unknown = await buyer.agent.get(buyerUrl(`/contracts/${CONTRACT.sentierRouge}/results?parameters=free_so2,ghost`));
    expect(unknown.status).toBe(400);
    expect(unknown.body.errors[0]).toMatchObject({ path: "query.parameters", message: "Unknown parameter: ghost." });
    expect((await buyer.agent.get(buyerUrl(`/contracts/${CONTRACT.sentierRouge}/results`))).status).toBe(400);
  });
});

describe("PDF", () => {
  it("when the PDF of a version is downloaded, then pdftotext finds every parameter, the version and the parties", async () => {
    const contract = (await buyer.agent.get(buyerUrl(`/contracts/${CONTRACT.sentierBlanc}`))).body;
    const v = (await buyer.agent.get(buyerUrl(`/specs/${contract.versions[0].id}`))).body;
    const res = await buyer.agent
      .get(buyerUrl(`/specs/${v.id}/pdf`))
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on("data", (c: Buffer) => chunks.push(c));
        r.on("end", () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    const file = path.join(mkdtempSync(path.join(os.tmpdir(), "spec-pdf-")), "spec.pdf");
    writeFileSync(file, res.body as Buffer);
    const text = execFileSync("pdftotext", [file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    for (const r of v.requirements) expect(text).toContain(findParameter(r.parameter)!.name);
    expect(text).toContain("version 1");
    expect(text).toContain("Harbourline Grocers");
    expect(text).toContain("Domaine des Trois Sentes");
    expect(text).toContain("2019/934");
    const fonts = execFileSync("pdffonts", [file], { encoding: "utf8" });
    expect(fonts).toMatch(/SourceSans3.*yes/);
  });
});

describe("contracts", () => {
  const contract = (reference: string, producerOrgId: number = ORG.valsorda) => ({
    reference,
    producerOrgId,
    startsOn: "2026-01-01",
    endsOn: null,
    wine: {
      name: "Valsorda Bianco",
      colour: "white",
      category: "still",
      region: "Veneto",
      markets: ["EU"],
      nominalSugarGPerL: 3,
      nominalAlcoholPercentVol: 12,
    },
  });

  it("when the buyer opens a contract, then it is listed for both parties and the reference cannot be reused", async () => {
    const ref = `HG-T-${Date.now()}`;
    const res = await buyer.agent.post(buyerUrl("/contracts")).set("x-csrf-token", buyer.csrf).send(contract(ref));
    expect(res.status).toBe(201);
    expect((await valsorda.agent.get(valsordaUrl(`/contracts/${res.body.id}`))).body.reference).toBe(ref);
    expect((await buyer.agent.post(buyerUrl("/contracts")).set("x-csrf-token", buyer.csrf).send(contract(ref))).status).toBe(409);
  });

  it("when the producer named is not a producer, or the caller is not a buyer, then the contract is refused", async () => {
    const bad = await buyer.agent
      .post(buyerUrl("/contracts"))
      .set("x-csrf-token", buyer.csrf)
      .send(contract(`HG-X-${Date.now()}`, ORG.lab));
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0]).toEqual({ path: "producerOrgId", message: "Choose a producer organisation." });
    expect((await valsorda.agent.post(valsordaUrl("/contracts")).set("x-csrf-token", valsorda.csrf).send(contract("X-1"))).status).toBe(
      403,
    );
    const ends = await buyer.agent
      .post(buyerUrl("/contracts"))
      .set("x-csrf-token", buyer.csrf)
      .send({ ...contract("HG-Y"), endsOn: "2025-01-01" });
    expect(ends.body.errors).toEqual([{ path: "endsOn", message: "The contract cannot end before it starts." }]);
  });
});

describe("regressions found by using the spec sheets", () => {
  it("when the buyer starts a new version from an agreed one, then the copy is valid as it opens, so autosave can run", async () => {
    // Sentier Blanc's version 1 has rows that also require the on-arrival stage, which the version did not list.
    const agreed = (await buyer.agent.get(buyerUrl(`/contracts/${CONTRACT.sentierBlanc}`))).body.versions.find(
      (v: { number: number }) => v.number === 1,
    );
    const res = await buyer.agent
      .post(buyerUrl(`/contracts/${CONTRACT.sentierBlanc}/specs`))
      .set("x-csrf-token", buyer.csrf)
      .send({ from: "version", versionId: agreed.id });
    expect(res.status).toBe(201);
    const v = (await buyer.agent.get(buyerUrl(`/specs/${res.body.id}`))).body;
    const parsed = specDraftSchema.safeParse(draftBody(v));
    expect(parsed.success ? [] : parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`)).toEqual([]);
  });

  it("when a version is sent, commented on, sent back or agreed, then the other side is notified in the app", async () => {
    const titles = async (who: SignedInAgent) =>
      ((await who.agent.get("/api/me/notifications")).body.items as { title: string; link: string }[]).map((n) => `${n.title} → ${n.link}`);
    const v = await newDraft();
    expect((await buyer.agent.post(buyerUrl(`/specs/${v.id}/send`)).set("x-csrf-token", buyer.csrf)).status).toBe(204);
    expect(await titles(valsorda)).toContain(
      `Spec HG-C-2025-030 v${v.number} for Valsorda Rosato Frizzante is waiting for your review → /specs/${v.id}`,
    );
    const row = v.requirements[0];
    expect(
      (
        await valsorda.agent
          .post(valsordaUrl(`/specs/${v.id}/comments`))
          .set("x-csrf-token", valsorda.csrf)
          .send({ requirementId: row.id, body: "Could this be 0.5?" })
      ).status,
    ).toBe(201);
    expect(
      (await titles(buyer)).some((t) =>
        t.startsWith(`Giulia Ferrante commented on spec HG-C-2025-030 v${v.number} (${findParameter(row.parameter)!.name})`),
      ),
    ).toBe(true);
    expect(
      (
        await valsorda.agent
          .post(valsordaUrl(`/specs/${v.id}/request-changes`))
          .set("x-csrf-token", valsorda.csrf)
          .send({ reason: "Alcohol range too narrow for our 2025." })
      ).status,
    ).toBe(204);
    expect(await titles(buyer)).toContain(`Cantina Valsorda asked for changes to spec HG-C-2025-030 v${v.number} → /specs/${v.id}`);
    const again = await newDraft();
    expect((await buyer.agent.post(buyerUrl(`/specs/${again.id}/send`)).set("x-csrf-token", buyer.csrf)).status).toBe(204);
    expect((await valsorda.agent.post(valsordaUrl(`/specs/${again.id}/agree`)).set("x-csrf-token", valsorda.csrf)).status).toBe(204);
    expect(await titles(buyer)).toContain(`Cantina Valsorda agreed to spec HG-C-2025-030 v${again.number} → /specs/${again.id}`);
  });
});
