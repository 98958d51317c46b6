import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

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
