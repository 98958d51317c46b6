import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { StoredVerdict } from "../../shared/lots/views.ts";
import type { WineProfile } from "../../shared/engine/index.ts";
import { createdAt, id, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  analysisId: required<number>(DataTypes.INTEGER),
  specVersionId: optional<number>(DataTypes.INTEGER),
  engineVersion: required<string>(DataTypes.STRING(20)),
  marketVersions: required<Record<string, string>>(DataTypes.JSON),
  worstOutcome: required<string>(DataTypes.STRING(20)),
  verdicts: required<StoredVerdict[]>(DataTypes.JSON),
  /** The profile the law was read with; null for verdicts stored before it was kept. */
  profile: optional<WineProfile>(DataTypes.JSON),
  createdAt,
};

export interface AnalysisEvaluation extends Fields<typeof columns> {}
export class AnalysisEvaluation extends Model<InferAttributes<AnalysisEvaluation>, InferCreationAttributes<AnalysisEvaluation>> {
  static initModel(sequelize: Sequelize) {
    AnalysisEvaluation.init(columns, { sequelize, tableName: "analysis_evaluations", underscored: true, updatedAt: false });
  }
}
