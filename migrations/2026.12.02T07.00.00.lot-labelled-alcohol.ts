import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** The alcoholic strength the lot's label states, for the label check against the analysis. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("lots", "labelled_alcohol_percent_vol", { type: DataTypes.DECIMAL(4, 1), allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  // Sequelize's removeColumn trips over MariaDB's result shape; plain SQL does the same.
  await qi.sequelize.query("ALTER TABLE lots DROP COLUMN labelled_alcohol_percent_vol");
}
