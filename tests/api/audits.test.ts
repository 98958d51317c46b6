/**
 * The independent laboratory's side of a paid audit: blind submission, comparison with the producer's
 * declared results, deviations for discrepancies, the finance dashboard and the certificate of conformity.
 * Expected scores are worked by hand from the ISO 13528 formulas (clause numbers from memory: 9.7 En = (x − X)/√(U_x² + U_X²), |En| ≤ 1
 * satisfactory) and 9.4 (z = (x − X)/σ_pt; |z| ≤ 2 satisfactory, 2 < |z| < 3 questionable, ≥ 3 unsatisfactory).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, getPdf, ORG, signInAs, type SignedInAgent, type TestApp, CONTRACT } from "../support/api.ts";
import { signed, succeededEvent, TEST_WEBHOOK_SECRET } from "../support/stripe-events.ts";
import { paymentStarted } from "../support/factories.ts";
import { matchPath } from "react-router-dom";
import { ROUTES } from "../../shared/paths.ts";

let t: TestApp;
let producer: SignedInAgent;
let finance: SignedInAgent;
let tech: SignedInAgent;
let lab: SignedInAgent;
let lotId: number;
let orderId: number;
let amount: number;
const lotCode = `SB-AUD-${randomUUID().slice(0, 6)}`;

const P = (p: string) => `/api/orgs/${ORG.troisSentes}${p}`;
const B = (p: string) => `/api/orgs/${ORG.retailer}${p}`;
const L = (p: string) => `/api/orgs/${ORG.lab}${p}`;
const expanded = (value: number) => ({ kind: "expanded", value, k: 2 });
const labResults = (over: Partial<Record<string, string>> = {}) => [
  {
    parameter: "volatile_acidity",
    raw: over.volatile_acidity ?? "0.48",
    unit: "g/L as acetic acid",
    uncertainty: expanded(0.03),
    method: "OIV-MA-AS313-02",
  },
  { parameter: "free_so2", raw: over.free_so2 ?? "31", unit: "mg/L", uncertainty: expanded(3) },
  { parameter: "alcohol", raw: "12.55", unit: "% vol", uncertainty: expanded(0.1) },
];

beforeAll(async () => {
  t = buildTestApp({ STRIPE_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET });
  [producer, finance, tech, lab] = (await Promise.all(
    [DEMO.producerQuality, DEMO.buyerFinance, DEMO.buyerTechnologist, DEMO.labAnalyst].map((e) => signInAs(t.app, e)),
  )) as [SignedInAgent, SignedInAgent, SignedInAgent, SignedInAgent];
  const lot = await producer.agent.post(P("/lots")).set("x-csrf-token", producer.csrf).send({
    contractId: CONTRACT.sentierBlanc,
    vintage: 2025,
    lotCode,
    volumeLitres: 9000,
    container: "bottles",
    plannedDate: "2027-02-01",
    market: "EU",
  });
  expect(lot.status).toBe(201);
  lotId = lot.body.id;
  const declared = await producer.agent
    .post(P(`/lots/${lotId}/analyses`))
    .set("x-csrf-token", producer.csrf)
    .send({
      idempotencyKey: randomUUID(),
      stage: "pre_filling",
      laboratoryName: "Domaine des Trois Sentes cellar laboratory",
      sampleDate: "2026-11-20",
      results: [
        { parameter: "volatile_acidity", raw: "0.40", unit: "g/L as acetic acid", uncertainty: expanded(0.03) },
        { parameter: "free_so2", raw: "30", unit: "mg/L", uncertainty: expanded(3) },
        { parameter: "alcohol", raw: "12.5", unit: "% vol", uncertainty: expanded(0.1) },
      ],
    });
  expect(declared.status).toBe(201);
  const order = await finance.agent
    .post(B("/audit-orders"))
    .set("x-csrf-token", finance.csrf)
    .send({
      idempotencyKey: randomUUID(),
      contractId: CONTRACT.sentierBlanc,
      laboratoryOrgId: ORG.lab,
      lotIds: [lotId],
      parameters: ["volatile_acidity", "free_so2", "alcohol"],
      stage: "pre_filling",
    });
  expect(order.status).toBe(201);
  orderId = order.body.id;
  amount = order.body.amountCents;
});
afterAll(() => t.close());

async function pay() {
  await paymentStarted(orderId);
  const { payload, header } = signed(succeededEvent(orderId, amount));
  const res = await request(t.app)
    .post("/api/webhooks/stripe")
    .set("content-type", "application/json")
    .set("stripe-signature", header)
    .send(payload);
  expect(res.status).toBe(200);
}

describe("the laboratory's side", () => {
  it("sees the order only once it is paid, and works blind to the producer's values", async () => {
    expect((await lab.agent.get(L(`/audit-orders/${orderId}`))).status).toBe(404);
    await pay();
    // Regression: the laboratory's in-app notification (and so its e-mail) points at the order page the client serves.
    const notes = (await lab.agent.get("/api/me/notifications")).body.items as { title: string; link: string }[];
    const note = notes.find((n) => n.title.startsWith("New paid audit"))!;
    expect(matchPath(ROUTES.order, note.link)?.params.orderId).toBe(String(orderId));
    const list = await lab.agent.get(L("/audit-orders"));
    expect(list.body.items.map((o: { id: number }) => o.id)).toContain(orderId);
    const detail = await lab.agent.get(L(`/audit-orders/${orderId}`));
    expect(detail.status).toBe(200);
    expect(detail.body.actions.submitResults).toBe(true);
    expect(detail.body.amountCents).toBe(0);
    expect(detail.body.payments).toEqual([]);
    expect(detail.body.lots[0].comparisons).toEqual([]);
    expect(detail.body.lots[0].declaredAnalysisId).toBeNull();
  });

  it("refuses results that miss an ordered parameter or add one not ordered, naming it", async () => {
    const missing = await lab.agent
      .post(L(`/audit-orders/${orderId}/results`))
      .set("x-csrf-token", lab.csrf)
      .send({ idempotencyKey: randomUUID(), sampleDate: "2026-11-28", lots: [{ lotId, results: labResults().slice(0, 2) }] });
    expect(missing.status).toBe(400);
    expect(missing.body.errors).toContainEqual({ path: "lots.0.results", message: "Missing Actual alcoholic strength." });
    const extra = await lab.agent
      .post(L(`/audit-orders/${orderId}/results`))
      .set("x-csrf-token", lab.csrf)
      .send({
        idempotencyKey: randomUUID(),
        sampleDate: "2026-11-28",
        lots: [{ lotId, results: [...labResults(), { parameter: "ph", raw: "3.2", unit: "pH" }] }],
      });
    expect(extra.status).toBe(400);
    expect(extra.body.errors[0].message).toBe("pH was not ordered.");
    expect(
      (
        await producer.agent
          .post(P(`/audit-orders/${orderId}/results`))
          .set("x-csrf-token", producer.csrf)
          .send({})
      ).status,
    ).toBe(403);
  });

  it("submits once (a retry with the same key gets the same answer); a discrepancy opens an audit deviation", async () => {
    const body = {
      idempotencyKey: randomUUID(),
      sampleDate: "2026-11-28",
      accreditation: "ISO/IEC 17025 no. 4471",
      reportReference: "NG-26-1187",
      lots: [{ lotId, results: labResults() }],
    };
    const first = await lab.agent
      .post(L(`/audit-orders/${orderId}/results`))
      .set("x-csrf-token", lab.csrf)
      .send(body);
    expect(first.status).toBe(201);
    expect(first.body.discrepancies).toEqual([{ lotId, parameters: ["volatile_acidity"] }]);
    const retry = await lab.agent
      .post(L(`/audit-orders/${orderId}/results`))
      .set("x-csrf-token", lab.csrf)
      .send(body);
    expect(retry.status).toBe(200);
    expect(retry.body).toEqual(first.body);
    const again = await lab.agent
      .post(L(`/audit-orders/${orderId}/results`))
      .set("x-csrf-token", lab.csrf)
      .send({ ...body, idempotencyKey: randomUUID() });
    expect(again.status).toBe(409);
  });

  it("scores each result against the independent laboratory's (hand-worked ISO 13528 values)", async () => {
    const o = (await tech.agent.get(B(`/audit-orders/${orderId}`))).body;
    expect(o.status).toBe("completed");
    const c = Object.fromEntries(o.lots[0].comparisons.map((x: { parameter: string }) => [x.parameter, x]));
    // VA: (0.40 − 0.48) / √(0.03² + 0.03²) = −1.8856: unsatisfactory.
    expect(c.volatile_acidity.en).toBeCloseTo(-1.8856, 3);
    expect(c.volatile_acidity.outcome).toBe("discrepant");
    // Free SO2: (30 − 31) / √(3² + 3²) = −0.2357; z = (30 − 31) / (0.10 × 31) = −0.3226 (σ_pt = the catalogue's 10 % default).
    expect(c.free_so2.en).toBeCloseTo(-0.2357, 3);
    expect(c.free_so2.z).toBeCloseTo(-0.3226, 3);
    expect(c.free_so2.outcome).toBe("agrees");
    // Alcohol: (12.50 − 12.55) / √(0.1² + 0.1²) = −0.3536.
    expect(c.alcohol.en).toBeCloseTo(-0.3536, 3);
    expect(o.deviationIds.length).toBeGreaterThanOrEqual(1);
    expect(o.reportReference).toBe("NG-26-1187");
  });

  it("the laboratory reads the deviations of its audit, and only those, without taking part", async () => {
    const o = (await finance.agent.get(B(`/audit-orders/${orderId}`))).body;
    const list = await lab.agent.get(L("/deviations?limit=200"));
    expect(list.status).toBe(200);
    const ids = list.body.items.map((d: { id: number }) => d.id);
    for (const id of o.deviationIds) expect(ids).toContain(id);
    const audit = list.body.items.find((d: { kind: string; lotId: number }) => d.kind === "audit" && d.lotId === lotId);
    expect(audit.summary).toMatch(/Volatile acidity \(En = -1\.89/);
    const detail = await lab.agent.get(L(`/deviations/${audit.id}`));
    expect(detail.status).toBe(200);
    expect(detail.body.side).toBe("laboratory");
    expect(Object.values(detail.body.actions).every((a) => a === false)).toBe(true);
    expect(
      (
        await lab.agent
          .post(L(`/deviations/${audit.id}/messages`))
          .set("x-csrf-token", lab.csrf)
          .send({ kind: "comment", body: "Our result stands." })
      ).status,
    ).toBe(403);
    // A deviation that no audit of this laboratory opened stays invisible to it.
    const other = await producer.agent
      .post(P("/deviations"))
      .set("x-csrf-token", producer.csrf)
      .send({ lotId, parameters: ["ph"], reason: "Capsule batch changed on the line; checking the lot." });
    expect(other.status).toBe(201);
    expect((await lab.agent.get(L(`/deviations/${other.body.id}`))).status).toBe(404);
    expect((await lab.agent.get(L("/deviations?limit=200"))).body.items.map((d: { id: number }) => d.id)).not.toContain(other.body.id);
    const valsorda = await signInAs(t.app, DEMO.valsordaQuality);
    expect((await valsorda.agent.get(`/api/orgs/${ORG.valsorda}/deviations/${audit.id}`)).status).toBe(404);
  });

  it("the producer sees the comparison on its lot once the results are in", async () => {
    const lot = await producer.agent.get(P(`/lots/${lotId}`));
    expect(lot.body.audits[0].reference).toMatch(/^AUD-\d{5}$/);
    expect(lot.body.audits[0].comparisons).toHaveLength(3);
    const audited = lot.body.analyses.filter((a: { auditOrderId: number | null }) => a.auditOrderId === orderId);
    expect(audited).toHaveLength(1);
    // Judged on the ordered parameters only: the spec's other rows are not "missing" from an audit.
    expect(audited[0].evaluation.verdicts.map((v: { parameter: string }) => v.parameter).sort()).toEqual([
      "alcohol",
      "free_so2",
      "volatile_acidity",
    ]);
    const upload = await producer.agent
      .post(P(`/analyses/${audited[0].id}/certificates`))
      .set("x-csrf-token", producer.csrf)
      .attach("file", Buffer.from("%PDF-1.4\n%%EOF\n"), "report.pdf");
    expect(upload.status).toBe(403);
    // The laboratory attaches its own report to its analysis; both parties can then read it.
    const report = await lab.agent
      .post(L(`/analyses/${audited[0].id}/certificates`))
      .set("x-csrf-token", lab.csrf)
      .attach("file", Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n"), "NG-26-1187.pdf");
    expect(report.status).toBe(201);
    const withReport = await producer.agent.get(P(`/lots/${lotId}`));
    const cert = withReport.body.analyses.find((a: { id: number }) => a.id === audited[0].id).certificates[0];
    expect(cert.originalName).toBe("NG-26-1187.pdf");
    expect((await tech.agent.get(B(`/certificates/${cert.id}`))).status).toBe(200);
    expect((await lab.agent.get(L(`/certificates/${cert.id}`))).status).toBe(200);
    // Served with the type found in its bytes at upload, whatever its name says (OWASP File Upload Cheat Sheet).
    const own = withReport.body.analyses.find((a: { auditOrderId: number | null }) => a.auditOrderId === null);
    const misnamed = await producer.agent
      .post(P(`/analyses/${own.id}/certificates`))
      .set("x-csrf-token", producer.csrf)
      .attach("file", Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n"), "NG-26-1188.html");
    expect(misnamed.status).toBe(201);
    const servedAs = await producer.agent.get(P(`/certificates/${misnamed.body.id}`));
    expect(servedAs.headers["content-type"]).toMatch(/^application\/pdf/);
    expect(servedAs.headers["content-disposition"]).toContain("NG-26-1188.html");
    // Regression: the laboratory reads back the values it sent, and the buyer's order links its signed report.
    const labView = (await lab.agent.get(L(`/audit-orders/${orderId}`))).body;
    const sentValues = Object.fromEntries(
      labView.lots[0].verdicts.map((v: { parameter: string; resultText: string }) => [v.parameter, v.resultText]),
    );
    expect(sentValues).toEqual({ free_so2: "31", volatile_acidity: "0.48", alcohol: "12.55" });
    const buyerView = (await tech.agent.get(B(`/audit-orders/${orderId}`))).body;
    expect(buyerView.lots[0].reports).toEqual([{ id: cert.id, originalName: "NG-26-1187.pdf" }]);
    // Not on the producer's own analyses, though.
    const declaredId = withReport.body.analyses.find((a: { auditOrderId: number | null }) => a.auditOrderId === null).id;
    expect(
      (
        await lab.agent
          .post(L(`/analyses/${declaredId}/certificates`))
          .set("x-csrf-token", lab.csrf)
          .attach("file", Buffer.from("%PDF-1.4\n%%EOF\n"), "x.pdf")
      ).status,
    ).toBe(404);
  });
});

describe("the lot's document", () => {
  it("when required results are missing, then the document is an analysis statement with the lot's status, parties, results, the audit and the caution", async () => {
    const lot = await tech.agent.get(B(`/lots/${lotId}`));
    // The declared pre-filling analysis has 3 of the spec's rows, so the lot cannot be certified.
    expect(lot.body.status).toMatchObject({ code: "incomplete", label: "Results incomplete" });
    const { status, type, text } = await getPdf(tech.agent, B(`/lots/${lotId}/conformity.pdf`));
    expect(status).toBe(200);
    expect(type).toBe("application/pdf");
    expect(text).not.toContain("Certificate of conformity");
    for (const needle of [
      "Analysis statement",
      "Status: Results incomplete",
      "Required results are missing",
      "This is not a certificate of conformity",
      `Lot ${lotCode}`,
      "Harbourline Grocers",
      "Domaine des Trois Sentes",
      "version 1 (agreed",
      "judged against spec version 1",
      "Volatile acidity",
      "0.40 ± 0.03 g/L as acetic acid",
      "max 0.60 g/L as acetic acid (buyer)",
      "Northgate Oenology Laboratory",
      "report NG-26-1187",
      "discrepant",
      "Decision rule",
      "The independent audit disagrees with the declared results",
      "does not replace the test report of an accredited laboratory",
    ]) {
      expect(text).toContain(needle);
    }
    expect((await producer.agent.get(P(`/lots/${lotId}/conformity.pdf`))).status).toBe(200);
    const valsorda = await signInAs(t.app, DEMO.valsordaQuality);
    expect((await valsorda.agent.get(`/api/orgs/${ORG.valsorda}/lots/${lotId}/conformity.pdf`)).status).toBe(404);
  });

  it("when a lot has no judged results, then no document is issued", async () => {
    const empty = await producer.agent
      .post(P("/lots"))
      .set("x-csrf-token", producer.csrf)
      .send({
        contractId: CONTRACT.sentierBlanc,
        vintage: 2025,
        lotCode: `SB-EMPTY-${randomUUID().slice(0, 6)}`,
        volumeLitres: 100,
        container: "bottles",
        market: "EU",
      });
    const res = await producer.agent.get(P(`/lots/${empty.body.id}/conformity.pdf`));
    expect(res.status).toBe(409);
    expect(res.body.detail).toMatch(/no results judged against an agreed specification/);
  });
});

describe("finance dashboard and price lists", () => {
  it("sums spend per producer and month, and lists what is outstanding", async () => {
    const res = await finance.agent.get(B("/audit-dashboard"));
    expect(res.status).toBe(200);
    const d = res.body;
    expect(d.currency).toBe("eur");
    const trois = d.byProducer.find((p: { producerName: string }) => p.producerName === "Domaine des Trois Sentes");
    expect(trois.paidCents).toBeGreaterThanOrEqual(amount);
    expect(d.totals.paidCents).toBe(d.byProducer.reduce((s: number, p: { paidCents: number }) => s + p.paidCents, 0));
    expect(d.totals.paidCents).toBe(d.byMonth.reduce((s: number, m: { paidCents: number }) => s + m.paidCents, 0));
    expect(d.totals.outstandingCents).toBe(d.outstanding.reduce((s: number, o: { amountCents: number }) => s + o.amountCents, 0));
    expect(d.outstanding.some((o: { producerName: string }) => o.producerName === "Kestrel Flats Estate")).toBe(true);
    // Regression: the demo's unpaid Kestrel Flats order is outstanding, not spend: it counts in no month and in no paid total.
    expect(d.byProducer.some((p: { producerName: string }) => p.producerName === "Kestrel Flats Estate")).toBe(false);
    expect(d.totals.paidOrders).toBe(d.byMonth.reduce((s: number, m: { paidOrders: number }) => s + m.paidOrders, 0));
    expect(d.totals.paidOrders).toBe(d.totals.orders - d.outstanding.length);
    expect((await tech.agent.get(B("/audit-dashboard"))).status).toBe(403);
  });

  it("a laboratory's admin replaces its price list; nobody else can", async () => {
    const admin = await signInAs(t.app, DEMO.labAdmin);
    const current = (await admin.agent.get(L("/price-list"))).body.items as { parameter: string; priceCents: number }[];
    const changed = current.map((i) => (i.parameter === "ph" ? { ...i, priceCents: 950 } : i));
    const put = await admin.agent.put(L("/price-list")).set("x-csrf-token", admin.csrf).send({ items: changed });
    expect(put.status).toBe(200);
    expect(put.body.items.find((i: { parameter: string }) => i.parameter === "ph").priceCents).toBe(950);
    const bad = await admin.agent
      .put(L("/price-list"))
      .set("x-csrf-token", admin.csrf)
      .send({ items: [{ parameter: "ph", priceCents: 9.5 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].message).toBe("Prices are in whole cents.");
    expect((await lab.agent.put(L("/price-list")).set("x-csrf-token", lab.csrf).send({ items: current })).status).toBe(403);
    const retailerAdmin = await signInAs(t.app, DEMO.retailerAdmin);
    const notLab = await retailerAdmin.agent.put(B("/price-list")).set("x-csrf-token", retailerAdmin.csrf).send({ items: current });
    expect(notLab.status).toBe(403);
    expect((await admin.agent.put(L("/price-list")).set("x-csrf-token", admin.csrf).send({ items: current })).status).toBe(200);
  });
});
