import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** The tamper-evident record is "the trail"; "audit" is kept for the paid laboratory audit. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("RENAME TABLE audit_events TO trail_entries, audit_head TO trail_head");
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("RENAME TABLE trail_entries TO audit_events, trail_head TO audit_head");
}
