/**
 * The buyer states what the law asks about a wine; the judge reads it. The organic limit is the
 * conventional one less 30 mg/L for white wine of 2 g/L sugar or more (Reg. (EU) 2021/1165 Annex V,
 * values as read in secondary sources; see tests/unit/engine/published-limits-more.test.ts).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, signInAs, type SignedInAgent, type TestApp } from "../support/api.ts";
import { agreedContract, analysed, party, plannedLot } from "../support/factories.ts";
import type { ContractDetail } from "../../shared/specs/views.ts";
import type { LotDetail } from "../../shared/lots/views.ts";

let t: TestApp;
let tech: SignedInAgent;
let producer: SignedInAgent;
let B: (p: string) => string;
let P: (p: string) => string;
// This file's own contract: a white still wine, usual sugar 2.5 g/L, sold in the EU, with the facts below.
let contractId = 0;
const original = { organic: false, protectedOrigin: "pdo", filtered: true } as const;
let lotId = 0;

const put = (who: SignedInAgent, url: string, lawFacts: unknown) => who.agent.put(url).set("x-csrf-token", who.csrf).send({ lawFacts });

beforeAll(async () => {
  t = buildTestApp();
  [tech, producer] = await Promise.all([signInAs(t.app, DEMO.buyerTechnologist), signInAs(t.app, DEMO.producerQuality)]);
  const [buyer, maker] = await Promise.all([
    party(DEMO.buyerTechnologist, "buyer_technologist"),
    party(DEMO.producerQuality, "producer_quality"),
  ]);
  B = (p) => `/api/orgs/${buyer.orgId}${p}`;
  P = (p) => `/api/orgs/${maker.orgId}${p}`;
  contractId = (await agreedContract(buyer, maker, { wine: { name: "Factory Blanc", nominalSugarGPerL: 2.5, lawFacts: original } }))
    .contractId;
});

describe("the wine's facts for the law", () => {
  it("when the buyer states the wine is organic, then the contract shows it, the trail records it and the lot's EU limits include the organic one", async () => {
    const res = await put(tech, B(`/contracts/${contractId}/law-facts`), { ...original, organic: true });
    expect(res.status).toBe(200);
    const contract = (await tech.agent.get(B(`/contracts/${contractId}`))).body as ContractDetail;
    expect(contract.wine.lawFacts).toMatchObject({ organic: true, protectedOrigin: "pdo" });

    const history = (await tech.agent.get(B(`/history/contract/${contractId}`))).body as {
      action: string;
      details: Record<string, unknown>;
    }[];
    expect(history.map((h) => h.action)).toContain("wine.law_facts_changed");

    const lot = await plannedLot(await party(DEMO.producerQuality, "producer_quality"), contractId, {
      lotCode: `LF-${randomUUID().slice(0, 5)}`,
      volumeLitres: 5000,
      plannedDate: "2027-01-15",
    });
    await analysed(await party(DEMO.producerQuality, "producer_quality"), lot.id);
    const detail = (await producer.agent.get(P(`/lots/${lot.id}`))).body as LotDetail;
    const so2 = detail.analyses[0]!.evaluation!.verdicts.find((v) => v.parameter === "total_so2")!;
    // White, usual sugar 2.5 g/L → conventional 200 mg/L (2019/934 A.1(b)) and organic 170 mg/L.
    expect(so2.legalLimits.map((l) => l.value).sort((a, b) => a - b)).toEqual([170, 200]);
    expect(detail.analyses[0]!.evaluation!.factsChanged).toBe(false);
    lotId = lot.id;
  });

  it("when the facts change after a verdict, then the verdict says so and a re-judgement reads the facts as they stand", async () => {
    const analysisId = ((await tech.agent.get(B(`/lots/${lotId}`))).body as LotDetail).analyses[0]!.id;
    const before = await tech.agent.post(B(`/lots/${lotId}/analyses/${analysisId}/rejudge`)).set("x-csrf-token", tech.csrf);
    expect(before.status).toBe(409); // same version, same facts: nothing to re-judge
    expect((await put(tech, B(`/contracts/${contractId}/law-facts`), { ...original, organic: false })).status).toBe(200);
    const stale = (await tech.agent.get(B(`/lots/${lotId}`))).body as LotDetail;
    expect(stale.analyses[0]!.evaluation!.factsChanged).toBe(true);
    const re = await tech.agent.post(B(`/lots/${lotId}/analyses/${analysisId}/rejudge`)).set("x-csrf-token", tech.csrf);
    expect(re.status).toBe(201);
    const after = (await tech.agent.get(B(`/lots/${lotId}`))).body as LotDetail;
    const rejudged = after.analyses.find((a) => a.rejudgedFromId === analysisId)!;
    expect(rejudged.evaluation!.factsChanged).toBe(false);
    // Not organic any more: only the conventional 200 mg/L (2019/934 Annex I Part B A.1(b)).
    expect(rejudged.evaluation!.verdicts.find((v) => v.parameter === "total_so2")!.legalLimits.map((l) => l.value)).toEqual([200]);
  });

  it("when a fact has a value the law does not know, or an unknown name, then it is refused by name and nothing changes", async () => {
    const before = ((await tech.agent.get(B(`/contracts/${contractId}`))).body as ContractDetail).wine.lawFacts;
    const bad = await put(tech, B(`/contracts/${contractId}/law-facts`), { organic: "yes" });
    expect(bad.status).toBe(400);
    expect(bad.body.errors.map((e: { path: string }) => e.path)).toEqual(["lawFacts.organic"]);
    const unknown = await put(tech, B(`/contracts/${contractId}/law-facts`), { organics: true });
    expect(unknown.status).toBe(400);
    expect(JSON.stringify(unknown.body.errors)).toContain("organics");
    const after = ((await tech.agent.get(B(`/contracts/${contractId}`))).body as ContractDetail).wine.lawFacts;
    expect(after).toEqual(before);
  });

  it("when the producer tries to state the buyer's facts, then it is refused", async () => {
    const res = await put(producer, P(`/contracts/${contractId}/law-facts`), { organic: false });
    expect(res.status).toBe(403);
  });
});
