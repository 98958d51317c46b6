import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { ROLES, type Role } from "../../shared/auth/roles.ts";

export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare organisationId: number;
  declare email: string;
  declare role: Role;
  declare tokenHash: string;
  declare invitedByUserId: number | null;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Invitation.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false },
        invitedByUserId: { type: DataTypes.INTEGER, allowNull: true },
        expiresAt: { type: DataTypes.DATE(3), allowNull: false },
        acceptedAt: { type: DataTypes.DATE(3), allowNull: true },
        revokedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "invitations", underscored: true },
    );
  }
}
