import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { OrganisationKind } from "../../shared/auth/roles.ts";

export class Organisation extends Model<InferAttributes<Organisation>, InferCreationAttributes<Organisation>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare kind: OrganisationKind;
  declare country: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Organisation.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        kind: { type: DataTypes.ENUM("retailer", "producer", "laboratory"), allowNull: false },
        country: { type: DataTypes.CHAR(2), allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "organisations", underscored: true },
    );
  }
}
