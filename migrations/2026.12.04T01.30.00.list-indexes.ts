import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/**
 * Indexes in the order the paged lists read: lots newest vintage first, the readiness board by due
 * date (undated lots as 9999-12-31, so they sort last and one index serves the order), deviations
 * newest first. MariaDB reads descending index parts in order since 10.8.
 */
const INDEXES: [name: string, table: string, columns: string][] = [
  ["lots_newest", "lots", "vintage DESC, lot_code, id"],
  ["lots_contract_newest", "lots", "contract_id, vintage DESC, lot_code, id"],
  ["lots_due", "lots", "due_on, lot_code, id"],
  ["lots_contract_due", "lots", "contract_id, due_on"],
  ["deviations_newest", "deviations", "created_at, id"],
  ["deviations_contract_newest", "deviations", "contract_id, created_at, id"],
];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("ALTER TABLE lots ADD COLUMN due_on DATE AS (COALESCE(planned_date, '9999-12-31')) STORED");
  for (const [name, table, columns] of INDEXES) await qi.sequelize.query(`CREATE INDEX ${name} ON ${table} (${columns})`);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  for (const [name, table] of [...INDEXES].reverse()) await qi.sequelize.query(`DROP INDEX ${name} ON ${table}`);
  await qi.sequelize.query("ALTER TABLE lots DROP COLUMN due_on");
}
