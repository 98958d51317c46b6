import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** Every signed tree head Cellarpact has published (mailed to the organisations' admins), newest last. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("trail_tree_heads", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    tree_size: { type: DataTypes.INTEGER, allowNull: false },
    root_hash: { type: DataTypes.CHAR(64), allowNull: false },
    signed_at: { type: DataTypes.STRING(30), allowNull: false },
    key_id: { type: DataTypes.CHAR(64), allowNull: false },
    signature: { type: DataTypes.STRING(120), allowNull: false },
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("trail_tree_heads");
}
