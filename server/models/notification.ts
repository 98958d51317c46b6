import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { createdAt, id, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  userId: required<number>(DataTypes.INTEGER),
  kind: required<string>(DataTypes.STRING(30)),
  title: required<string>(DataTypes.STRING(250)),
  body: required<string>(DataTypes.TEXT),
  link: required<string>(DataTypes.STRING(250)),
  readAt: optional<Date>(DataTypes.DATE(3)),
  digestedAt: optional<Date>(DataTypes.DATE(3)),
  createdAt,
};

export interface Notification extends Fields<typeof columns> {}
export class Notification extends Model<InferAttributes<Notification>, InferCreationAttributes<Notification>> {
  static initModel(sequelize: Sequelize) {
    Notification.init(columns, { sequelize, tableName: "notifications", underscored: true, updatedAt: false });
  }
}
