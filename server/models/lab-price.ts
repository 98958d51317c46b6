import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, required, updatedAt, type Fields } from "../db/columns.ts";

const columns = {
  id,
  organisationId: required<number>(DataTypes.INTEGER),
  parameter: required<string>(DataTypes.STRING(40)),
  priceCents: required<number>(DataTypes.INTEGER),
  currency: required<string>(DataTypes.CHAR(3)),
  updatedAt,
};

export interface LabPrice extends Fields<typeof columns> {}
export class LabPrice extends Model<InferAttributes<LabPrice>, InferCreationAttributes<LabPrice>> {
  static initModel(sequelize: Sequelize) {
    LabPrice.init(columns, { sequelize, tableName: "lab_prices", underscored: true, createdAt: false });
  }
}
