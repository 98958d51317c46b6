import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { required, type Fields } from "../db/columns.ts";
import { storedFileColumns } from "./stored-file-columns.ts";

const columns = { ...storedFileColumns, messageId: required<number>(DataTypes.INTEGER) };

export interface DeviationAttachment extends Fields<typeof columns> {}
export class DeviationAttachment extends Model<InferAttributes<DeviationAttachment>, InferCreationAttributes<DeviationAttachment>> {
  static initModel(sequelize: Sequelize) {
    DeviationAttachment.init(columns, { sequelize, tableName: "deviation_attachments", underscored: true, updatedAt: false });
  }
}
