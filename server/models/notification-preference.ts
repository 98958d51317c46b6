import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { column, optional, required, updatedAt, type Fields } from "../db/columns.ts";

const columns = {
  userId: column<number>({ type: DataTypes.INTEGER, primaryKey: true }),
  emailMode: required<"immediate" | "daily_digest" | "off">(DataTypes.ENUM("immediate", "daily_digest", "off")),
  kinds: required<string[]>(DataTypes.JSON),
  lastDigestAt: optional<Date>(DataTypes.DATE(3)),
  updatedAt,
};

export interface NotificationPreference extends Fields<typeof columns> {}
export class NotificationPreference extends Model<
  InferAttributes<NotificationPreference>,
  InferCreationAttributes<NotificationPreference>
> {
  static initModel(sequelize: Sequelize) {
    NotificationPreference.init(columns, { sequelize, tableName: "notification_preferences", underscored: true, createdAt: false });
  }
}
