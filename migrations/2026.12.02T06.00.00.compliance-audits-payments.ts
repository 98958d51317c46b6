import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const ref = (model: string, allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model, key: "id" } });

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  // Each laboratory's price per parameter, in integer cents.
  await qi.createTable("lab_prices", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    organisation_id: { ...ref("organisations"), onDelete: "CASCADE" },
    parameter: { type: DataTypes.STRING(40), allowNull: false },
    price_cents: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("lab_prices", ["organisation_id", "parameter"], { unique: true, name: "lab_prices_parameter" });

  await qi.createTable("audit_orders", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    contract_id: ref("contracts"),
    buyer_org_id: ref("organisations"),
    producer_org_id: ref("organisations"),
    laboratory_org_id: ref("organisations"),
    ordered_by: ref("users"),
    stage: { type: DataTypes.STRING(20), allowNull: false },
    parameters: { type: DataTypes.JSON, allowNull: false },
    lines: { type: DataTypes.JSON, allowNull: false },
    amount_cents: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.STRING(20), allowNull: false },
    paid_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    refunded_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    paid_at: { type: DataTypes.DATE(3), allowNull: true },
    last_failure_at: { type: DataTypes.DATE(3), allowNull: true },
    results_submitted_at: { type: DataTypes.DATE(3), allowNull: true },
    report_reference: { type: DataTypes.STRING(80), allowNull: true },
    checkout_session_id: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    payment_intent_id: { type: DataTypes.STRING(80), allowNull: true, unique: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("audit_orders", ["buyer_org_id", "created_at"], { name: "audit_orders_buyer" });
  await qi.addIndex("audit_orders", ["laboratory_org_id", "status"], { name: "audit_orders_laboratory" });

  await qi.createTable("audit_order_lots", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    audit_order_id: { ...ref("audit_orders"), onDelete: "CASCADE" },
    lot_id: ref("lots"),
    declared_analysis_id: ref("analyses", true),
    analysis_id: ref("analyses", true),
    comparisons: { type: DataTypes.JSON, allowNull: true },
  });
  await qi.addIndex("audit_order_lots", ["audit_order_id", "lot_id"], { unique: true, name: "audit_order_lots_lot" });

  // Payments, refunds and declines as Stripe reported them; one row per Stripe object, however often it is reported.
  await qi.createTable("audit_payments", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    audit_order_id: { ...ref("audit_orders"), onDelete: "CASCADE" },
    kind: { type: DataTypes.ENUM("payment", "refund", "failure"), allowNull: false },
    stripe_ref: { type: DataTypes.STRING(80), allowNull: false },
    amount_cents: { type: DataTypes.INTEGER, allowNull: false },
    detail: { type: DataTypes.STRING(250), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("audit_payments", ["kind", "stripe_ref"], { unique: true, name: "audit_payments_stripe_ref" });

  // Every webhook event applied, by Stripe's event id: the primary key makes each event apply once.
  await qi.createTable("stripe_events", {
    id: { type: DataTypes.STRING(80), primaryKey: true },
    type: { type: DataTypes.STRING(60), allowNull: false },
    outcome: { type: DataTypes.STRING(40), allowNull: false },
    received_at: { type: DataTypes.DATE(3), allowNull: false },
  });

  await qi.sequelize.query(
    "ALTER TABLE analyses ADD COLUMN audit_order_id INT NULL, ADD CONSTRAINT analyses_audit_order_fk FOREIGN KEY (audit_order_id) REFERENCES audit_orders (id)",
  );
  await qi.sequelize.query(
    "ALTER TABLE deviations ADD COLUMN audit_order_id INT NULL, ADD CONSTRAINT deviations_audit_order_fk FOREIGN KEY (audit_order_id) REFERENCES audit_orders (id)",
  );
  await qi.sequelize.query("ALTER TABLE deviations MODIFY kind ENUM('result', 'transit', 'manual', 'audit') NOT NULL");
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("DELETE FROM deviations WHERE kind = 'audit'");
  await qi.sequelize.query("ALTER TABLE deviations MODIFY kind ENUM('result', 'transit', 'manual') NOT NULL");
  await qi.sequelize.query("ALTER TABLE deviations DROP FOREIGN KEY deviations_audit_order_fk, DROP COLUMN audit_order_id");
  await qi.sequelize.query("ALTER TABLE analyses DROP FOREIGN KEY analyses_audit_order_fk, DROP COLUMN audit_order_id");
  await qi.dropTable("stripe_events");
  await qi.dropTable("audit_payments");
  await qi.dropTable("audit_order_lots");
  await qi.dropTable("audit_orders");
  await qi.dropTable("lab_prices");
}
