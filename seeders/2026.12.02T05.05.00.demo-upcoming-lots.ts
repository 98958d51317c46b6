/**
 * Lots due in the coming weeks (dates relative to the day the demo is seeded), so the readiness
 * board has work on it: one lot complete, one missing results, one bulk lot due for shipment. Their
 * results go in through the producers' own submission service.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import type { AnalysisStage } from "../shared/lots/vocabulary.ts";
import type { Container } from "../shared/lots/vocabulary.ts";
import { useDemoServices } from "./support/demo-services.ts";
import { party, plannedLot, reported } from "../tests/support/factories.ts";

const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
const CODES = ["SB-25-11", "SB-25-12", "KF-SH-25-F1"];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  useDemoServices(qi);
  const lots: { contract: number; lotCode: string; volumeLitres: number; container: Container; inDays: number }[] = [
    { contract: 1, lotCode: "SB-25-11", volumeLitres: 12000, container: "bottles", inDays: 12 },
    { contract: 1, lotCode: "SB-25-12", volumeLitres: 9000, container: "bottles", inDays: 30 },
    { contract: 3, lotCode: "KF-SH-25-F1", volumeLitres: 24000, container: "flexitank", inDays: 21 },
  ];
  const TROIS_SENTES = "elise.carbonnel@troissentes.test";
  const analyses: {
    lot: string;
    contract: number;
    by: string;
    stage: AnalysisStage;
    lab: string;
    accreditation: string | null;
    results: [string, string, string][];
  }[] = [
    {
      lot: "SB-25-11",
      stage: "pre_filling",
      lab: "Domaine des Trois Sentes cellar laboratory",
      accreditation: null,
      contract: 1,
      by: TROIS_SENTES,
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
      lot: "SB-25-12",
      stage: "pre_filling",
      lab: "Domaine des Trois Sentes cellar laboratory",
      accreditation: null,
      contract: 1,
      by: TROIS_SENTES,
      results: [
        ["alcohol", "12.9", "% vol"],
        ["free_so2", "29", "mg/L"],
        ["volatile_acidity", "0.47", "g/L as acetic acid"],
        ["ph", "3.27", "pH"],
      ],
    },
    {
      lot: "KF-SH-25-F1",
      stage: "pre_shipment",
      lab: "Riverland Wine Analysis Services",
      accreditation: "NATA 18844",
      contract: 3,
      by: "priya.anand@kestrelflats.test",
      results: [
        ["alcohol", "14.1", "% vol"],
        ["free_so2", "31", "mg/L"],
        ["total_so2", "96", "mg/L"],
        ["volatile_acidity", "0.52", "g/L as acetic acid"],
        ["dissolved_oxygen", "0.6", "mg/L"],
      ],
    },
  ];
  for (const a of analyses) {
    const producer = await party(a.by, "producer_quality");
    const lot = lots.find((l) => l.lotCode === a.lot)!;
    const { id } = await plannedLot(producer, a.contract, {
      vintage: 2025,
      lotCode: lot.lotCode,
      volumeLitres: lot.volumeLitres,
      container: lot.container,
      plannedDate: inDays(lot.inDays),
      market: "GB",
    });
    await reported(producer, id, {
      stage: a.stage,
      laboratoryName: a.lab,
      accreditation: a.accreditation,
      sampleDate: inDays(-3),
      results: a.results,
    });
  }
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("lots", { lot_code: CODES });
}
