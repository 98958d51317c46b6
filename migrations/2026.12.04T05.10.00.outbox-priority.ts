import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/**
 * Mail someone is waiting for (a reset link, an invitation, a receipt) goes ahead of notifications,
 * and a notification mail still waiting can take in the next update on the same thread.
 */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("outbox_messages", "priority", { type: DataTypes.TINYINT, allowNull: false, defaultValue: 0 });
  await qi.addColumn("outbox_messages", "coalesce_key", { type: DataTypes.STRING(200), allowNull: true });
  await qi.addColumn("outbox_messages", "updates", { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 });
  await qi.addIndex("outbox_messages", ["status", "priority", "next_attempt_at"], { name: "outbox_due_by_priority" });
  await qi.addIndex("outbox_messages", ["coalesce_key", "status"], { name: "outbox_coalesce" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  // Raw SQL: Sequelize's removeIndex and removeColumn fail on this dialect.
  await qi.sequelize.query("DROP INDEX outbox_coalesce ON outbox_messages");
  await qi.sequelize.query("DROP INDEX outbox_due_by_priority ON outbox_messages");
  await qi.sequelize.query("ALTER TABLE outbox_messages DROP COLUMN updates, DROP COLUMN coalesce_key, DROP COLUMN priority");
}
