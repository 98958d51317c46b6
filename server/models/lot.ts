import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  contractId: required<number>(DataTypes.INTEGER),
  vintage: required<number>(DataTypes.SMALLINT),
  lotCode: required<string>(DataTypes.STRING(60)),
  volumeLitres: required<string>(DataTypes.DECIMAL(12, 1)),
  container: required<"bottles" | "iso_tank" | "flexitank">(DataTypes.ENUM("bottles", "iso_tank", "flexitank")),
  plannedDate: optional<string>(DataTypes.DATEONLY),
  market: required<string>(DataTypes.STRING(10)),
  /** As the label states it, in % vol; decimals come back from MariaDB as strings. */
  labelledAlcoholPercentVol: optional<string>(DataTypes.DECIMAL(4, 1)),
  ...timestamps,
};

export interface Lot extends Fields<typeof columns> {}
export class Lot extends Model<InferAttributes<Lot>, InferCreationAttributes<Lot>> {
  static initModel(sequelize: Sequelize) {
    Lot.init(columns, { sequelize, tableName: "lots", underscored: true });
  }
}
