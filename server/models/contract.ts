import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Contract extends Model<InferAttributes<Contract>, InferCreationAttributes<Contract>> {
  declare id: CreationOptional<number>;
  declare reference: string;
  declare retailerOrgId: number;
  declare producerOrgId: number;
  declare wineId: number;
  declare startsOn: string;
  declare endsOn: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Contract.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        reference: { type: DataTypes.STRING(40), allowNull: false },
        retailerOrgId: { type: DataTypes.INTEGER, allowNull: false },
        producerOrgId: { type: DataTypes.INTEGER, allowNull: false },
        wineId: { type: DataTypes.INTEGER, allowNull: false },
        startsOn: { type: DataTypes.DATEONLY, allowNull: false },
        endsOn: { type: DataTypes.DATEONLY, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "contracts", underscored: true },
    );
  }
}
