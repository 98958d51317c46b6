/**
 * One status per lot, from its analyses and the decisions on its deviations, read the same on the
 * lots list, the lot, the readiness board and the lot's document (read back with pdftotext).
 * The document follows ISO/IEC 17050-1:2004 (corrected 2007-06-15), clause 6.1, for what a
 * declaration of conformity contains (the clause's list is from memory).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, getPdf, ORG, signInAs, type SignedInAgent, type TestApp, CONTRACT } from "../support/api.ts";
import { setUpThreeLots, THREE_LOT_STATUSES, type ThreeLots } from "../support/three-lots.ts";
import { agreedContract, agreedVersion, party, plannedLot, reported } from "../support/factories.ts";
import type { SpecRowInput } from "../../shared/specs/schemas.ts";
import type { LotDetail, LotSummary, ReadinessRow, TrendData } from "../../shared/lots/views.ts";
import { chartDomain } from "../../src/features/lots/chart-domain.ts";

let t: TestApp;
let producer: SignedInAgent;
let tech: SignedInAgent;
const P = (p: string) => `/api/orgs/${ORG.troisSentes}${p}`;
const B = (p: string) => `/api/orgs/${ORG.retailer}${p}`;
const tag = randomUUID().slice(0, 5);
let lots: ThreeLots;
const buyer = () => party(DEMO.buyerTechnologist, "buyer_technologist");
/** A spec row holding only volatile acidity under `upper` g/L, at pre-filling. */
const vaRow = (upper: number): SpecRowInput => ({
  parameter: "volatile_acidity",
  unit: "g/L as acetic acid",
  lower: null,
  upper,
  target: null,
  rule: { kind: "simple" },
  severity: "major",
  stages: ["pre_filling"],
  method: null,
});

beforeAll(async () => {
  t = buildTestApp();
  [producer, tech] = await Promise.all([signInAs(t.app, DEMO.producerQuality), signInAs(t.app, DEMO.buyerTechnologist)]);
  lots = await setUpThreeLots(tag);
  expect(lots.good.submitted.failing).toEqual([]);
  expect(lots.bad.submitted.failing).toEqual(["volatile_acidity"]);
});

describe("one status per lot", () => {
  it("when a lot conforms, fails, or is accepted under concession, then the list, the lot and the readiness board use the same words", async () => {
    const expected = THREE_LOT_STATUSES;
    const list = (await tech.agent.get(B(`/lots?q=${tag}`))).body.items as LotSummary[];
    const board = (await tech.agent.get(B("/readiness?limit=200"))).body.items as ReadinessRow[];
    for (const [key, [code, label]] of Object.entries(expected)) {
      const lot = lots[key as keyof typeof lots];
      const detail = (await tech.agent.get(B(`/lots/${lot.id}`))).body as LotDetail;
      expect([key, detail.status.code, detail.status.label]).toEqual([key, code, label]);
      expect(list.find((l) => l.id === lot.id)?.status.label).toBe(label);
      expect(board.find((l) => l.id === lot.id)?.status.label).toBe(label);
    }
    const conceded = board.find((l) => l.id === lots.conceded.id)!;
    // A decided deviation is not counted as open; its outcome is shown instead.
    expect(conceded.status.openDeviations).toBe(0);
    expect(conceded.decidedDeviations).toEqual([{ id: expect.any(Number), outcome: "concession" }]);
    expect(conceded.status.concession).toMatchObject({
      conditions: [{ kind: "price_adjustment", detail: "4 % off the invoice for this lot" }],
    });
    expect(board.find((l) => l.id === lots.bad.id)!.status.openDeviations).toBe(1);
    expect((await tech.agent.get(B(`/lots/${lots.bad.id}`))).body.status.reason).toBe(
      "Volatile acidity falls outside the governing limits.",
    );
  });

  it("when the lot conforms or was conceded, then its document is a certificate of conformity that names the concession and its conditions", async () => {
    const good = await getPdf(tech.agent, B(`/lots/${lots.good.id}/conformity.pdf`));
    expect(good.status).toBe(200);
    for (const needle of [
      "Certificate of conformity",
      "Status: Conforms",
      "Identification",
      "Object",
      "Requirements referred to",
      "Limitations",
      "Issued on",
      "Tessa Marlow",
      "judged against spec version 1",
      "Laid out after ISO/IEC 17050-1:2004",
    ])
      expect(good.text).toContain(needle);
    const conceded = await getPdf(tech.agent, B(`/lots/${lots.conceded.id}/conformity.pdf`));
    for (const needle of [
      "Certificate of conformity",
      "Status: Accepted under concession",
      "Concession: deviation #",
      "Sound on tasting; VA stable over four weeks.",
      "Condition, price adjustment: 4 % off the invoice for this lot",
    ]) {
      expect(conceded.text).toContain(needle);
    }
  });

  it("when the lot does not conform, then the same button gives an analysis statement that says why", async () => {
    const bad = await getPdf(tech.agent, B(`/lots/${lots.bad.id}/conformity.pdf`));
    expect(bad.status).toBe(200);
    expect(bad.text).not.toContain("Certificate of conformity");
    for (const needle of [
      "Analysis statement",
      "Status: Does not conform",
      "Volatile acidity falls outside the governing limits.",
      "This is not a certificate of conformity",
    ])
      expect(bad.text).toContain(needle);
  });

  it("when an analysis is stored, then the answer counts its verdicts by outcome exactly as stored", async () => {
    const detail = (await producer.agent.get(P(`/lots/${lots.bad.id}`))).body as LotDetail;
    const stored = detail.analyses.at(-1)!.evaluation!.verdicts.filter((v) => v.outcome !== "not required");
    expect(stored.filter((v) => v.outcome === "fail")).toHaveLength(1);
    const submitted = await producer.agent
      .post(P(`/lots/${lots.bad.id}/analyses`))
      .set("x-csrf-token", producer.csrf)
      .send({
        idempotencyKey: randomUUID(),
        stage: "pre_filling",
        laboratoryName: "Domaine des Trois Sentes cellar laboratory",
        // The same day as the factory's analysis, and later stored: it speaks for the lot.
        sampleDate: new Date().toISOString().slice(0, 10),
        results: [{ parameter: "volatile_acidity", raw: "0.40", unit: "g/L as acetic acid", uncertainty: null }],
      });
    const after = (await producer.agent.get(P(`/lots/${lots.bad.id}`))).body as LotDetail;
    const verdicts = after.analyses.at(-1)!.evaluation!.verdicts.filter((v) => v.outcome !== "not required");
    const counted: Record<string, number> = {};
    for (const v of verdicts) counted[v.outcome] = (counted[v.outcome] ?? 0) + 1;
    expect(submitted.body.counts).toEqual(counted);
    expect(submitted.body.counts.missing).toBe(verdicts.length - 1);
    // The latest pre-filling analysis now speaks for the lot: one pass, the rest missing.
    expect(after.status.code).toBe("incomplete");
  });
});

describe("a lot's market", () => {
  it("when a producer registers or corrects a lot for a market its contract does not name, then it is refused on the market field (regression)", async () => {
    const bad = await producer.agent
      .post(P("/lots"))
      .set("x-csrf-token", producer.csrf)
      .send({
        contractId: CONTRACT.sentierBlanc,
        vintage: 2025,
        lotCode: `ST-US-${tag}`,
        volumeLitres: 100,
        container: "bottles",
        market: "US",
      });
    expect(bad.status).toBe(400);
    expect(bad.body.errors).toEqual([
      { path: "market", message: "Contract HG-C-2024-017 covers GB, EU, OIV; choose one of those markets." },
    ]);
    const fix = await producer.agent
      .patch(P(`/lots/${lots.good.id}`))
      .set("x-csrf-token", producer.csrf)
      .send({ volumeLitres: 9000, container: "bottles", plannedDate: null, market: "CN" });
    expect(fix.status).toBe(400);
    expect((await producer.agent.get(P(`/lots/${lots.good.id}`))).body.market).toBe("EU");
  });
});

describe("trends", () => {
  it("when a trend is asked for the latest vintage only, then it draws that vintage's points and lists every vintage with its count", async () => {
    const all = (await tech.agent.get(B(`/contracts/${CONTRACT.sentierBlanc}/trend?parameter=volatile_acidity&vintages=10`)))
      .body as TrendData;
    const one = (await tech.agent.get(B(`/contracts/${CONTRACT.sentierBlanc}/trend?parameter=volatile_acidity&vintages=1`)))
      .body as TrendData;
    expect(all.vintages.length).toBeGreaterThan(1);
    expect(one.vintages).toEqual(all.vintages);
    expect(one.vintagesShown).toEqual([all.vintages[0]!.vintage]);
    expect(new Set(one.points.map((p) => p.vintage))).toEqual(new Set([all.vintages[0]!.vintage]));
    expect(one.points).toHaveLength(all.vintages[0]!.results);
    expect(all.points).toHaveLength(all.vintages.reduce((n, v) => n + v.results, 0));
    expect(one.truncated).toBe(false);
    const sorted = [...all.points].sort((a, b) => a.sampleDate.localeCompare(b.sampleDate));
    expect(all.points.map((p) => p.sampleDate)).toEqual(sorted.map((p) => p.sampleDate));
  });

  it("when a parameter is charted, then it is in the spec row's unit with the governing limits, and every value is rounded to the parameter's precision (regression)", async () => {
    const res = await tech.agent.get(B(`/contracts/${CONTRACT.sentierBlanc}/trend?parameter=volatile_acidity`));
    expect(res.status).toBe(200);
    const d = res.body as TrendData;
    // Sentier Blanc's version 1 writes volatile acidity in g/L as acetic acid with a maximum of 0.6 (the still-white template),
    // stricter than the EU's 18 meq/L (2019/934 Annex I Part C), so the buyer's limit governs.
    expect([d.unit, d.upper, d.lower, d.digits]).toEqual([
      "g/L as acetic acid",
      { value: expect.closeTo(0.6, 9), source: "buyer" },
      null,
      2,
    ]);
    expect(d.points.length).toBeGreaterThan(3);
    for (const p of d.points.filter((x) => x.value !== null)) {
      expect(p.value!).toBeLessThan(2);
      expect(p.text).toMatch(/^\d+\.\d{2}$/);
    }
  });

  it("when results and limits are drawn, then the chart's range holds both", () => {
    expect(chartDomain([0.41, 0.45], null, 0.6)[1]).toBeGreaterThan(0.6);
    expect(chartDomain([3.2, 3.3], 3.1, 3.4)).toEqual([expect.closeTo(3.076, 3), expect.closeTo(3.424, 3)]);
    const [lo, hi] = chartDomain([12, 14.9], 11, 13.5);
    expect(lo).toBeLessThan(11);
    expect(hi).toBeGreaterThan(14.9);
  });
});

describe("trends with the law governing", () => {
  it("when the buyer's row is looser than the law, then the trend draws the law's limit and says which market sets it", async () => {
    const valsorda = await party(DEMO.valsordaQuality, "producer_quality");
    const { contractId } = await agreedContract(await buyer(), valsorda, {
      wine: { name: "Valsorda Rosso", colour: "red", region: "Veneto", nominalSugarGPerL: 2, nominalAlcoholPercentVol: 13 },
      rows: [vaRow(1.5)],
      vintageFrom: 2025,
    });
    const lot = await plannedLot(valsorda, contractId, { lotCode: `VR-${tag}`, volumeLitres: 1000, plannedDate: null });
    await reported(valsorda, lot.id, {
      stage: "pre_filling",
      laboratoryName: "Valsorda lab",
      sampleDate: "2026-11-20",
      results: [["volatile_acidity", "0.62", "g/L as acetic acid"]],
    });
    const d = (await tech.agent.get(B(`/contracts/${contractId}/trend?parameter=volatile_acidity`))).body as TrendData;
    // EU: 20 meq/L for red wine, 18 for white and rosé (Delegated Reg. (EU) 2019/934, Annex I Part C); 20 × 60.05 / 1000 = 1.201 g/L as acetic acid.
    expect(d.upper).toEqual({ value: expect.closeTo(1.201, 4), source: "law, EU" });
    expect(d.points.map((p) => p.text)).toEqual(["0.62"]);
  });
});

describe("a later version and a recorded re-judgement", () => {
  it("when a stricter version is agreed, then nothing is re-judged silently; a re-judgement is a new recorded analysis and the first verdict stays reproducible", async () => {
    const valsorda = await party(DEMO.valsordaQuality, "producer_quality");
    const { contractId, versionId } = await agreedContract(await buyer(), valsorda, {
      wine: { name: "Valsorda Bianco", region: "Veneto", nominalSugarGPerL: 2, nominalAlcoholPercentVol: 12 },
      rows: [vaRow(0.9)],
      vintageFrom: 2025,
    });
    const v1 = { id: versionId, number: 1 };
    const { id: lotId } = await plannedLot(valsorda, contractId, { lotCode: `VB-${tag}`, volumeLitres: 1000, plannedDate: null });
    await reported(valsorda, lotId, {
      stage: "pre_filling",
      laboratoryName: "Valsorda lab",
      sampleDate: "2026-11-20",
      results: [["volatile_acidity", "0.70", "g/L as acetic acid"]],
    });
    const first = (await tech.agent.get(B(`/lots/${lotId}`))).body as LotDetail;
    expect(first.status.label).toBe("Conforms");
    const second = await agreedVersion(await buyer(), valsorda, contractId, {
      from: { from: "version", versionId: v1.id },
      rows: [vaRow(0.6)],
      vintageFrom: 2025,
    });
    const v2 = { id: second.versionId, number: second.number };

    const before = (await tech.agent.get(B(`/lots/${lotId}`))).body as LotDetail;
    expect(before.governing!.id).toBe(v2.id);
    // Not re-judged silently: the analysis still speaks, judged against version 1.
    expect(before.status.label).toBe("Conforms");
    expect(before.analyses[0]!.evaluation!.specVersion).toEqual({ id: v1.id, number: v1.number });

    const re = await tech.agent.post(B(`/lots/${lotId}/analyses/${before.analyses[0]!.id}/rejudge`)).set("x-csrf-token", tech.csrf);
    expect(re.status).toBe(201);
    expect(re.body.failing).toEqual(["volatile_acidity"]);
    const after = (await tech.agent.get(B(`/lots/${lotId}`))).body as LotDetail;
    expect(after.status.label).toBe("Does not conform");
    expect(after.analyses).toHaveLength(2);
    // The first verdict is kept exactly as stored.
    expect(after.analyses[0]!.evaluation).toEqual(before.analyses[0]!.evaluation);
    expect(after.analyses[1]).toMatchObject({
      rejudgedFromId: before.analyses[0]!.id,
      evaluation: { specVersion: { id: v2.id, number: v2.number }, worstOutcome: "fail" },
    });
    expect(after.deviations).toHaveLength(1);
    expect(
      (await tech.agent.post(B(`/lots/${lotId}/analyses/${before.analyses[0]!.id}/rejudge`)).set("x-csrf-token", tech.csrf)).status,
    ).toBe(409);
    expect(
      (await tech.agent.post(B(`/lots/${lotId}/analyses/${after.analyses[1]!.id}/rejudge`)).set("x-csrf-token", tech.csrf)).status,
    ).toBe(409);
    const trail = (await tech.agent.get(B(`/history/lot/${lotId}`))).body as { action: string }[];
    expect(trail.map((e) => e.action)).toContain("analysis.rejudged");
    // Another organisation cannot re-judge.
    expect(
      (await producer.agent.post(P(`/lots/${lotId}/analyses/${before.analyses[0]!.id}/rejudge`)).set("x-csrf-token", producer.csrf)).status,
    ).toBe(404);
  });
});

describe("a laboratory's number format", () => {
  it("when an import says the laboratory writes 1.234,5, then '1.200' CFU/mL is read and kept as twelve hundred; in the point format it would be 1.2", async () => {
    const send = (lotCode: string, numberFormat: "comma" | "point") =>
      producer.agent
        .post(P(`/contracts/${CONTRACT.sentierBlanc}/imports`))
        .set("x-csrf-token", producer.csrf)
        .send({
          idempotencyKey: randomUUID(),
          stage: "pre_filling",
          laboratoryName: "Laboratoire Vauclair",
          numberFormat,
          samples: [
            { lotCode, vintage: 2025, sampleDate: "2026-11-27", results: [{ parameter: "yeast_count", raw: "1.200", unit: "CFU/mL" }] },
          ],
        });
    const comma = await send(`NF-C-${tag}`, "comma");
    const point = await send(`NF-P-${tag}`, "point");
    expect([comma.status, point.status]).toEqual([201, 201]);
    const reading = async (code: string) => {
      const lot = ((await producer.agent.get(P(`/lots?q=${code}`))).body.items as LotSummary[])[0]!;
      const detail = (await producer.agent.get(P(`/lots/${lot.id}`))).body as LotDetail;
      return detail.analyses[0]!.results[0]!;
    };
    expect(await reading(`NF-C-${tag}`)).toMatchObject({ rawText: "1.200", reading: { kind: "value", value: 1200 } });
    expect(await reading(`NF-P-${tag}`)).toMatchObject({ rawText: "1.200", reading: { kind: "value", value: 1.2 } });
  });
});
