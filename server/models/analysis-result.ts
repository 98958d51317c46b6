import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Reading, ReportedUncertainty } from "../../shared/engine/index.ts";
import type { UnitId } from "../../shared/engine/index.ts";

export class AnalysisResult extends Model<InferAttributes<AnalysisResult>, InferCreationAttributes<AnalysisResult>> {
  declare id: CreationOptional<number>;
  declare analysisId: number;
  declare parameter: string;
  declare rawText: string;
  declare reading: Reading;
  declare unit: UnitId;
  declare uncertainty: ReportedUncertainty | null;
  declare method: string | null;

  static initModel(sequelize: Sequelize) {
    AnalysisResult.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        analysisId: { type: DataTypes.INTEGER, allowNull: false },
        parameter: { type: DataTypes.STRING(40), allowNull: false },
        rawText: { type: DataTypes.STRING(40), allowNull: false },
        reading: { type: DataTypes.JSON, allowNull: false },
        unit: { type: DataTypes.STRING(30), allowNull: false },
        uncertainty: { type: DataTypes.JSON, allowNull: true },
        method: { type: DataTypes.STRING(120), allowNull: true },
      },
      { sequelize, tableName: "analysis_results", underscored: true, timestamps: false },
    );
  }
}
