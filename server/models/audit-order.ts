import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { QuoteLine } from "../../shared/audits/pricing.ts";
import type { OrderStatus } from "../../shared/audits/vocabulary.ts";
import type { AnalysisStage } from "../../shared/lots/vocabulary.ts";

export class AuditOrder extends Model<InferAttributes<AuditOrder>, InferCreationAttributes<AuditOrder>> {
  declare id: CreationOptional<number>;
  declare contractId: number;
  declare buyerOrgId: number;
  declare producerOrgId: number;
  declare laboratoryOrgId: number;
  declare orderedBy: number;
  declare stage: AnalysisStage;
  declare parameters: string[];
  declare lines: QuoteLine[];
  declare amountCents: number;
  declare currency: string;
  declare note: string | null;
  declare status: OrderStatus;
  declare paidCents: CreationOptional<number>;
  declare refundedCents: CreationOptional<number>;
  declare paidAt: CreationOptional<Date | null>;
  declare lastFailureAt: CreationOptional<Date | null>;
  declare resultsSubmittedAt: CreationOptional<Date | null>;
  declare reportReference: CreationOptional<string | null>;
  declare checkoutSessionId: CreationOptional<string | null>;
  declare paymentIntentId: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditOrder.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        contractId: { type: DataTypes.INTEGER, allowNull: false },
        buyerOrgId: { type: DataTypes.INTEGER, allowNull: false },
        producerOrgId: { type: DataTypes.INTEGER, allowNull: false },
        laboratoryOrgId: { type: DataTypes.INTEGER, allowNull: false },
        orderedBy: { type: DataTypes.INTEGER, allowNull: false },
        stage: { type: DataTypes.STRING(20), allowNull: false },
        parameters: { type: DataTypes.JSON, allowNull: false },
        lines: { type: DataTypes.JSON, allowNull: false },
        amountCents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.STRING(20), allowNull: false },
        paidCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        refundedCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        paidAt: { type: DataTypes.DATE(3), allowNull: true },
        lastFailureAt: { type: DataTypes.DATE(3), allowNull: true },
        resultsSubmittedAt: { type: DataTypes.DATE(3), allowNull: true },
        reportReference: { type: DataTypes.STRING(80), allowNull: true },
        checkoutSessionId: { type: DataTypes.STRING(80), allowNull: true },
        paymentIntentId: { type: DataTypes.STRING(80), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "audit_orders", underscored: true },
    );
  }
}
