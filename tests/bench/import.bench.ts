/**
 * CSV import of 10,000 rows (parse, map, validate in the browser and again at the route, evaluate, store in MariaDB) against a bare mariadb batch insert of the same rows, and papaparse
 * parsing alone, in the same run. Uses its own database, cellarpact_bench, rebuilt each time.
 */
import path from "node:path";
import Papa from "papaparse";
import * as mariadb from "mariadb";
import { openBenchDatabase } from "./bench-db.ts";
import { loadConfig } from "../../server/config.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { useDatabase } from "../../server/db/database.ts";
import { createMigrator, createSeeder } from "../../server/db/migrator.ts";
import { dropAllTables } from "../../server/db/reset.ts";
import { useServiceSettings } from "../../server/settings.ts";
import { importAnalyses } from "../../server/services/lots/submission-service.ts";
import { createContract } from "../../server/services/specs/contract-service.ts";
import { party } from "../support/factories.ts";
import { buildSamples, guessMapping } from "../../shared/lots/csv.ts";
import { IMPORT_BATCH_MAX, importBatchSchema } from "../../shared/lots/schemas.ts";

const ROWS = 10_000;
const root = path.resolve(import.meta.dirname, "../..");
const benchDb = openBenchDatabase();
const config = loadConfig({ ...process.env, DB_NAME: "cellarpact_bench", LOG_LEVEL: "silent" });
const sequelize = createSequelize(config);
useDatabase(sequelize);
useServiceSettings({
  appUrl: "http://127.0.0.1",
  bcryptCost: 4,
  certificateDir: path.join(root, ".data/bench-certificates"),
  signInFreeFailures: 8,
  trailSigningKeyFile: path.join(root, ".data/bench-trail-key.pem"),
  stripe: { secretKey: "sk_test_bench", webhookSecret: "whsec_bench_not_used", host: "127.0.0.1", port: 12111, protocol: "http" },
});
await dropAllTables(sequelize);
await createMigrator(sequelize).up();
await createSeeder(sequelize).up();

const lines = [
  "Lot;Vintage;Sample date;Alcohol (% vol);Free SO2 (mg/L);Total SO2 (mg/L);VA (g/L acetic);Residual sugar (g/L);Total acidity (g/L tartaric);pH;Cu (mg/L)",
];
for (let i = 0; i < ROWS; i++) {
  lines.push(
    `BX-${i};2025;01/12/2026;12,${i % 9};${22 + (i % 18)};${90 + (i % 60)};0,${35 + (i % 40)};${(1 + (i % 30) / 10).toFixed(1).replace(".", ",")};6,${i % 9};3,${20 + (i % 20)};0,${10 + (i % 30)}`,
  );
}
const csv = lines.join("\n");

const buyer = await party("tessa.marlow@harbourline.test", "buyer_technologist");
const producer = await party("elise.carbonnel@troissentes.test", "producer_quality");

const time = async <T>(fn: () => Promise<T> | T) => {
  const t = performance.now();
  const result = await fn();
  return { ms: performance.now() - t, result };
};

// Floor: papaparse alone, best of three.
const parseRuns: number[] = [];
for (let i = 0; i < 3; i++) parseRuns.push((await time(() => Papa.parse<string[]>(csv, { skipEmptyLines: "greedy" }))).ms);
const parseMs = Math.min(...parseRuns);

let run = 0;
const phases = { parse: 0, validate: 0, store: 0 };
async function fullImport() {
  run += 1;
  const { id: contractId } = await createContract(buyer.orgId, buyer.user, {
    reference: `BENCH-${run}`,
    producerOrgId: producer.orgId,
    startsOn: "2026-01-01",
    endsOn: null,
    wine: {
      name: `Bench white ${run}`,
      colour: "white",
      category: "still",
      region: "Loire Valley",
      markets: ["EU"],
      nominalSugarGPerL: 2,
      nominalAlcoholPercentVol: 12.5,
    },
  });
  const t0 = performance.now();
  const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: "greedy" });
  const [headers = [], ...rows] = parsed.data;
  const t1 = performance.now();
  const { samples, errors } = buildSamples(headers, rows, guessMapping(headers), { sampleDate: "2026-12-01" });
  if (errors.length) throw new Error(`bench CSV has errors: ${errors[0]!.message}`);
  phases.parse = t1 - t0;
  phases.validate = performance.now() - t1;
  const t2 = performance.now();
  let stored = 0;
  for (let i = 0; i < samples.length; i += IMPORT_BATCH_MAX) {
    // What the route does with the request body before the service sees it.
    const batch = importBatchSchema.parse({
      idempotencyKey: `bench-${run}-${i}`,
      stage: "pre_filling",
      laboratoryName: "Bench laboratory",
      accreditation: null,
      samples: samples.slice(i, i + IMPORT_BATCH_MAX).map(({ rows: _r, ...s }) => s),
    });
    const { response } = await importAnalyses(producer.orgId, contractId, producer.user, batch);
    stored += response.analyses;
  }
  phases.store = performance.now() - t2;
  return stored;
}

// One import first, unmeasured, so that both sides are timed with warm code and a warm buffer pool;
// then the better of two runs on each side, which keeps the ratio steady on a busy machine.
await fullImport();
const bestOf = async <T extends { ms: number }>(measure: () => Promise<T>) => {
  const first = await measure();
  const second = await measure();
  return first.ms <= second.ms ? first : second;
};
const full = await bestOf(async () => ({ ...(await time(fullImport)), phases: { ...phases } }));

/**
 * The floor: the same rows the import stored (its lots, analyses, results and evaluations, read back),
 * inserted again with the bare mariadb driver's batch() in one transaction, then rolled back.
 */
async function bareBatchInsert() {
  const conn = await mariadb.createConnection({
    host: config.DB_HOST,
    port: config.DB_PORT,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
    database: config.DB_NAME,
    dateStrings: true,
  });
  const like = `BENCH-${run}`;
  const lots = await conn.query(
    `SELECT l.id, l.contract_id, CONCAT('floor-', l.lot_code), l.vintage, l.volume_litres, l.container, l.planned_date, l.market, l.created_at, l.updated_at
       FROM lots l JOIN contracts c ON c.id = l.contract_id WHERE c.reference = ? ORDER BY l.id`,
    [like],
  );
  const analyses = await conn.query(
    `SELECT a.id, a.lot_id, a.stage, a.laboratory_name, a.accreditation, a.sample_date, a.spec_version_id, a.submitted_by, a.created_at, a.updated_at
       FROM analyses a JOIN lots l ON l.id = a.lot_id JOIN contracts c ON c.id = l.contract_id WHERE c.reference = ? ORDER BY a.id`,
    [like],
  );
  const ids = analyses.map((a: { id: number }) => a.id);
  const results = await conn.query(
    "SELECT analysis_id, parameter, raw_text, reading, unit, uncertainty, method FROM analysis_results WHERE analysis_id IN (?)",
    [ids],
  );
  const evaluations = await conn.query(
    "SELECT analysis_id, spec_version_id, engine_version, market_versions, worst_outcome, verdicts, profile, created_at FROM analysis_evaluations WHERE analysis_id IN (?)",
    [ids],
  );
  const [{ next }] = await conn.query("SELECT MAX(id) + 1 AS next FROM analyses");
  const newId = new Map<number, number>(ids.map((id: number, i: number) => [id, Number(next) + i]));
  const [{ nextLot }] = await conn.query("SELECT MAX(id) + 1 AS nextLot FROM lots");
  const newLotId = new Map<number, number>(lots.map((l: { id: number }, i: number) => [l.id, Number(nextLot) + i]));
  const t = performance.now();
  await conn.beginTransaction();
  await conn.batch(
    "INSERT INTO lots (id, contract_id, lot_code, vintage, volume_litres, container, planned_date, market, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)",
    lots.map((l: Record<string, unknown>) => [newLotId.get(l.id as number), ...Object.values(l).slice(1)]),
  );
  await conn.batch(
    "INSERT INTO analyses (id, lot_id, stage, laboratory_name, accreditation, sample_date, spec_version_id, submitted_by, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)",
    analyses.map((a: Record<string, unknown>) => [
      newId.get(a.id as number),
      newLotId.get(a.lot_id as number),
      ...Object.values(a).slice(2),
    ]),
  );
  await conn.batch(
    "INSERT INTO analysis_results (analysis_id, parameter, raw_text, reading, unit, uncertainty, method) VALUES (?, ?, ?, ?, ?, ?, ?)",
    results.map((r: Record<string, unknown>) => [newId.get(r.analysis_id as number), ...Object.values(r).slice(1)]),
  );
  await conn.batch(
    "INSERT INTO analysis_evaluations (analysis_id, spec_version_id, engine_version, market_versions, worst_outcome, verdicts, profile, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)",
    evaluations.map((e: Record<string, unknown>) => [newId.get(e.analysis_id as number), ...Object.values(e).slice(1)]),
  );
  const ms = performance.now() - t;
  await conn.rollback();
  await conn.end();
  return { ms, rows: lots.length + analyses.length + results.length + evaluations.length };
}
const floor = await bestOf(bareBatchInsert);

console.log(`CSV import benchmark: ${ROWS} rows × 8 parameters`);
console.log(`  papaparse parse only          ${parseMs.toFixed(1)} ms`);
console.log(`  parse + validate + evaluate + store (MariaDB)  ${full.ms.toFixed(0)} ms, ${full.result} analyses stored`);
console.log(
  `    of which parse ${full.phases.parse.toFixed(0)} ms, map + validate ${full.phases.validate.toFixed(0)} ms, route validation + evaluate + store ${full.phases.store.toFixed(0)} ms`,
);
console.log(
  `  bare mariadb batch() insert of the same ${floor.rows.toLocaleString("en-GB")} rows in one transaction: ${floor.ms.toFixed(0)} ms`,
);
console.log(`  ratio full import / bare batch insert: ${(full.ms / floor.ms).toFixed(2)}× (goal ≤ 2)`);
await sequelize.close();
benchDb.stop();
