import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  reference: required<string>(DataTypes.STRING(40)),
  retailerOrgId: required<number>(DataTypes.INTEGER),
  producerOrgId: required<number>(DataTypes.INTEGER),
  wineId: required<number>(DataTypes.INTEGER),
  startsOn: required<string>(DataTypes.DATEONLY),
  endsOn: optional<string>(DataTypes.DATEONLY),
  /** When the producer's admin accepted the contract; no spec version reaches the producer before. */
  producerAcceptedAt: optional<Date>(DataTypes.DATE(3)),
  producerAcceptedBy: optional<number>(DataTypes.INTEGER),
  ...timestamps,
};

export interface Contract extends Fields<typeof columns> {}
export class Contract extends Model<InferAttributes<Contract>, InferCreationAttributes<Contract>> {
  static initModel(sequelize: Sequelize) {
    Contract.init(columns, { sequelize, tableName: "contracts", underscored: true });
  }
}
