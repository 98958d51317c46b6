import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ResultComparison } from "../../shared/engine/index.ts";
import type { QuoteLine } from "../../shared/audits/pricing.ts";
import type { OrderStatus, PaymentKind } from "../../shared/audits/vocabulary.ts";
import type { AnalysisStage } from "../../shared/lots/vocabulary.ts";

export class LabPrice extends Model<InferAttributes<LabPrice>, InferCreationAttributes<LabPrice>> {
  declare id: CreationOptional<number>;
  declare organisationId: number;
  declare parameter: string;
  declare priceCents: number;
  declare currency: string;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LabPrice.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        parameter: { type: DataTypes.STRING(40), allowNull: false },
        priceCents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "lab_prices", underscored: true, createdAt: false },
    );
  }
}

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

export class AuditOrderLot extends Model<InferAttributes<AuditOrderLot>, InferCreationAttributes<AuditOrderLot>> {
  declare id: CreationOptional<number>;
  declare auditOrderId: number;
  declare lotId: number;
  declare declaredAnalysisId: CreationOptional<number | null>;
  declare analysisId: CreationOptional<number | null>;
  declare comparisons: CreationOptional<ResultComparison[] | null>;

  static initModel(sequelize: Sequelize) {
    AuditOrderLot.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        auditOrderId: { type: DataTypes.INTEGER, allowNull: false },
        lotId: { type: DataTypes.INTEGER, allowNull: false },
        declaredAnalysisId: { type: DataTypes.INTEGER, allowNull: true },
        analysisId: { type: DataTypes.INTEGER, allowNull: true },
        comparisons: { type: DataTypes.JSON, allowNull: true },
      },
      { sequelize, tableName: "audit_order_lots", underscored: true, timestamps: false },
    );
  }
}

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

export class StripeEvent extends Model<InferAttributes<StripeEvent>, InferCreationAttributes<StripeEvent>> {
  declare id: string;
  declare type: string;
  declare outcome: string;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize) {
    StripeEvent.init(
      {
        id: { type: DataTypes.STRING(80), primaryKey: true },
        type: { type: DataTypes.STRING(60), allowNull: false },
        outcome: { type: DataTypes.STRING(40), allowNull: false },
        receivedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "stripe_events", underscored: true, timestamps: false },
    );
  }
}
