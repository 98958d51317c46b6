import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { defaulted, id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  messageKey: required<string>(DataTypes.CHAR(36)),
  toAddress: required<string>(DataTypes.STRING(254)),
  subject: required<string>(DataTypes.STRING(250)),
  textBody: required<string>(DataTypes.TEXT("medium")),
  status: defaulted<"pending" | "sent" | "dead">(DataTypes.ENUM("pending", "sent", "dead"), "pending"),
  attempts: defaulted<number>(DataTypes.INTEGER, 0),
  nextAttemptAt: required<Date>(DataTypes.DATE(3)),
  lastError: optional<string>(DataTypes.STRING(500)),
  sentAt: optional<Date>(DataTypes.DATE(3)),
  /** 0 for mail someone waits for (reset, invitation, receipt), 1 for notifications; lower goes first. */
  priority: defaulted<number>(DataTypes.TINYINT, 0),
  /** Notifications on one thread for one person share a key; a waiting mail takes in the next update. */
  coalesceKey: optional<string>(DataTypes.STRING(200)),
  updates: defaulted<number>(DataTypes.INTEGER, 1),
  ...timestamps,
};

export interface OutboxMessage extends Fields<typeof columns> {}
export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  static initModel(sequelize: Sequelize) {
    OutboxMessage.init(columns, { sequelize, tableName: "outbox_messages", underscored: true });
  }
}
