import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Reading, ReportedUncertainty } from "../../shared/engine/index.ts";
import type { UnitId } from "../../shared/engine/index.ts";
import { id, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  analysisId: required<number>(DataTypes.INTEGER),
  parameter: required<string>(DataTypes.STRING(40)),
  rawText: required<string>(DataTypes.STRING(40)),
  reading: required<Reading>(DataTypes.JSON),
  unit: required<UnitId>(DataTypes.STRING(30)),
  uncertainty: optional<ReportedUncertainty>(DataTypes.JSON),
  method: optional<string>(DataTypes.STRING(120)),
};

export interface AnalysisResult extends Fields<typeof columns> {}
export class AnalysisResult extends Model<InferAttributes<AnalysisResult>, InferCreationAttributes<AnalysisResult>> {
  static initModel(sequelize: Sequelize) {
    AnalysisResult.init(columns, { sequelize, tableName: "analysis_results", underscored: true, timestamps: false });
  }
}
