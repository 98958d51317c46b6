import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const stamps = { created_at: { type: DataTypes.DATE(3), allowNull: false }, updated_at: { type: DataTypes.DATE(3), allowNull: false } };

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("lots", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    contract_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "contracts", key: "id" }, onDelete: "CASCADE" },
    vintage: { type: DataTypes.SMALLINT, allowNull: false },
    lot_code: { type: DataTypes.STRING(60), allowNull: false },
    volume_litres: { type: DataTypes.DECIMAL(12, 1), allowNull: false },
    container: { type: DataTypes.ENUM("bottles", "iso_tank", "flexitank"), allowNull: false },
    planned_date: { type: DataTypes.DATEONLY, allowNull: true },
    market: { type: DataTypes.STRING(10), allowNull: false },
    ...stamps,
  });
  await qi.addIndex("lots", ["contract_id", "lot_code"], { unique: true, name: "lots_code_unique" });

  await qi.createTable("analyses", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    lot_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "lots", key: "id" }, onDelete: "CASCADE" },
    stage: { type: DataTypes.ENUM("pre_filling", "retest", "final_check", "pre_shipment", "on_arrival"), allowNull: false },
    laboratory_name: { type: DataTypes.STRING(160), allowNull: false },
    accreditation: { type: DataTypes.STRING(60), allowNull: true },
    sample_date: { type: DataTypes.DATEONLY, allowNull: false },
    spec_version_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "spec_versions", key: "id" } },
    submitted_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" } },
    ...stamps,
  });
  await qi.addIndex("analyses", ["lot_id"], { name: "analyses_lot" });

  await qi.createTable("analysis_results", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    analysis_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "analyses", key: "id" }, onDelete: "CASCADE" },
    parameter: { type: DataTypes.STRING(40), allowNull: false },
    // As the laboratory wrote it, and as the engine reads it (censored results stay censored).
    raw_text: { type: DataTypes.STRING(40), allowNull: false },
    reading: { type: DataTypes.JSON, allowNull: false },
    unit: { type: DataTypes.STRING(30), allowNull: false },
    uncertainty: { type: DataTypes.JSON, allowNull: true },
    method: { type: DataTypes.STRING(120), allowNull: true },
  });
  await qi.addIndex("analysis_results", ["analysis_id", "parameter"], { unique: true, name: "analysis_results_unique" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("analysis_results");
  await qi.dropTable("analyses");
  await qi.dropTable("lots");
}
