import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** How the laboratory writes numbers ("point": 1,234.5; "comma": 1.234,5), so its text is read again the same way. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("analyses", "number_format", { type: DataTypes.STRING(5), allowNull: true });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  // Plain SQL: Sequelize's removeColumn trips over MariaDB's result shape.
  await qi.sequelize.query("ALTER TABLE analyses DROP COLUMN number_format");
}
