import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const stamps = { created_at: { type: DataTypes.DATE(3), allowNull: false }, updated_at: { type: DataTypes.DATE(3), allowNull: false } };
const user = (allowNull = true) => ({ type: DataTypes.INTEGER, allowNull, references: { model: "users", key: "id" } });

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("spec_versions", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    contract_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "contracts", key: "id" }, onDelete: "CASCADE" },
    number: { type: DataTypes.INTEGER, allowNull: false },
    status: { type: DataTypes.ENUM("draft", "with_producer", "changes_requested", "agreed", "replaced", "withdrawn"), allowNull: false },
    title: { type: DataTypes.STRING(160), allowNull: true },
    vintage_from: { type: DataTypes.SMALLINT, allowNull: false },
    vintage_to: { type: DataTypes.SMALLINT, allowNull: true },
    stages: { type: DataTypes.JSON, allowNull: false },
    based_on_version_id: { type: DataTypes.INTEGER, allowNull: true },
    // Optimistic locking: every save must name the lock_version it read.
    lock_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_by: user(false),
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    decided_at: { type: DataTypes.DATE(3), allowNull: true },
    decided_by: user(),
    ...stamps,
  });
  await qi.addIndex("spec_versions", ["contract_id", "number"], { unique: true, name: "spec_versions_number_unique" });
  await qi.addIndex("spec_versions", ["status"], { name: "spec_versions_status" });

  await qi.createTable("spec_requirements", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    spec_version_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "spec_versions", key: "id" }, onDelete: "CASCADE" },
    position: { type: DataTypes.SMALLINT, allowNull: false },
    parameter: { type: DataTypes.STRING(40), allowNull: false },
    unit: { type: DataTypes.STRING(30), allowNull: false },
    lower: { type: DataTypes.DOUBLE, allowNull: true },
    upper: { type: DataTypes.DOUBLE, allowNull: true },
    target: { type: DataTypes.DOUBLE, allowNull: true },
    method: { type: DataTypes.STRING(120), allowNull: true },
    rule: { type: DataTypes.JSON, allowNull: false },
    severity: { type: DataTypes.ENUM("critical", "major", "minor"), allowNull: false },
    stages: { type: DataTypes.JSON, allowNull: false },
  });
  await qi.addIndex("spec_requirements", ["spec_version_id", "parameter"], { unique: true, name: "spec_requirements_parameter_unique" });

  await qi.createTable("spec_comments", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    spec_version_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "spec_versions", key: "id" }, onDelete: "CASCADE" },
    requirement_id: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: "spec_requirements", key: "id" },
      onDelete: "CASCADE",
    },
    author_user_id: user(false),
    organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" } },
    body: { type: DataTypes.TEXT, allowNull: false },
    ...stamps,
  });
  await qi.addIndex("spec_comments", ["spec_version_id"], { name: "spec_comments_version" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("spec_comments");
  await qi.dropTable("spec_requirements");
  await qi.dropTable("spec_versions");
}
