/**
 * The browser's live preview and the stored evaluation are the same judgement: for random spec
 * versions and random analyses (fast-check), the verdicts the results form shows as the user types
 * (src/features/lots/entry-preview.ts) equal, field for field, those the server stores. Both go
 * through shared/lots/judge.ts, so this checks the wiring: units, stages, markets, the parse.
 */
import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, ORG, signInAs, type SignedInAgent, type TestApp } from "../support/api.ts";
import { judgeForLot, previewJudgement } from "../../src/features/lots/entry-preview.ts";
import type { LotDetail } from "../../shared/lots/views.ts";
import type { AnalysisStage } from "../../shared/lots/vocabulary.ts";
import { contract, party } from "../support/factories.ts";

let t: TestApp;
let buyer: SignedInAgent;
let producer: SignedInAgent;
let contractId: number;
const B = (p: string) => `/api/orgs/${ORG.retailer}${p}`;
const V = (p: string) => `/api/orgs/${ORG.valsorda}${p}`;

// Parameters with the units a spec may use and a range of typical values in that unit (common practice).
const CANDIDATES = [
  { parameter: "free_so2", unit: "mg/L", lo: 5, hi: 60 },
  { parameter: "total_so2", unit: "mg/L", lo: 40, hi: 180 },
  { parameter: "volatile_acidity", unit: "g/L as acetic acid", lo: 0.2, hi: 0.9 },
  { parameter: "volatile_acidity", unit: "meq/L", lo: 3, hi: 15 },
  { parameter: "total_acidity", unit: "g/L as tartaric acid", lo: 4, hi: 8 },
  { parameter: "alcohol", unit: "% vol", lo: 10, hi: 14.5 },
  { parameter: "ph", unit: "pH", lo: 3, hi: 3.8 },
  { parameter: "residual_sugar", unit: "g/L", lo: 0.5, hi: 8 },
  { parameter: "copper", unit: "mg/L", lo: 0.05, hi: 0.8 },
  { parameter: "dissolved_oxygen", unit: "mg/L", lo: 0.2, hi: 2 },
] as const;

const rule = fc.oneof(
  fc.constant({ kind: "simple" as const }),
  fc.record({
    kind: fc.constant("guarded" as const),
    guard: fc.record({ kind: fc.constant("expanded" as const), k: fc.constantFrom(1, 2) }),
  }),
  fc.record({
    kind: fc.constant("non-binary" as const),
    guard: fc.record({ kind: fc.constant("multiple-of-u" as const), k: fc.constantFrom(1, 2) }),
  }),
);

const row = fc
  .record({
    c: fc.constantFrom(...CANDIDATES),
    a: fc.double({ min: 0, max: 1, noNaN: true }),
    b: fc.double({ min: 0, max: 1, noNaN: true }),
    rule,
    twoSided: fc.boolean(),
    stages: fc.subarray(["pre_filling", "pre_shipment"] as const, { minLength: 1 }),
  })
  .map(({ c, a, b, rule, twoSided, stages }) => {
    const [x, y] = [c.lo + (c.hi - c.lo) * Math.min(a, b), c.lo + (c.hi - c.lo) * Math.max(a, b)];
    const round = (v: number) => Number(v.toPrecision(3));
    return {
      parameter: c.parameter,
      unit: c.unit,
      lower: twoSided ? round(x) : null,
      upper: round(Math.max(y, x + (c.hi - c.lo) / 10)),
      target: null,
      rule,
      severity: "major",
      stages,
      method: null,
    };
  });

const spec = fc.uniqueArray(row, { minLength: 1, maxLength: 6, selector: (r) => r.parameter });

// What a laboratory might write: a number in the row's unit (decimal point or comma), censored, or nothing.
const result = (r: { parameter: string; unit: string; lower: number | null; upper: number }) =>
  fc
    .oneof(
      {
        weight: 6,
        arbitrary: fc
          .double({ min: (r.lower ?? r.upper / 2) * 0.7, max: r.upper * 1.3, noNaN: true })
          .chain((v) => fc.constantFrom(String(Number(v.toPrecision(3))), String(Number(v.toPrecision(3))).replace(".", ","))),
      },
      { weight: 1, arbitrary: fc.constant(`<${Number((r.upper / 3).toPrecision(2))}`) },
      { weight: 1, arbitrary: fc.constant("") },
    )
    .chain((raw) =>
      fc.record({
        raw: fc.constant(raw),
        u: fc.option(
          fc.constantFrom(0.01, 0.05, 0.2, 2).map((k) => Number((k * r.upper).toPrecision(2))),
          { nil: null },
        ),
      }),
    );

beforeAll(async () => {
  t = buildTestApp();
  [buyer, producer] = await Promise.all([signInAs(t.app, DEMO.buyerTechnologist), signInAs(t.app, DEMO.valsordaQuality)]);
  const opened = await contract(
    await party(DEMO.buyerTechnologist, "buyer_technologist"),
    await party(DEMO.valsordaQuality, "producer_quality"),
    {
      wine: { name: "Valsorda Bianco", region: "Veneto", markets: ["EU", "US"], nominalSugarGPerL: 3, nominalAlcoholPercentVol: 12 },
    },
  );
  contractId = opened.contractId;
});

let vintage = 1960;

describe("the live preview and the stored evaluation", () => {
  it("when random analyses are judged against random spec versions, then the preview's verdicts equal the stored ones", async () => {
    await fc.assert(
      fc.asyncProperty(
        spec.chain((rows) =>
          fc.record({
            rows: fc.constant(rows),
            results: fc.tuple(...rows.map(result)),
            stage: fc.constantFrom<AnalysisStage>("pre_filling", "retest", "pre_shipment", "final_check"),
            market: fc.constantFrom("EU", "US"),
          }),
        ),
        async ({ rows, results, stage, market }) => {
          vintage += 1;
          const draft = await buyer.agent
            .post(B(`/contracts/${contractId}/specs`))
            .set("x-csrf-token", buyer.csrf)
            .send({ from: "blank" });
          expect(draft.status).toBe(201);
          const v = (await buyer.agent.get(B(`/specs/${draft.body.id}`))).body;
          const saved = await buyer.agent
            .put(B(`/specs/${v.id}`))
            .set("x-csrf-token", buyer.csrf)
            .send({
              lockVersion: v.lockVersion,
              title: "Property",
              vintageFrom: vintage,
              vintageTo: vintage,
              stages: ["pre_filling", "pre_shipment"],
              rows,
            });
          expect([saved.status, saved.body.errors]).toEqual([200, undefined]);
          expect((await buyer.agent.post(B(`/specs/${v.id}/send`)).set("x-csrf-token", buyer.csrf)).status).toBe(204);
          expect((await producer.agent.post(V(`/specs/${v.id}/agree`)).set("x-csrf-token", producer.csrf)).status).toBe(204);
          const lot = await producer.agent
            .post(V("/lots"))
            .set("x-csrf-token", producer.csrf)
            .send({ contractId, vintage, lotCode: `PROP-${vintage}`, volumeLitres: 1000, container: "bottles", market });
          expect(lot.status).toBe(201);
          const detail = (await producer.agent.get(V(`/lots/${lot.body.id}`))).body as LotDetail;
          const entries = rows
            .map((r, i) => ({
              parameter: r.parameter,
              raw: results[i]!.raw,
              unit: r.unit,
              uncertainty: results[i]!.u === null ? null : { kind: "expanded" as const, value: results[i]!.u!, k: 2 },
              method: null,
            }))
            .filter((e) => e.raw !== "");
          fc.pre(entries.length > 0);
          const preview = previewJudgement(judgeForLot(detail), stage, entries as never);
          const stored = await producer.agent
            .post(V(`/lots/${lot.body.id}/analyses`))
            .set("x-csrf-token", producer.csrf)
            .send({ idempotencyKey: randomUUID(), stage, laboratoryName: "Valsorda lab", sampleDate: "2026-11-30", results: entries });
          expect(stored.status).toBe(201);
          const after = (await producer.agent.get(V(`/lots/${lot.body.id}`))).body as LotDetail;
          const evaluation = after.analyses[0]!.evaluation!;
          expect(evaluation.verdicts).toEqual(preview.verdicts);
          expect(evaluation.worstOutcome).toBe(preview.worst);
          expect(evaluation.marketVersions).toEqual(preview.marketVersions);
          expect(stored.body.counts).toEqual(preview.counts);
        },
      ),
      { numRuns: 12, seed: 20261202 },
    );
  });
});
