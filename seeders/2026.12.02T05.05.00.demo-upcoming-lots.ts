/**
 * Lots due in the coming weeks (dates relative to the day the demo is seeded), so the readiness
 * board has work on it: one lot complete, one missing results, one bulk lot due for shipment. They
 * are made with the factories, so they go in through the producers' own services.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import type { AnalysisStage, Container } from "../shared/lots/vocabulary.ts";
import { useDemoServices } from "./support/demo-services.ts";
import { inDays, party, plannedLot, reported } from "../tests/support/factories.ts";

const TROIS_SENTES = {
  by: "elise.carbonnel@troissentes.test",
  contract: 1,
  lab: "Domaine des Trois Sentes cellar laboratory",
  accreditation: null,
};
const KESTREL = { by: "priya.anand@kestrelflats.test", contract: 3, lab: "Riverland Wine Analysis Services", accreditation: "NATA 18844" };

const LOTS: {
  from: typeof TROIS_SENTES | typeof KESTREL;
  lotCode: string;
  volumeLitres: number;
  container: Container;
  dueInDays: number;
  stage: AnalysisStage;
  results: [string, string, string][];
}[] = [
  {
    from: TROIS_SENTES,
    lotCode: "SB-25-11",
    volumeLitres: 12000,
    container: "bottles",
    dueInDays: 12,
    stage: "pre_filling",
    results: [
      ["alcohol", "12.6", "% vol"],
      ["free_so2", "33", "mg/L"],
      ["total_so2", "112", "mg/L"],
      ["volatile_acidity", "0.39", "g/L as acetic acid"],
      ["residual_sugar", "2.1", "g/L"],
      ["total_acidity", "6.4", "g/L as tartaric acid"],
      ["ph", "3.21", "pH"],
      ["heat_test_haze", "0.8", "NTU"],
      ["cold_stability_conductivity", "2.1", "%"],
      ["copper", "0.14", "mg/L"],
      ["iron", "2.2", "mg/L"],
    ],
  },
  {
    from: TROIS_SENTES,
    lotCode: "SB-25-12",
    volumeLitres: 9000,
    container: "bottles",
    dueInDays: 30,
    stage: "pre_filling",
    results: [
      ["alcohol", "12.9", "% vol"],
      ["free_so2", "29", "mg/L"],
      ["volatile_acidity", "0.47", "g/L as acetic acid"],
      ["ph", "3.27", "pH"],
    ],
  },
  {
    from: KESTREL,
    lotCode: "KF-SH-25-F1",
    volumeLitres: 24000,
    container: "flexitank",
    dueInDays: 21,
    stage: "pre_shipment",
    results: [
      ["alcohol", "14.1", "% vol"],
      ["free_so2", "31", "mg/L"],
      ["total_so2", "96", "mg/L"],
      ["volatile_acidity", "0.52", "g/L as acetic acid"],
      ["dissolved_oxygen", "0.6", "mg/L"],
    ],
  },
];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  useDemoServices(qi);
  for (const lot of LOTS) {
    const producer = await party(lot.from.by, "producer_quality");
    const { id } = await plannedLot(producer, lot.from.contract, {
      vintage: 2025,
      lotCode: lot.lotCode,
      volumeLitres: lot.volumeLitres,
      container: lot.container,
      plannedDate: inDays(lot.dueInDays),
      market: "GB",
    });
    await reported(producer, id, {
      stage: lot.stage,
      laboratoryName: lot.from.lab,
      accreditation: lot.from.accreditation,
      sampleDate: inDays(-3),
      results: lot.results,
    });
  }
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("lots", { lot_code: LOTS.map((l) => l.lotCode) });
}
