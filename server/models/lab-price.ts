import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class LabPrice extends Model<InferAttributes<LabPrice>, InferCreationAttributes<LabPrice>> {
  declare id: CreationOptional<number>;
  declare organisationId: number;
  declare parameter: string;
  declare priceCents: number;
  declare currency: string;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LabPrice.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        parameter: { type: DataTypes.STRING(40), allowNull: false },
        priceCents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "lab_prices", underscored: true, createdAt: false },
    );
  }
}
