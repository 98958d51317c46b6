import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** The wine profile the law was read with, so a verdict stays reproducible when the wine's facts change. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("analysis_evaluations", "profile", { type: DataTypes.JSON, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  // Sequelize's removeColumn trips over MariaDB's result shape; plain SQL does the same.
  await qi.sequelize.query("ALTER TABLE analysis_evaluations DROP COLUMN profile");
}
