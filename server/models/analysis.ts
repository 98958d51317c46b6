import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  lotId: required<number>(DataTypes.INTEGER),
  stage: required<"pre_filling" | "retest" | "final_check" | "pre_shipment" | "on_arrival">(
    DataTypes.ENUM("pre_filling", "retest", "final_check", "pre_shipment", "on_arrival"),
  ),
  laboratoryName: required<string>(DataTypes.STRING(160)),
  accreditation: optional<string>(DataTypes.STRING(60)),
  sampleDate: required<string>(DataTypes.DATEONLY),
  specVersionId: optional<number>(DataTypes.INTEGER),
  submittedBy: optional<number>(DataTypes.INTEGER),
  /** Set when an independent laboratory submitted this analysis for a paid audit. */
  auditOrderId: optional<number>(DataTypes.INTEGER),
  /** Set on a re-judgement: the analysis whose results it judges again against a later version. */
  rejudgedFromId: optional<number>(DataTypes.INTEGER),
  /** How the laboratory writes numbers, when it said; its results' text is always read with it. */
  numberFormat: optional<"point" | "comma">(DataTypes.STRING(5)),
  ...timestamps,
};

export interface Analysis extends Fields<typeof columns> {}
export class Analysis extends Model<InferAttributes<Analysis>, InferCreationAttributes<Analysis>> {
  static initModel(sequelize: Sequelize) {
    Analysis.init(columns, { sequelize, tableName: "analyses", underscored: true });
  }
}
