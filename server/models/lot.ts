import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Reading, ReportedUncertainty } from "../../shared/engine/index.ts";

export class Lot extends Model<InferAttributes<Lot>, InferCreationAttributes<Lot>> {
  declare id: CreationOptional<number>;
  declare contractId: number;
  declare vintage: number;
  declare lotCode: string;
  declare volumeLitres: string;
  declare container: "bottles" | "iso_tank" | "flexitank";
  declare plannedDate: string | null;
  declare market: string;
  /** As the label states it, in % vol; decimals come back from MariaDB as strings. */
  declare labelledAlcoholPercentVol: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Lot.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        contractId: { type: DataTypes.INTEGER, allowNull: false },
        vintage: { type: DataTypes.SMALLINT, allowNull: false },
        lotCode: { type: DataTypes.STRING(60), allowNull: false },
        volumeLitres: { type: DataTypes.DECIMAL(12, 1), allowNull: false },
        container: { type: DataTypes.ENUM("bottles", "iso_tank", "flexitank"), allowNull: false },
        plannedDate: { type: DataTypes.DATEONLY, allowNull: true },
        market: { type: DataTypes.STRING(10), allowNull: false },
        labelledAlcoholPercentVol: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "lots", underscored: true },
    );
  }
}

export class Analysis extends Model<InferAttributes<Analysis>, InferCreationAttributes<Analysis>> {
  declare id: CreationOptional<number>;
  declare lotId: number;
  declare stage: "pre_filling" | "retest" | "final_check" | "pre_shipment" | "on_arrival";
  declare laboratoryName: string;
  declare accreditation: string | null;
  declare sampleDate: string;
  declare specVersionId: number | null;
  declare submittedBy: number | null;
  /** Set when an independent laboratory submitted this analysis for a paid audit. */
  declare auditOrderId: CreationOptional<number | null>;
  /** Set on a re-judgement: the analysis whose results it judges again against a later version. */
  declare rejudgedFromId: CreationOptional<number | null>;
  /** How the laboratory writes numbers, when it said; its results' text is always read with it. */
  declare numberFormat: CreationOptional<"point" | "comma" | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Analysis.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        lotId: { type: DataTypes.INTEGER, allowNull: false },
        stage: { type: DataTypes.ENUM("pre_filling", "retest", "final_check", "pre_shipment", "on_arrival"), allowNull: false },
        laboratoryName: { type: DataTypes.STRING(160), allowNull: false },
        accreditation: { type: DataTypes.STRING(60), allowNull: true },
        sampleDate: { type: DataTypes.DATEONLY, allowNull: false },
        specVersionId: { type: DataTypes.INTEGER, allowNull: true },
        submittedBy: { type: DataTypes.INTEGER, allowNull: true },
        auditOrderId: { type: DataTypes.INTEGER, allowNull: true },
        rejudgedFromId: { type: DataTypes.INTEGER, allowNull: true },
        numberFormat: { type: DataTypes.STRING(5), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "analyses", underscored: true },
    );
  }
}

export class AnalysisResult extends Model<InferAttributes<AnalysisResult>, InferCreationAttributes<AnalysisResult>> {
  declare id: CreationOptional<number>;
  declare analysisId: number;
  declare parameter: string;
  declare rawText: string;
  declare reading: Reading;
  declare unit: string;
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
