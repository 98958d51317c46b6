import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { MarketId } from "../../shared/engine/index.ts";
import type { Colour, WineCategory } from "../../shared/engine/index.ts";
import type { WineLawFacts } from "../../shared/specs/law-facts.ts";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  retailerOrgId: required<number>(DataTypes.INTEGER),
  producerOrgId: required<number>(DataTypes.INTEGER),
  name: required<string>(DataTypes.STRING(160)),
  colour: required<Colour>(DataTypes.ENUM("red", "white", "rose")),
  category: required<WineCategory>(DataTypes.ENUM("still", "sparkling", "quality-sparkling", "semi-sparkling", "liqueur")),
  region: required<string>(DataTypes.STRING(120)),
  markets: required<MarketId[]>(DataTypes.JSON),
  nominalSugarGPerL: optional<number>(DataTypes.DOUBLE),
  nominalAlcoholPercentVol: optional<number>(DataTypes.DOUBLE),
  lawFacts: optional<WineLawFacts>(DataTypes.JSON),
  ...timestamps,
};

export interface Wine extends Fields<typeof columns> {}
export class Wine extends Model<InferAttributes<Wine>, InferCreationAttributes<Wine>> {
  static initModel(sequelize: Sequelize) {
    Wine.init(columns, { sequelize, tableName: "wines", underscored: true });
  }
}
