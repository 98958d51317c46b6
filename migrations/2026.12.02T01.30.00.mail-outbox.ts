import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("outbox_messages", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    // Sent as the Message-ID, so a receiver can recognise a message it already has.
    message_key: { type: DataTypes.CHAR(36), allowNull: false },
    to_address: { type: DataTypes.STRING(254), allowNull: false },
    subject: { type: DataTypes.STRING(250), allowNull: false },
    text_body: { type: DataTypes.TEXT("medium"), allowNull: false },
    status: { type: DataTypes.ENUM("pending", "sent", "dead"), allowNull: false, defaultValue: "pending" },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    next_attempt_at: { type: DataTypes.DATE(3), allowNull: false },
    last_error: { type: DataTypes.STRING(500), allowNull: true },
    sent_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("outbox_messages", ["message_key"], { unique: true, name: "outbox_message_key_unique" });
  await qi.addIndex("outbox_messages", ["status", "next_attempt_at"], { name: "outbox_due" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("outbox_messages");
}
