/**
 * Lots due in the coming weeks (dates relative to the day the demo is seeded), so the readiness
 * board has work on it: one lot complete, one missing results, one bulk lot due for shipment.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
const CODES = ["SB-25-11", "SB-25-12", "KF-SH-25-F1"];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  const now = new Date();
  const stamps = { created_at: now, updated_at: now };
  const lots = [
    { contract_id: 1, vintage: 2025, lot_code: "SB-25-11", volume_litres: 12000, container: "bottles", planned_date: inDays(12), market: "EU" },
    { contract_id: 1, vintage: 2025, lot_code: "SB-25-12", volume_litres: 9000, container: "bottles", planned_date: inDays(30), market: "EU" },
    { contract_id: 3, vintage: 2025, lot_code: "KF-SH-25-F1", volume_litres: 24000, container: "flexitank", planned_date: inDays(21), market: "EU" },
  ];
  for (const lot of lots) await qi.bulkInsert("lots", [{ ...lot, ...stamps }]);
  const ids = (await qi.sequelize.query<{ id: number; lot_code: string }>("SELECT id, lot_code FROM lots WHERE lot_code IN (?)", { replacements: [CODES], type: "SELECT" as never })) as unknown as { id: number; lot_code: string }[];
  const id = (code: string) => ids.find((l) => l.lot_code === code)!.id;
  const analyses: { lot: string; stage: string; lab: string; accreditation: string | null; version: number; results: [string, string, string][] }[] = [
    {
      lot: "SB-25-11",
      stage: "pre_filling",
      lab: "Domaine des Trois Sentes cellar laboratory",
      accreditation: null,
      version: 1,
      results: [["alcohol", "12.6", "% vol"], ["free_so2", "33", "mg/L"], ["total_so2", "112", "mg/L"], ["volatile_acidity", "0.39", "g/L as acetic acid"], ["residual_sugar", "2.1", "g/L"], ["total_acidity", "6.4", "g/L as tartaric acid"], ["ph", "3.21", "pH"], ["heat_test_haze", "0.8", "NTU"], ["cold_stability_conductivity", "2.1", "%"], ["copper", "0.14", "mg/L"], ["iron", "2.2", "mg/L"]],
    },
    {
      lot: "SB-25-12",
      stage: "pre_filling",
      lab: "Domaine des Trois Sentes cellar laboratory",
      accreditation: null,
      version: 1,
      results: [["alcohol", "12.9", "% vol"], ["free_so2", "29", "mg/L"], ["volatile_acidity", "0.47", "g/L as acetic acid"], ["ph", "3.27", "pH"]],
    },
    {
      lot: "KF-SH-25-F1",
      stage: "pre_shipment",
      lab: "Riverland Wine Analysis Services",
      accreditation: "NATA 18844",
      version: 2,
      results: [["alcohol", "14.1", "% vol"], ["free_so2", "31", "mg/L"], ["total_so2", "96", "mg/L"], ["volatile_acidity", "0.52", "g/L as acetic acid"], ["dissolved_oxygen", "0.6", "mg/L"]],
    },
  ];
  for (const a of analyses) {
    await qi.bulkInsert("analyses", [{ lot_id: id(a.lot), stage: a.stage, laboratory_name: a.lab, accreditation: a.accreditation, sample_date: inDays(-3), spec_version_id: a.version, submitted_by: null, ...stamps }]);
    const rows = (await qi.sequelize.query("SELECT MAX(id) AS aid FROM analyses", { type: "SELECT" as never })) as unknown as { aid: number }[];
    const aid = rows[0]!.aid;
    await qi.bulkInsert("analysis_results", a.results.map(([parameter, raw, unit]) => ({ analysis_id: aid, parameter, raw_text: raw, reading: JSON.stringify({ kind: "value", value: Number(raw) }), unit, uncertainty: null, method: null })));
  }
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("lots", { lot_code: CODES });
}
