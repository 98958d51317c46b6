import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { ROLES, type Role } from "../../shared/auth/roles.ts";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  organisationId: required<number>(DataTypes.INTEGER),
  email: required<string>(DataTypes.STRING(254)),
  role: required<Role>(DataTypes.ENUM(...ROLES)),
  tokenHash: required<string>(DataTypes.CHAR(64)),
  invitedByUserId: optional<number>(DataTypes.INTEGER),
  expiresAt: required<Date>(DataTypes.DATE(3)),
  acceptedAt: optional<Date>(DataTypes.DATE(3)),
  revokedAt: optional<Date>(DataTypes.DATE(3)),
  ...timestamps,
};

export interface Invitation extends Fields<typeof columns> {}
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  static initModel(sequelize: Sequelize) {
    Invitation.init(columns, { sequelize, tableName: "invitations", underscored: true });
  }
}
