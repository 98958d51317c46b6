import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { column, required, type Fields } from "../db/columns.ts";

const columns = {
  id: column<string>({ type: DataTypes.STRING(80), primaryKey: true }),
  type: required<string>(DataTypes.STRING(60)),
  outcome: required<string>(DataTypes.STRING(40)),
  receivedAt: required<Date>(DataTypes.DATE(3)),
};

export interface StripeEvent extends Fields<typeof columns> {}
export class StripeEvent extends Model<InferAttributes<StripeEvent>, InferCreationAttributes<StripeEvent>> {
  static initModel(sequelize: Sequelize) {
    StripeEvent.init(columns, { sequelize, tableName: "stripe_events", underscored: true, timestamps: false });
  }
}
