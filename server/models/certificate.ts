import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { required, type Fields } from "../db/columns.ts";
import { storedFileColumns } from "./stored-file-columns.ts";

const columns = { ...storedFileColumns, analysisId: required<number>(DataTypes.INTEGER) };

export interface Certificate extends Fields<typeof columns> {}
export class Certificate extends Model<InferAttributes<Certificate>, InferCreationAttributes<Certificate>> {
  static initModel(sequelize: Sequelize) {
    Certificate.init(columns, { sequelize, tableName: "certificates", underscored: true, updatedAt: false });
  }
}
