import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  userId: required<number>(DataTypes.INTEGER),
  tokenHash: required<string>(DataTypes.CHAR(64)),
  expiresAt: required<Date>(DataTypes.DATE(3)),
  usedAt: optional<Date>(DataTypes.DATE(3)),
  ...timestamps,
};

export interface PasswordReset extends Fields<typeof columns> {}
export class PasswordReset extends Model<InferAttributes<PasswordReset>, InferCreationAttributes<PasswordReset>> {
  static initModel(sequelize: Sequelize) {
    PasswordReset.init(columns, { sequelize, tableName: "password_resets", underscored: true });
  }
}
