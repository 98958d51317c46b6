/**
 * Three lots under the Sentier Blanc contract, due in three weeks: one that conforms, one whose
 * volatile acidity fails, and one with the same failure accepted under concession by the buyer.
 */
import { expect } from "vitest";
import { randomUUID } from "node:crypto";
import { ORG, type SignedInAgent, CONTRACT } from "./api.ts";
import { passingResults } from "./passing-results.ts";
import type { LotDetail } from "../../shared/lots/views.ts";

export type ThreeLots = Record<
  "good" | "bad" | "conceded",
  { id: number; code: string; submitted: { failing: string[]; deviationIds: number[]; counts: Record<string, number> } }
>;

export const THREE_LOT_STATUSES = {
  good: ["conforms", "Conforms"],
  bad: ["does_not_conform", "Does not conform"],
  conceded: ["concession", "Accepted under concession"],
} as const;

export async function setUpThreeLots(producer: SignedInAgent, tech: SignedInAgent, tag: string): Promise<ThreeLots> {
  const P = (p: string) => `/api/orgs/${ORG.troisSentes}${p}`;
  const submit = async (code: string, overrides: Record<string, string>) => {
    const planned = new Date(Date.now() + 20 * 86_400_000).toISOString().slice(0, 10);
    const lot = await producer.agent.post(P("/lots")).set("x-csrf-token", producer.csrf).send({
      contractId: CONTRACT.sentierBlanc,
      vintage: 2025,
      lotCode: code,
      volumeLitres: 9000,
      container: "bottles",
      plannedDate: planned,
      market: "EU",
    });
    expect(lot.status).toBe(201);
    const detail = (await producer.agent.get(P(`/lots/${lot.body.id}`))).body as LotDetail;
    const res = await producer.agent
      .post(P(`/lots/${lot.body.id}/analyses`))
      .set("x-csrf-token", producer.csrf)
      .send({
        idempotencyKey: randomUUID(),
        stage: "pre_filling",
        laboratoryName: "Domaine des Trois Sentes cellar laboratory",
        sampleDate: "2026-11-25",
        results: passingResults(detail.governing!.requirements, "pre_filling", overrides),
      });
    expect(res.status).toBe(201);
    return { id: lot.body.id as number, code, submitted: res.body };
  };
  const good = await submit(`ST-OK-${tag}`, {});
  const bad = await submit(`ST-NO-${tag}`, { volatile_acidity: "0.95" });
  const conceded = await submit(`ST-CC-${tag}`, { volatile_acidity: "0.95" });
  const decided = await tech.agent
    .post(`/api/orgs/${ORG.retailer}/deviations/${conceded.submitted.deviationIds[0]}/decision`)
    .set("x-csrf-token", tech.csrf)
    .send({
      outcome: "concession",
      conditions: [{ kind: "price_adjustment", detail: "4 % off the invoice for this lot" }],
      reason: "Sound on tasting; VA stable over four weeks.",
    });
  expect(decided.status).toBe(200);
  return { good, bad, conceded };
}
