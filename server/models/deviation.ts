import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { DeviationDecision, DeviationKind, DeviationStatus } from "../../shared/deviations/vocabulary.ts";

export class Deviation extends Model<InferAttributes<Deviation>, InferCreationAttributes<Deviation>> {
  declare id: CreationOptional<number>;
  declare contractId: number;
  declare lotId: number;
  declare analysisId: number | null;
  declare kind: DeviationKind;
  /** The paid audit whose results opened it; its laboratory may read it. */
  declare auditOrderId: CreationOptional<number | null>;
  declare status: DeviationStatus;
  declare parameters: string[];
  declare summary: string;
  declare openedBy: number | null;
  declare respondBy: CreationOptional<Date | null>;
  declare decision: CreationOptional<DeviationDecision | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare decidedBy: CreationOptional<number | null>;
  declare deadlineWarnedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Deviation.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        contractId: { type: DataTypes.INTEGER, allowNull: false },
        lotId: { type: DataTypes.INTEGER, allowNull: false },
        analysisId: { type: DataTypes.INTEGER, allowNull: true },
        kind: { type: DataTypes.ENUM("result", "transit", "manual", "audit"), allowNull: false },
        auditOrderId: { type: DataTypes.INTEGER, allowNull: true },
        status: { type: DataTypes.STRING(30), allowNull: false },
        parameters: { type: DataTypes.JSON, allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        openedBy: { type: DataTypes.INTEGER, allowNull: true },
        respondBy: { type: DataTypes.DATE(3), allowNull: true },
        decision: { type: DataTypes.JSON, allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        decidedBy: { type: DataTypes.INTEGER, allowNull: true },
        deadlineWarnedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "deviations", underscored: true },
    );
  }
}
