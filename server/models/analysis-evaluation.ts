import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { StoredVerdict } from "../../shared/lots/views.ts";
import type { WineProfile } from "../../shared/engine/index.ts";

export class AnalysisEvaluation extends Model<InferAttributes<AnalysisEvaluation>, InferCreationAttributes<AnalysisEvaluation>> {
  declare id: CreationOptional<number>;
  declare analysisId: number;
  declare specVersionId: number | null;
  declare engineVersion: string;
  declare marketVersions: Record<string, string>;
  declare worstOutcome: string;
  declare verdicts: StoredVerdict[];
  /** The profile the law was read with; null for verdicts stored before it was kept. */
  declare profile: CreationOptional<WineProfile | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AnalysisEvaluation.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        analysisId: { type: DataTypes.INTEGER, allowNull: false },
        specVersionId: { type: DataTypes.INTEGER, allowNull: true },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false },
        marketVersions: { type: DataTypes.JSON, allowNull: false },
        worstOutcome: { type: DataTypes.STRING(20), allowNull: false },
        verdicts: { type: DataTypes.JSON, allowNull: false },
        profile: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "analysis_evaluations", underscored: true, updatedAt: false },
    );
  }
}
