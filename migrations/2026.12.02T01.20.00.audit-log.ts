import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("audit_events", {
    // Sequence numbers are assigned under the head lock, never by AUTO_INCREMENT, so the chain has no gaps.
    seq: { type: DataTypes.BIGINT, primaryKey: true },
    occurred_at: { type: DataTypes.DATE(3), allowNull: false },
    actor_user_id: { type: DataTypes.INTEGER, allowNull: true },
    organisation_id: { type: DataTypes.INTEGER, allowNull: true },
    action: { type: DataTypes.STRING(80), allowNull: false },
    entity_type: { type: DataTypes.STRING(40), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: true },
    before_digest: { type: DataTypes.CHAR(64), allowNull: true },
    after_digest: { type: DataTypes.CHAR(64), allowNull: true },
    details: { type: DataTypes.JSON, allowNull: true },
    prev_hash: { type: DataTypes.CHAR(64), allowNull: false },
    hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await qi.addIndex("audit_events", ["organisation_id", "seq"], { name: "audit_events_org" });
  await qi.addIndex("audit_events", ["entity_type", "entity_id"], { name: "audit_events_entity" });

  // The checkpoint, kept outside the events table: a truncated tail no longer matches it.
  await qi.createTable("audit_head", {
    id: { type: DataTypes.TINYINT, primaryKey: true },
    last_seq: { type: DataTypes.BIGINT, allowNull: false },
    last_hash: { type: DataTypes.CHAR(64), allowNull: false },
  });
  await qi.bulkInsert("audit_head", [{ id: 1, last_seq: 0, last_hash: "0".repeat(64) }]);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("audit_head");
  await qi.dropTable("audit_events");
}
