/**
 * Three lots under the Sentier Blanc contract, due in three weeks: one that conforms, one whose
 * volatile acidity fails, and one with the same failure accepted under concession by the buyer.
 * Made with the factories, through the services.
 */
import { CONTRACT, DEMO } from "./api.ts";
import { analysed, decided, inDays, party, plannedLot } from "./factories.ts";

export type ThreeLots = Record<
  "good" | "bad" | "conceded",
  { id: number; code: string; submitted: { failing: string[]; deviationIds: number[]; counts: Record<string, number> } }
>;

export const THREE_LOT_STATUSES = {
  good: ["conforms", "Conforms"],
  bad: ["does_not_conform", "Does not conform"],
  conceded: ["concession", "Accepted under concession"],
} as const;

export async function setUpThreeLots(tag: string): Promise<ThreeLots> {
  const producer = await party(DEMO.producerQuality, "producer_quality");
  const buyer = await party(DEMO.buyerTechnologist, "buyer_technologist");
  const submit = async (code: string, overrides: Record<string, string>) => {
    const { id } = await plannedLot(producer, CONTRACT.sentierBlanc, { lotCode: code, plannedDate: inDays(20) });
    return { id, code, submitted: await analysed(producer, id, "pre_filling", overrides) };
  };
  const good = await submit(`ST-OK-${tag}`, {});
  const bad = await submit(`ST-NO-${tag}`, { volatile_acidity: "0.95" });
  const conceded = await submit(`ST-CC-${tag}`, { volatile_acidity: "0.95" });
  await decided(buyer, conceded.submitted.deviationIds[0]!, {
    outcome: "concession",
    conditions: [{ kind: "price_adjustment", detail: "4 % off the invoice for this lot" }],
    reason: "Sound on tasting; VA stable over four weeks.",
  });
  return { good, bad, conceded };
}
