import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { QuoteLine } from "../../shared/audits/pricing.ts";
import type { OrderStatus } from "../../shared/audits/vocabulary.ts";
import type { AnalysisStage } from "../../shared/lots/vocabulary.ts";
import { defaulted, id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  contractId: required<number>(DataTypes.INTEGER),
  buyerOrgId: required<number>(DataTypes.INTEGER),
  producerOrgId: required<number>(DataTypes.INTEGER),
  laboratoryOrgId: required<number>(DataTypes.INTEGER),
  orderedBy: required<number>(DataTypes.INTEGER),
  stage: required<AnalysisStage>(DataTypes.STRING(20)),
  parameters: required<string[]>(DataTypes.JSON),
  lines: required<QuoteLine[]>(DataTypes.JSON),
  amountCents: required<number>(DataTypes.INTEGER),
  currency: required<string>(DataTypes.CHAR(3)),
  note: optional<string>(DataTypes.TEXT),
  status: required<OrderStatus>(DataTypes.STRING(20)),
  paidCents: defaulted<number>(DataTypes.INTEGER, 0),
  refundedCents: defaulted<number>(DataTypes.INTEGER, 0),
  paidAt: optional<Date>(DataTypes.DATE(3)),
  lastFailureAt: optional<Date>(DataTypes.DATE(3)),
  resultsSubmittedAt: optional<Date>(DataTypes.DATE(3)),
  reportReference: optional<string>(DataTypes.STRING(80)),
  checkoutSessionId: optional<string>(DataTypes.STRING(80)),
  paymentIntentId: optional<string>(DataTypes.STRING(80)),
  ...timestamps,
};

export interface AuditOrder extends Fields<typeof columns> {}
export class AuditOrder extends Model<InferAttributes<AuditOrder>, InferCreationAttributes<AuditOrder>> {
  static initModel(sequelize: Sequelize) {
    AuditOrder.init(columns, { sequelize, tableName: "audit_orders", underscored: true });
  }
}
