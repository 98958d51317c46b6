import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const created = { created_at: { type: DataTypes.DATE(3), allowNull: false } };

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  // The verdicts of one analysis as computed at submission, with everything needed to reproduce them.
  await qi.createTable("analysis_evaluations", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    analysis_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "analyses", key: "id" }, onDelete: "CASCADE" },
    spec_version_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "spec_versions", key: "id" } },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    market_versions: { type: DataTypes.JSON, allowNull: false },
    worst_outcome: { type: DataTypes.STRING(20), allowNull: false },
    verdicts: { type: DataTypes.JSON, allowNull: false },
    ...created,
  });
  await qi.addIndex("analysis_evaluations", ["analysis_id"], { unique: true, name: "analysis_evaluations_analysis_unique" });

  await qi.createTable("deviations", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    contract_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "contracts", key: "id" }, onDelete: "CASCADE" },
    lot_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    analysis_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "analyses", key: "id" } },
    kind: { type: DataTypes.ENUM("result", "transit", "manual"), allowNull: false },
    status: { type: DataTypes.STRING(30), allowNull: false },
    parameters: { type: DataTypes.JSON, allowNull: false },
    summary: { type: DataTypes.TEXT, allowNull: false },
    opened_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" } },
    ...created,
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("deviations", ["contract_id", "status"], { name: "deviations_contract" });

  await qi.createTable("certificates", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    analysis_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "analyses", key: "id" }, onDelete: "CASCADE" },
    original_name: { type: DataTypes.STRING(200), allowNull: false },
    stored_name: { type: DataTypes.STRING(80), allowNull: false },
    mime: { type: DataTypes.STRING(60), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    uploaded_by: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" } },
    ...created,
  });

  // A retried submission with the same key returns the first answer instead of writing twice.
  await qi.createTable("idempotency_keys", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    organisation_id: { type: DataTypes.INTEGER, allowNull: false },
    key: { type: DataTypes.STRING(100), allowNull: false },
    request_hash: { type: DataTypes.CHAR(64), allowNull: false },
    response: { type: DataTypes.JSON, allowNull: false },
    ...created,
  });
  await qi.addIndex("idempotency_keys", ["organisation_id", "key"], { unique: true, name: "idempotency_keys_unique" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("idempotency_keys");
  await qi.dropTable("certificates");
  await qi.dropTable("deviations");
  await qi.dropTable("analysis_evaluations");
}
