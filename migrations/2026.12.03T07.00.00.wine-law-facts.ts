import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** The facts the law asks about a wine (organic, PDO/PGI, listings for higher limits), as its buyer states them. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("wines", "law_facts", { type: DataTypes.JSON, allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  // Sequelize's removeColumn trips over MariaDB's result shape; plain SQL does the same.
  await qi.sequelize.query("ALTER TABLE wines DROP COLUMN law_facts");
}
