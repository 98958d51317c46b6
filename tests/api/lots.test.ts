import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { mkdtempSync, readdirSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, ORG, signInAs, type SignedInAgent, type TestApp, CONTRACT } from "../support/api.ts";
import { readCsv } from "../support/csv.ts";
import { agreedContract, party } from "../support/factories.ts";
import { passingResults } from "../support/passing-results.ts";
import { getVersion } from "../../server/services/specs/spec-queries.ts";
import { IMPORT_BATCH_MAX } from "../../shared/lots/schemas.ts";
import { ENGINE_VERSION, MARKET_PACKS } from "../../shared/engine/index.ts";

const certDir = mkdtempSync(path.join(os.tmpdir(), "cellarpact-certs-"));
let t: TestApp;
let producer: SignedInAgent;
let buyer: SignedInAgent;
let kestrel: SignedInAgent;
const KESTREL_CONTRACT = 3; // bulk shiraz in flexitank, version agreed from 2024

beforeAll(async () => {
  t = buildTestApp({ CERTIFICATE_DIR: certDir, CERTIFICATE_MAX_BYTES: "60000" });
  producer = await signInAs(t.app, DEMO.producerQuality);
  buyer = await signInAs(t.app, DEMO.buyerTechnologist);
  kestrel = await signInAs(t.app, DEMO.bulkProducerQuality);
});
afterAll(() => t.close());

const count = async (table: string) =>
  (await t.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`, { type: QueryTypes.SELECT }))[0]!.n;
const P = (p: string) => `/api/orgs/${ORG.troisSentes}${p}`;
const B = (p: string) => `/api/orgs/${ORG.retailer}${p}`;
const K = (p: string) => `/api/orgs/${ORG.kestrelFlats}${p}`;

async function newLot(code = `SB-T-${randomUUID().slice(0, 8)}`, extra: object = {}) {
  const res = await producer.agent
    .post(P("/lots"))
    .set("x-csrf-token", producer.csrf)
    .send({
      contractId: CONTRACT.sentierBlanc,
      vintage: 2025,
      lotCode: code,
      volumeLitres: 9000,
      container: "bottles",
      plannedDate: "2027-01-15",
      market: "EU",
      ...extra,
    });
  expect(res.status).toBe(201);
  return res.body.id as number;
}

const failingAnalysis = (key = randomUUID()) => ({
  idempotencyKey: key,
  stage: "pre_filling",
  laboratoryName: "Domaine des Trois Sentes cellar laboratory",
  accreditation: null,
  sampleDate: "2026-11-30",
  results: [
    { parameter: "alcohol", raw: "12,6", unit: "% vol", uncertainty: { kind: "expanded", value: 0.1, k: 2 } },
    { parameter: "free_so2", raw: "12", unit: "mg/L" },
    { parameter: "volatile_acidity", raw: "0.78", unit: "g/L as acetic acid", uncertainty: { kind: "expanded", value: 0.04 } },
    { parameter: "residual_sugar", raw: "<0,5", unit: "g/L" },
    { parameter: "ph", raw: "3.25", unit: "pH" },
  ],
});

describe("submitting an analysis", () => {
  it("when a pre-filling analysis fails two parameters, then verdicts are stored with the spec, market and engine versions, and a deviation opens", async () => {
    const lotId = await newLot();
    const res = await producer.agent
      .post(P(`/lots/${lotId}/analyses`))
      .set("x-csrf-token", producer.csrf)
      .send(failingAnalysis());
    expect(res.status).toBe(201);
    expect(res.body.failing.sort()).toEqual(["free_so2", "volatile_acidity"]);
    expect(res.body.deviationIds).toHaveLength(1);
    const lot = (await buyer.agent.get(B(`/lots/${lotId}`))).body;
    const ev = lot.analyses[0].evaluation;
    expect(ev).toMatchObject({
      specVersionId: lot.governing.id,
      engineVersion: ENGINE_VERSION,
      marketVersions: { EU: MARKET_PACKS.EU.version },
      worstOutcome: "fail",
    });
    const va = ev.verdicts.find((v: { parameter: string }) => v.parameter === "volatile_acidity");
    expect(va).toMatchObject({ outcome: "fail", decidingSide: "upper", upper: { source: "buyer" } });
    const sugar = ev.verdicts.find((v: { parameter: string }) => v.parameter === "residual_sugar");
    expect(sugar).toMatchObject({ outcome: "pass", resultText: "< 0.5" });
    const missing = ev.verdicts.find((v: { parameter: string }) => v.parameter === "total_so2");
    expect(missing.outcome).toBe("missing");
    const notRequired = ev.verdicts.find((v: { parameter: string }) => v.parameter === "turbidity");
    expect(notRequired.outcome).toBe("not required");
    expect(lot.deviations[0]).toMatchObject({ kind: "result", status: "open", parameters: ["free_so2", "volatile_acidity"] });
  });

  it("when the same submission is retried with its key, even five times at once, then one analysis is stored and each retry gets the first answer", async () => {
    const lotId = await newLot();
    const body = failingAnalysis();
    const before = await count("analyses");
    const answers = await Promise.all(
      Array.from({ length: 5 }, () =>
        producer.agent
          .post(P(`/lots/${lotId}/analyses`))
          .set("x-csrf-token", producer.csrf)
          .send(body),
      ),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 200, 200, 201]);
    expect(new Set(answers.map((a) => a.body.analysisId)).size).toBe(1);
    expect(await count("analyses")).toBe(before + 1);
    const reused = await producer.agent
      .post(P(`/lots/${lotId}/analyses`))
      .set("x-csrf-token", producer.csrf)
      .send({ ...body, sampleDate: "2026-12-01" });
    expect(reused.status).toBe(409);
  });

  it("when one result in a submission is unreadable, then nothing is written and the field is named", async () => {
    const lotId = await newLot();
    const before = await count("analyses");
    const body = failingAnalysis();
    body.results[1] = { parameter: "free_so2", raw: "−5", unit: "mg/L" };
    const res = await producer.agent
      .post(P(`/lots/${lotId}/analyses`))
      .set("x-csrf-token", producer.csrf)
      .send(body);
    expect(res.status).toBe(400);
    expect(res.body.errors[0]).toMatchObject({ path: "results.1.raw", message: '"-5": a measured result cannot be negative.' });
    expect(await count("analyses")).toBe(before);
  });
});

describe("lots and authorization", () => {
  it("when a producer asks for another producer's lot, or the laboratory asks, then 404; the buyer on the contract sees it", async () => {
    const lotId = await newLot();
    expect((await buyer.agent.get(B(`/lots/${lotId}`))).status).toBe(200);
    expect((await kestrel.agent.get(K(`/lots/${lotId}`))).status).toBe(404);
    expect(
      (
        await kestrel.agent
          .post(K(`/lots/${lotId}/analyses`))
          .set("x-csrf-token", kestrel.csrf)
          .send(failingAnalysis())
      ).status,
    ).toBe(404);
    const lab = await signInAs(t.app, DEMO.labAdmin);
    expect((await lab.agent.get(`/api/orgs/${ORG.lab}/lots/${lotId}`)).status).toBe(404);
    expect(
      (
        await buyer.agent
          .post(B(`/lots/${lotId}/analyses`))
          .set("x-csrf-token", buyer.csrf)
          .send(failingAnalysis())
      ).status,
    ).toBe(403);
    const mine = (await kestrel.agent.get(K("/lots"))).body.items as { contractId: number }[];
    expect(mine.every((l) => l.contractId === KESTREL_CONTRACT)).toBe(true);
  });

  it("when a lot code is registered twice under one contract, then the second is refused on the lot code field", async () => {
    const code = `SB-D-${randomUUID().slice(0, 6)}`;
    await newLot(code);
    const again = await producer.agent
      .post(P("/lots"))
      .set("x-csrf-token", producer.csrf)
      .send({ contractId: CONTRACT.sentierBlanc, vintage: 2025, lotCode: code, volumeLitres: 9000, container: "bottles", market: "EU" });
    expect(again.body.errors[0]).toEqual({ path: "lotCode", message: `Lot ${code} is already registered under this contract.` });
  });
});

describe("transit for bulk wine", () => {
  it("when the arrival analysis lost 14 mg/L of free SO2 against pre-shipment, then a transit deviation opens", async () => {
    const lot = await kestrel.agent
      .post(K("/lots"))
      .set("x-csrf-token", kestrel.csrf)
      .send({
        contractId: KESTREL_CONTRACT,
        vintage: 2025,
        lotCode: `KF-T-${randomUUID().slice(0, 6)}`,
        volumeLitres: 24000,
        container: "flexitank",
        market: "EU",
      });
    const submit = (stage: string, so2: string) =>
      kestrel.agent
        .post(K(`/lots/${lot.body.id}/analyses`))
        .set("x-csrf-token", kestrel.csrf)
        .send({
          idempotencyKey: randomUUID(),
          stage,
          laboratoryName: "Riverland Wine Analysis Services",
          accreditation: "NATA 18844",
          sampleDate: "2026-10-01",
          results: [
            { parameter: "free_so2", raw: so2, unit: "mg/L" },
            { parameter: "dissolved_oxygen", raw: "0.8", unit: "mg/L" },
          ],
        });
    expect((await submit("pre_shipment", "32")).status).toBe(201);
    const arrival = await submit("on_arrival", "18");
    expect(arrival.status).toBe(201);
    const detail = (await buyer.agent.get(B(`/lots/${lot.body.id}`))).body;
    expect(detail.transit.find((f: { parameter: string }) => f.parameter === "free_so2")).toMatchObject({ exceeded: true, change: -14 });
    expect(detail.deviations.find((d: { kind: string }) => d.kind === "transit").parameters).toEqual(["free_so2"]);
  });
});

describe("certificates", () => {
  const pdf = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");
  const filesNow = () => readdirSync(certDir).length;

  it("when a real PDF is uploaded, then its SHA-256 is recorded on the trail and both parties can download it", async () => {
    const lotId = await newLot();
    const { body } = await producer.agent
      .post(P(`/lots/${lotId}/analyses`))
      .set("x-csrf-token", producer.csrf)
      .send(failingAnalysis());
    const up = await producer.agent
      .post(P(`/analyses/${body.analysisId}/certificates`))
      .set("x-csrf-token", producer.csrf)
      .attach("file", pdf, "certificate.pdf");
    expect(up.status).toBe(201);
    expect(up.body.mime).toBe("application/pdf");
    const audit = await t.sequelize.query<{ details: string | { sha256: string } }>(
      "SELECT details FROM trail_entries WHERE action = 'certificate.uploaded' ORDER BY seq DESC LIMIT 1",
      { type: QueryTypes.SELECT },
    );
    const details = typeof audit[0]!.details === "string" ? JSON.parse(audit[0]!.details) : audit[0]!.details;
    expect(details.sha256).toBe(up.body.sha256);
    const lot = (await buyer.agent.get(B(`/lots/${lotId}`))).body;
    const certId = lot.analyses[0].certificates[0].id;
    const dl = await buyer.agent
      .get(B(`/certificates/${certId}`))
      .buffer(true)
      .parse((r, cb) => {
        const c: Buffer[] = [];
        r.on("data", (x: Buffer) => c.push(x));
        r.on("end", () => cb(null, Buffer.concat(c)));
      });
    expect(dl.status).toBe(200);
    expect(dl.headers["content-disposition"]).toMatch(/attachment/);
    expect((dl.body as Buffer).equals(pdf)).toBe(true);
    expect((await kestrel.agent.get(K(`/certificates/${certId}`))).status).toBe(404);
  });

  it("when a file is too large, then 413; when its content is not a PDF or image, then 415; and nothing is stored either way", async () => {
    const lotId = await newLot();
    const { body } = await producer.agent
      .post(P(`/lots/${lotId}/analyses`))
      .set("x-csrf-token", producer.csrf)
      .send(failingAnalysis());
    const [rows, files] = [await count("certificates"), filesNow()];
    const big = Buffer.concat([pdf, Buffer.alloc(70_000, 32)]);
    const tooBig = await producer.agent
      .post(P(`/analyses/${body.analysisId}/certificates`))
      .set("x-csrf-token", producer.csrf)
      .attach("file", big, "big.pdf");
    expect(tooBig.status).toBe(413);
    const fake = await producer.agent
      .post(P(`/analyses/${body.analysisId}/certificates`))
      .set("x-csrf-token", producer.csrf)
      .attach("file", Buffer.from("<html><script>alert(1)</script></html>"), "certificate.pdf");
    expect(fake.status).toBe(415);
    expect(await count("certificates")).toBe(rows);
    expect(filesNow()).toBe(files);
  });
});

describe("CSV import through the API", () => {
  it("when 10,000 rows are imported in batches, then 10,000 analyses with stored evaluations exist and unknown lots were created", async () => {
    const ref = `HG-BULK-${Date.now()}`;
    const contract = await buyer.agent
      .post(B("/contracts"))
      .set("x-csrf-token", buyer.csrf)
      .send({
        reference: ref,
        producerOrgId: ORG.troisSentes,
        startsOn: "2026-01-01",
        endsOn: null,
        wine: {
          name: "Sentier Gris",
          colour: "rose",
          category: "still",
          region: "Loire Valley",
          markets: ["EU"],
          nominalSugarGPerL: 2,
          nominalAlcoholPercentVol: 12,
        },
      });
    const lines = ["Lot;Vintage;Sample date;Free SO2 (mg/L);VA (g/L acetic);pH"];
    for (let i = 0; i < 10_000; i++) lines.push(`SG-${i};2025;01/12/2026;${20 + (i % 20)};0,${40 + (i % 30)};3,${40 + (i % 20)}`);
    const { samples, errors } = readCsv(lines.join("\n"));
    expect(errors).toEqual([]);
    const before = await count("analysis_evaluations");
    for (let i = 0; i < samples.length; i += IMPORT_BATCH_MAX) {
      const res = await producer.agent
        .post(P(`/contracts/${contract.body.id}/imports`))
        .set("x-csrf-token", producer.csrf)
        .send({
          idempotencyKey: `bulk-${ref}-${i}`,
          stage: "pre_filling",
          laboratoryName: "Northgate Oenology Laboratory",
          accreditation: "UKAS 4412",
          samples: samples.slice(i, i + IMPORT_BATCH_MAX).map(({ rows: _r, ...s }) => s),
        });
      expect(res.status).toBe(201);
    }
    expect(await count("analysis_evaluations")).toBe(before + 10_000);
    const lots = await t.sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM lots WHERE contract_id = ?", {
      replacements: [contract.body.id],
      type: QueryTypes.SELECT,
    });
    expect(lots[0]!.n).toBe(10_000);
  }, 240_000);
});

describe("an import the size a laboratory sends", () => {
  it("when 2,000 samples are imported against a 15-row spec, then all are stored, however large their evaluations (regression: one insert passed max_allowed_packet)", async () => {
    const [maker, tech] = await Promise.all([
      party(DEMO.producerQuality, "producer_quality"),
      party(DEMO.buyerTechnologist, "buyer_technologist"),
    ]);
    const { contractId, versionId } = await agreedContract(tech, maker, { template: "still-white", vintageFrom: 2025 });
    const { requirements } = await getVersion(tech.orgId, versionId, tech.role);
    expect(requirements.length).toBeGreaterThanOrEqual(15);
    const results = passingResults(requirements, "pre_filling");
    const before = await count("analysis_evaluations");
    const res = await producer.agent
      .post(P(`/contracts/${contractId}/imports`))
      .set("x-csrf-token", producer.csrf)
      .send({
        idempotencyKey: randomUUID(),
        stage: "pre_filling",
        laboratoryName: "Northgate Oenology Laboratory",
        accreditation: "UKAS 4412",
        samples: Array.from({ length: IMPORT_BATCH_MAX }, (_, i) => ({
          lotCode: `PK-${i}`,
          vintage: 2025,
          sampleDate: "2026-11-30",
          results,
        })),
      });
    expect(res.status).toBe(201);
    expect(await count("analysis_evaluations")).toBe(before + IMPORT_BATCH_MAX);
  }, 240_000);
});

describe("correcting a lot", () => {
  it("when the producer corrects volume and container, then the lot changes and the change is in its history; the buyer may not", async () => {
    const lotId = await newLot();
    const res = await producer.agent
      .patch(P(`/lots/${lotId}`))
      .set("x-csrf-token", producer.csrf)
      .send({ volumeLitres: 24000, container: "iso_tank", plannedDate: "2027-02-01", market: "EU" });
    expect(res.status).toBe(204);
    const lot = (await buyer.agent.get(B(`/lots/${lotId}`))).body;
    expect(lot).toMatchObject({ volumeLitres: 24000, container: "iso_tank", plannedDate: "2027-02-01" });
    expect(
      (
        await buyer.agent
          .patch(B(`/lots/${lotId}`))
          .set("x-csrf-token", buyer.csrf)
          .send({ volumeLitres: 1, container: "bottles", plannedDate: null, market: "EU" })
      ).status,
    ).toBe(403);
    const history = (await buyer.agent.get(B(`/history/lot/${lotId}`))).body as { action: string }[];
    expect(history.map((h) => h.action)).toEqual(["lot.registered", "lot.updated"]);
    const bad = await producer.agent
      .patch(P(`/lots/${lotId}`))
      .set("x-csrf-token", producer.csrf)
      .send({ volumeLitres: -5, container: "bottles", market: "EU" });
    expect(bad.body.errors[0]).toEqual({ path: "volumeLitres", message: "The volume must be above 0." });
  });
});
