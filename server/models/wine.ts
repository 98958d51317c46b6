import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { MarketId } from "../../shared/engine/index.ts";
import type { Colour, WineCategory } from "../../shared/engine/index.ts";
import type { WineLawFacts } from "../../shared/specs/law-facts.ts";

export class Wine extends Model<InferAttributes<Wine>, InferCreationAttributes<Wine>> {
  declare id: CreationOptional<number>;
  declare retailerOrgId: number;
  declare producerOrgId: number;
  declare name: string;
  declare colour: Colour;
  declare category: WineCategory;
  declare region: string;
  declare markets: MarketId[];
  declare nominalSugarGPerL: number | null;
  declare nominalAlcoholPercentVol: number | null;
  declare lawFacts: CreationOptional<WineLawFacts | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Wine.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        retailerOrgId: { type: DataTypes.INTEGER, allowNull: false },
        producerOrgId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        colour: { type: DataTypes.ENUM("red", "white", "rose"), allowNull: false },
        category: { type: DataTypes.ENUM("still", "sparkling", "quality-sparkling", "semi-sparkling", "liqueur"), allowNull: false },
        region: { type: DataTypes.STRING(120), allowNull: false },
        markets: { type: DataTypes.JSON, allowNull: false },
        nominalSugarGPerL: { type: DataTypes.DOUBLE, allowNull: true },
        nominalAlcoholPercentVol: { type: DataTypes.DOUBLE, allowNull: true },
        lawFacts: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "wines", underscored: true },
    );
  }
}
