import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  messageId: required<number>(DataTypes.INTEGER),
  previousBody: required<string>(DataTypes.TEXT),
  editedAt: required<Date>(DataTypes.DATE(3)),
};

export interface DeviationMessageEdit extends Fields<typeof columns> {}
export class DeviationMessageEdit extends Model<InferAttributes<DeviationMessageEdit>, InferCreationAttributes<DeviationMessageEdit>> {
  static initModel(sequelize: Sequelize) {
    DeviationMessageEdit.init(columns, { sequelize, tableName: "deviation_message_edits", underscored: true, timestamps: false });
  }
}
