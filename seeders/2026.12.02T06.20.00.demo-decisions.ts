/**
 * Decisions on demo deviations, made through the same services as the buyer's technologist, so the
 * demo shows every lot status: Kestrel Flats' low free SO2 accepted under concession with its
 * conditions, and a Sentier Blanc lot whose volatile acidity is beyond correction rejected.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import { Deviation } from "../server/models/deviation.ts";
import { Lot } from "../server/models/lot.ts";
import { useDemoServices } from "./support/demo-services.ts";
import { decided, party, plannedLot, reported } from "../tests/support/factories.ts";

const TESSA = "tessa.marlow@harbourline.test";
const REJECTED_LOT = "SB-24-T1";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  useDemoServices(qi);
  const buyer = await party(TESSA, "buyer_technologist");
  const elise = await party("elise.carbonnel@troissentes.test", "producer_quality");

  const kestrel = await Lot.findOne({ where: { contractId: 3, lotCode: "KF-SH-24-F2" } });
  const low = kestrel ? await Deviation.findOne({ where: { lotId: kestrel.id, kind: "result" } }) : null;
  if (low) {
    await decided(buyer, low.id, {
      outcome: "concession",
      conditions: [
        { kind: "treatment", detail: "Free SO2 brought back to 30 mg/L on arrival, before bottling" },
        { kind: "retest", detail: "Free SO2 re-tested by the bottling laboratory after the addition" },
      ],
      reason: "The loss is what the transit allowance expects for this crossing; the wine is sound on tasting.",
    });
  }

  const lot = await plannedLot(elise, 1, { vintage: 2024, lotCode: REJECTED_LOT, volumeLitres: 6000, plannedDate: null, market: "GB" });
  const sent = await reported(elise, lot.id, {
    stage: "pre_filling",
    laboratoryName: "Northgate Oenology Laboratory",
    accreditation: "UKAS 4412",
    sampleDate: "2025-09-12",
    results: [
      ["alcohol", "12.4", "% vol"],
      ["free_so2", "31", "mg/L"],
      ["total_so2", "118", "mg/L"],
      ["volatile_acidity", "0.82", "g/L as acetic acid"],
      ["residual_sugar", "2.3", "g/L"],
      ["total_acidity", "6.2", "g/L as tartaric acid"],
      ["ph", "3.24", "pH"],
      ["heat_test_haze", "0.7", "NTU"],
      ["cold_stability_conductivity", "2.4", "%"],
      ["copper", "0.12", "mg/L"],
      ["iron", "2.0", "mg/L"],
    ],
  });
  const taint = sent.deviationIds[0];
  if (taint !== undefined)
    await decided(buyer, taint, {
      outcome: "rejected",
      conditions: [],
      reason: "Volatile acidity at 0.82 g/L is beyond what blending can correct within this contract's limits.",
    });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("lots", { lot_code: REJECTED_LOT });
  await qi.sequelize.query(
    "UPDATE deviations SET status = 'open', decision = NULL, decided_at = NULL, decided_by = NULL WHERE kind = 'result' AND lot_id IN (SELECT id FROM lots WHERE lot_code = 'KF-SH-24-F2')",
  );
}
