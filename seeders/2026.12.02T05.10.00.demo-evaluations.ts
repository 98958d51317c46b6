/**
 * Judges the demo's past analyses with the engine, as a submission would have, so the demo's lots
 * show stored verdicts (and deviations where a result fails) from the first start.
 */
import { QueryTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import { evaluateAnalysis } from "../server/services/lots/evaluate-analysis.ts";
import type { RequirementView } from "../shared/specs/views.ts";
import type { AnalysisStage } from "../shared/lots/vocabulary.ts";
import { findParameter, type ReportedUncertainty } from "../shared/engine/index.ts";

const json = <T>(v: unknown): T => (typeof v === "string" ? JSON.parse(v) : v) as T;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  const q = <T extends object>(sql: string, replacements: unknown[] = []) => qi.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const analyses = await q<{ id: number; stage: AnalysisStage; spec_version_id: number; lot_id: number; lot_code: string; vintage: number; market: string; colour: string; category: string; markets: unknown; sugar: number | null; alcohol: number | null; contract_id: number }>(
    `SELECT a.id, a.stage, a.spec_version_id, l.id AS lot_id, l.lot_code, l.vintage, l.market, w.colour, w.category, w.markets, w.nominal_sugar_g_per_l AS sugar, w.nominal_alcohol_percent_vol AS alcohol, l.contract_id
       FROM analyses a JOIN lots l ON l.id = a.lot_id JOIN contracts c ON c.id = l.contract_id JOIN wines w ON w.id = c.wine_id
      WHERE a.spec_version_id IS NOT NULL AND NOT EXISTS (SELECT 1 FROM analysis_evaluations e WHERE e.analysis_id = a.id)`,
  );
  const now = new Date("2026-11-20T09:00:00Z");
  for (const a of analyses) {
    const requirements = (await q<{ id: number; parameter: string; unit: string; lower: number | null; upper: number | null; target: number | null; method: string | null; rule: unknown; severity: string; stages: unknown }>(
      "SELECT * FROM spec_requirements WHERE spec_version_id = ? ORDER BY position",
      [a.spec_version_id],
    )).map((r) => ({ ...r, rule: json(r.rule), stages: json(r.stages) }) as RequirementView);
    const results = (await q<{ parameter: string; raw_text: string; unit: string; uncertainty: unknown }>("SELECT parameter, raw_text, unit, uncertainty FROM analysis_results WHERE analysis_id = ?", [a.id])).map((r) => ({
      parameter: r.parameter,
      raw: r.raw_text,
      unit: r.unit,
      uncertainty: json<ReportedUncertainty | null>(r.uncertainty),
    }));
    const wine = { colour: a.colour, category: a.category, markets: json(a.markets), nominalSugarGPerL: a.sugar, nominalAlcoholPercentVol: a.alcohol } as Parameters<typeof evaluateAnalysis>[0];
    const e = evaluateAnalysis(wine, { vintage: a.vintage, market: a.market }, a.stage, requirements, results);
    await qi.bulkInsert("analysis_evaluations", [{ analysis_id: a.id, spec_version_id: a.spec_version_id, engine_version: e.engineVersion, market_versions: JSON.stringify(e.marketVersions), worst_outcome: e.worst, verdicts: JSON.stringify(e.verdicts), created_at: now }]);
    const failing = e.verdicts.filter((v) => v.outcome === "fail" || v.outcome === "conditional fail").map((v) => v.parameter);
    if (failing.length) {
      await qi.bulkInsert("deviations", [
        { contract_id: a.contract_id, lot_id: a.lot_id, analysis_id: a.id, kind: "result", status: "open", parameters: JSON.stringify(failing), summary: `Lot ${a.lot_code}: ${failing.map((p) => findParameter(p)?.name ?? p).join(", ")} outside the agreed specification at ${a.stage.replace("_", " ")}.`, opened_by: null, respond_by: new Date(now.getTime() + 5 * 86_400_000), created_at: now, updated_at: now },
      ]);
    }
  }
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("DELETE FROM deviations WHERE opened_by IS NULL AND kind = 'result'");
  await qi.sequelize.query("DELETE FROM analysis_evaluations WHERE created_at = '2026-11-20 09:00:00.000'");
}
