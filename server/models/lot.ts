import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Lot extends Model<InferAttributes<Lot>, InferCreationAttributes<Lot>> {
  declare id: CreationOptional<number>;
  declare contractId: number;
  declare vintage: number;
  declare lotCode: string;
  declare volumeLitres: string;
  declare container: "bottles" | "iso_tank" | "flexitank";
  declare plannedDate: string | null;
  declare market: string;
  /** As the label states it, in % vol; decimals come back from MariaDB as strings. */
  declare labelledAlcoholPercentVol: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Lot.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        contractId: { type: DataTypes.INTEGER, allowNull: false },
        vintage: { type: DataTypes.SMALLINT, allowNull: false },
        lotCode: { type: DataTypes.STRING(60), allowNull: false },
        volumeLitres: { type: DataTypes.DECIMAL(12, 1), allowNull: false },
        container: { type: DataTypes.ENUM("bottles", "iso_tank", "flexitank"), allowNull: false },
        plannedDate: { type: DataTypes.DATEONLY, allowNull: true },
        market: { type: DataTypes.STRING(10), allowNull: false },
        labelledAlcoholPercentVol: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "lots", underscored: true },
    );
  }
}
