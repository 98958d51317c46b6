import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { ROLES, type Role } from "../../shared/auth/roles.ts";
import { id, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  userId: required<number>(DataTypes.INTEGER),
  organisationId: required<number>(DataTypes.INTEGER),
  role: required<Role>(DataTypes.ENUM(...ROLES)),
  ...timestamps,
};

export interface Membership extends Fields<typeof columns> {}
export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  static initModel(sequelize: Sequelize) {
    Membership.init(columns, { sequelize, tableName: "memberships", underscored: true });
  }
}
