import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { PaymentKind } from "../../shared/audits/vocabulary.ts";
import { createdAt, id, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  auditOrderId: required<number>(DataTypes.INTEGER),
  kind: required<PaymentKind>(DataTypes.ENUM("payment", "refund", "failure")),
  stripeRef: required<string>(DataTypes.STRING(80)),
  amountCents: required<number>(DataTypes.INTEGER),
  detail: optional<string>(DataTypes.STRING(250)),
  createdAt,
};

export interface AuditPayment extends Fields<typeof columns> {}
export class AuditPayment extends Model<InferAttributes<AuditPayment>, InferCreationAttributes<AuditPayment>> {
  static initModel(sequelize: Sequelize) {
    AuditPayment.init(columns, { sequelize, tableName: "audit_payments", underscored: true, updatedAt: false });
  }
}
