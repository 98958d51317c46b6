import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { PaymentKind } from "../../shared/audits/vocabulary.ts";

export class AuditPayment extends Model<InferAttributes<AuditPayment>, InferCreationAttributes<AuditPayment>> {
  declare id: CreationOptional<number>;
  declare auditOrderId: number;
  declare kind: PaymentKind;
  declare stripeRef: string;
  declare amountCents: number;
  declare detail: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditPayment.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        auditOrderId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.ENUM("payment", "refund", "failure"), allowNull: false },
        stripeRef: { type: DataTypes.STRING(80), allowNull: false },
        amountCents: { type: DataTypes.INTEGER, allowNull: false },
        detail: { type: DataTypes.STRING(250), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "audit_payments", underscored: true, updatedAt: false },
    );
  }
}
