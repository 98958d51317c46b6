import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/**
 * Indexes in the order the paged lists read: lots newest vintage first, the readiness board by due
 * date (undated lots as 9999-12-31, so they sort last and one index serves the order), deviations
 * newest first. MariaDB reads descending index parts in order since 10.8.
 */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("ALTER TABLE lots ADD COLUMN due_on DATE AS (COALESCE(planned_date, '9999-12-31')) STORED");
  await qi.sequelize.query("CREATE INDEX lots_newest ON lots (vintage DESC, lot_code, id)");
  await qi.sequelize.query("CREATE INDEX lots_contract_newest ON lots (contract_id, vintage DESC, lot_code, id)");
  await qi.sequelize.query("CREATE INDEX lots_due ON lots (due_on, lot_code, id)");
  await qi.sequelize.query("CREATE INDEX lots_contract_due ON lots (contract_id, due_on)");
  await qi.sequelize.query("CREATE INDEX deviations_newest ON deviations (created_at, id)");
  await qi.sequelize.query("CREATE INDEX deviations_contract_newest ON deviations (contract_id, created_at, id)");
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("DROP INDEX deviations_contract_newest ON deviations");
  await qi.sequelize.query("DROP INDEX deviations_newest ON deviations");
  await qi.sequelize.query("DROP INDEX lots_contract_due ON lots");
  await qi.sequelize.query("DROP INDEX lots_due ON lots");
  await qi.sequelize.query("DROP INDEX lots_contract_newest ON lots");
  await qi.sequelize.query("DROP INDEX lots_newest ON lots");
  await qi.sequelize.query("ALTER TABLE lots DROP COLUMN due_on");
}
