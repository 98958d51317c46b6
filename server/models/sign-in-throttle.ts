import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { column, defaulted, optional, updatedAt, type Fields } from "../db/columns.ts";

const columns = {
  /** "account:<e-mail>" for unknown clients, "device:<id>:<e-mail>" for a browser that signed in to the account before. */
  subject: column<string>({ type: DataTypes.STRING(300), primaryKey: true }),
  failures: defaulted<number>(DataTypes.INTEGER, 0),
  blockedUntil: optional<Date>(DataTypes.DATE(3)),
  updatedAt,
};

export interface SignInThrottle extends Fields<typeof columns> {}
export class SignInThrottle extends Model<InferAttributes<SignInThrottle>, InferCreationAttributes<SignInThrottle>> {
  static initModel(sequelize: Sequelize) {
    SignInThrottle.init(columns, { sequelize, tableName: "sign_in_throttles", underscored: true, createdAt: false });
  }
}
