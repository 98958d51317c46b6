import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ResultComparison } from "../../shared/engine/index.ts";
import { id, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  auditOrderId: required<number>(DataTypes.INTEGER),
  lotId: required<number>(DataTypes.INTEGER),
  declaredAnalysisId: optional<number>(DataTypes.INTEGER),
  analysisId: optional<number>(DataTypes.INTEGER),
  comparisons: optional<ResultComparison[]>(DataTypes.JSON),
};

export interface AuditOrderLot extends Fields<typeof columns> {}
export class AuditOrderLot extends Model<InferAttributes<AuditOrderLot>, InferCreationAttributes<AuditOrderLot>> {
  static initModel(sequelize: Sequelize) {
    AuditOrderLot.init(columns, { sequelize, tableName: "audit_order_lots", underscored: true, timestamps: false });
  }
}
