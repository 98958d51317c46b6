import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("invitations", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    organisation_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: "organisations", key: "id" },
      onDelete: "CASCADE",
    },
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: {
      type: DataTypes.ENUM("buyer_technologist", "buyer_finance", "producer_quality", "lab_analyst", "org_admin"),
      allowNull: false,
    },
    // Only the SHA-256 of the mailed token is stored, so a database leak does not leak live links.
    token_hash: { type: DataTypes.CHAR(64), allowNull: false },
    invited_by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" } },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    accepted_at: { type: DataTypes.DATE(3), allowNull: true },
    revoked_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("invitations", ["token_hash"], { unique: true, name: "invitations_token_unique" });
  await qi.addIndex("invitations", ["organisation_id"], { name: "invitations_org" });

  await qi.createTable("password_resets", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false },
    expires_at: { type: DataTypes.DATE(3), allowNull: false },
    used_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("password_resets", ["token_hash"], { unique: true, name: "password_resets_token_unique" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("password_resets");
  await qi.dropTable("invitations");
}
