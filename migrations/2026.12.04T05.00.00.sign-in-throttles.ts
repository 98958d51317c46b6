import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** Failed sign-ins per account (or per known device of an account), in the database so every app node sees them. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("sign_in_throttles", {
    subject: { type: DataTypes.STRING(300), primaryKey: true },
    failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    blocked_until: { type: DataTypes.DATE(3), allowNull: true },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("sign_in_throttles");
}
