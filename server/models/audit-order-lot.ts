import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ResultComparison } from "../../shared/engine/index.ts";

export class AuditOrderLot extends Model<InferAttributes<AuditOrderLot>, InferCreationAttributes<AuditOrderLot>> {
  declare id: CreationOptional<number>;
  declare auditOrderId: number;
  declare lotId: number;
  declare declaredAnalysisId: CreationOptional<number | null>;
  declare analysisId: CreationOptional<number | null>;
  declare comparisons: CreationOptional<ResultComparison[] | null>;

  static initModel(sequelize: Sequelize) {
    AuditOrderLot.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        auditOrderId: { type: DataTypes.INTEGER, allowNull: false },
        lotId: { type: DataTypes.INTEGER, allowNull: false },
        declaredAnalysisId: { type: DataTypes.INTEGER, allowNull: true },
        analysisId: { type: DataTypes.INTEGER, allowNull: true },
        comparisons: { type: DataTypes.JSON, allowNull: true },
      },
      { sequelize, tableName: "audit_order_lots", underscored: true, timestamps: false },
    );
  }
}
