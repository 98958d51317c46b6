import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("organisations", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.ENUM("retailer", "producer", "laboratory"), allowNull: false },
    country: { type: DataTypes.CHAR(2), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex("organisations", ["name"], { unique: true, name: "organisations_name_unique" });

  await qi.createTable("users", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(80), allowNull: true },
    is_platform_admin: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    // Bumped on sign-out, password change and role change so older session tokens stop working.
    session_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await qi.addIndex("users", ["email"], { unique: true, name: "users_email_unique" });

  await qi.createTable("memberships", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    organisation_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: "organisations", key: "id" },
      onDelete: "CASCADE",
    },
    role: {
      type: DataTypes.ENUM("buyer_technologist", "buyer_finance", "producer_quality", "lab_analyst", "org_admin"),
      allowNull: false,
    },
    ...timestamps,
  });
  await qi.addIndex("memberships", ["user_id", "organisation_id"], { unique: true, name: "memberships_user_org_unique" });
  await qi.addIndex("memberships", ["organisation_id"], { name: "memberships_org" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("memberships");
  await qi.dropTable("users");
  await qi.dropTable("organisations");
}
