/**
 * Grows the demo to a national retailer's size through SQL: new lots spread over the demo's
 * contracts and twelve vintages, mostly dated over the two years around today (one in ten
 * undated); each has 2 or 3 analyses whose results and stored evaluation are those of a real demo
 * analysis of the same contract, and about one analysis in thirty has an open deviation. MariaDB
 * makes the rows itself (INSERT … SELECT over the Sequence engine), in chunks, so 100,000 lots take
 * about a minute. The data is invented, like the rest of the demo.
 */
import { QueryTypes, type Sequelize } from "sequelize";

export async function growDemo(sequelize: Sequelize, total: number, chunk = 10_000, progress?: (done: number) => void): Promise<void> {
  const q = (sql: string, replacements: Record<string, unknown> = {}) => sequelize.query(sql, { replacements });
  const one = async <T extends object>(sql: string) => (await sequelize.query<T>(sql, { type: QueryTypes.SELECT }))[0]!;
  const run = Date.now().toString(36).slice(-5).toUpperCase();
  // One evaluated analysis per contract to copy: the latest, with its results and verdicts.
  await q("DROP TEMPORARY TABLE IF EXISTS scale_templates");
  await q(`CREATE TEMPORARY TABLE scale_templates AS
    SELECT l.contract_id, MAX(a.id) AS analysis_id, ROW_NUMBER() OVER (ORDER BY l.contract_id) - 1 AS n
      FROM analyses a JOIN lots l ON l.id = a.lot_id JOIN analysis_evaluations e ON e.analysis_id = a.id
     GROUP BY l.contract_id`);
  const { k } = await one<{ k: number }>("SELECT COUNT(*) AS k FROM scale_templates");
  if (!k) throw new Error("No evaluated demo analysis to copy: seed the demo first (npm run db:seed).");

  for (let from = 1; from <= total; from += chunk) {
    const to = Math.min(total, from + chunk - 1);
    const { firstLot } = await one<{ firstLot: number }>("SELECT COALESCE(MAX(id), 0) + 1 AS firstLot FROM lots");
    await q(
      `INSERT INTO lots (contract_id, vintage, lot_code, volume_litres, container, planned_date, market, created_at, updated_at)
       SELECT t.contract_id, 2014 + s.seq % 12, CONCAT('SC', :run, '-', LPAD(s.seq, 7, '0')), 3000 + (s.seq % 20) * 1000, 'bottles',
              IF(s.seq % 10 = 0, NULL, DATE_ADD(CURDATE(), INTERVAL CAST((s.seq * 37) % 730 AS SIGNED) - 400 DAY)), 'GB', NOW(3), NOW(3)
         FROM seq_${from}_to_${to} s JOIN scale_templates t ON t.n = s.seq % :k`,
      { run, k },
    );
    const { firstAnalysis } = await one<{ firstAnalysis: number }>("SELECT COALESCE(MAX(id), 0) + 1 AS firstAnalysis FROM analyses");
    await q(
      `INSERT INTO analyses (lot_id, stage, laboratory_name, accreditation, sample_date, spec_version_id, submitted_by, created_at, updated_at)
       SELECT l.id, ELT(k.seq, 'pre_filling', 'final_check', 'pre_shipment'), a.laboratory_name, a.accreditation,
              DATE_SUB(COALESCE(l.planned_date, CURDATE()), INTERVAL (4 - k.seq) * 5 DAY), a.spec_version_id, a.submitted_by, NOW(3), NOW(3)
         FROM lots l JOIN scale_templates t ON t.contract_id = l.contract_id JOIN analyses a ON a.id = t.analysis_id
         JOIN seq_1_to_3 k ON k.seq <= 2 + l.id % 2
        WHERE l.id >= :firstLot`,
      { firstLot },
    );
    const copied = `FROM analyses n JOIN lots l ON l.id = n.lot_id JOIN scale_templates t ON t.contract_id = l.contract_id`;
    await q(
      `INSERT INTO analysis_results (analysis_id, parameter, raw_text, reading, unit, uncertainty, method)
       SELECT n.id, r.parameter, r.raw_text, r.reading, r.unit, r.uncertainty, r.method ${copied}
         JOIN analysis_results r ON r.analysis_id = t.analysis_id WHERE n.id >= :firstAnalysis`,
      { firstAnalysis },
    );
    await q(
      `INSERT INTO analysis_evaluations (analysis_id, spec_version_id, engine_version, market_versions, worst_outcome, verdicts, profile, created_at)
       SELECT n.id, e.spec_version_id, e.engine_version, e.market_versions, e.worst_outcome, e.verdicts, e.profile, NOW(3) ${copied}
         JOIN analysis_evaluations e ON e.analysis_id = t.analysis_id WHERE n.id >= :firstAnalysis`,
      { firstAnalysis },
    );
    await q(
      `INSERT INTO deviations (contract_id, lot_id, analysis_id, kind, status, parameters, summary, respond_by, created_at, updated_at)
       SELECT l.contract_id, l.id, n.id, 'result', 'open', '["volatile_acidity"]', 'Volatile acidity falls outside the governing limits.',
              DATE_ADD(NOW(3), INTERVAL CAST(n.id % 20 AS SIGNED) - 5 DAY), NOW(3), NOW(3)
         FROM analyses n JOIN lots l ON l.id = n.lot_id WHERE n.id >= :firstAnalysis AND n.id % 30 = 0`,
      { firstAnalysis },
    );
    progress?.(to);
  }
  await sequelize.query("ANALYZE TABLE lots, analyses, analysis_results, analysis_evaluations, deviations", { type: QueryTypes.SELECT });
}

/** How many rows the tables that grow hold. */
export async function demoSize(sequelize: Sequelize): Promise<Record<"lots" | "analyses" | "results" | "deviations", number>> {
  const [row] = await sequelize.query<Record<string, number>>(
    "SELECT (SELECT COUNT(*) FROM lots) AS lots, (SELECT COUNT(*) FROM analyses) AS analyses, (SELECT COUNT(*) FROM analysis_results) AS results, (SELECT COUNT(*) FROM deviations) AS deviations",
    { type: QueryTypes.SELECT },
  );
  return { lots: Number(row!.lots), analyses: Number(row!.analyses), results: Number(row!.results), deviations: Number(row!.deviations) };
}
