import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";
import type { DeviationDecision, DeviationKind, DeviationStatus } from "../../shared/deviations/vocabulary.ts";

const columns = {
  id,
  contractId: required<number>(DataTypes.INTEGER),
  lotId: required<number>(DataTypes.INTEGER),
  analysisId: optional<number>(DataTypes.INTEGER),
  kind: required<DeviationKind>(DataTypes.ENUM("result", "transit", "manual", "audit")),
  /** The paid audit whose results opened it; its laboratory may read it. */
  auditOrderId: optional<number>(DataTypes.INTEGER),
  status: required<DeviationStatus>(DataTypes.STRING(30)),
  parameters: required<string[]>(DataTypes.JSON),
  summary: required<string>(DataTypes.TEXT),
  openedBy: optional<number>(DataTypes.INTEGER),
  respondBy: optional<Date>(DataTypes.DATE(3)),
  decision: optional<DeviationDecision>(DataTypes.JSON),
  decidedAt: optional<Date>(DataTypes.DATE(3)),
  decidedBy: optional<number>(DataTypes.INTEGER),
  deadlineWarnedAt: optional<Date>(DataTypes.DATE(3)),
  ...timestamps,
};

export interface Deviation extends Fields<typeof columns> {}
export class Deviation extends Model<InferAttributes<Deviation>, InferCreationAttributes<Deviation>> {
  static initModel(sequelize: Sequelize) {
    Deviation.init(columns, { sequelize, tableName: "deviations", underscored: true });
  }
}
