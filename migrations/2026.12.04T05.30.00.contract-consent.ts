import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** A contract binds the producer only once its admin accepts it; contracts opened before this were agreed on paper. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("contracts", "producer_accepted_at", { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn("contracts", "producer_accepted_by", { type: DataTypes.INTEGER, allowNull: true });
  await qi.sequelize.query("UPDATE contracts SET producer_accepted_at = created_at");
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  // Raw SQL: Sequelize's removeColumn fails on this dialect.
  await qi.sequelize.query("ALTER TABLE contracts DROP COLUMN producer_accepted_by, DROP COLUMN producer_accepted_at");
}
