import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { column, defaulted, id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  email: column<string>({ type: DataTypes.STRING(254), allowNull: false, unique: true }),
  name: required<string>(DataTypes.STRING(120)),
  passwordHash: optional<string>(DataTypes.STRING(80)),
  isPlatformAdmin: defaulted<boolean>(DataTypes.BOOLEAN, false),
  sessionVersion: defaulted<number>(DataTypes.INTEGER, 0),
  ...timestamps,
};

export interface User extends Fields<typeof columns> {}
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  static initModel(sequelize: Sequelize) {
    User.init(columns, { sequelize, tableName: "users", underscored: true });
  }
}
