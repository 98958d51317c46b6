/** Initialises every model on one Sequelize instance and declares all associations in one place. */
import type { Sequelize } from "sequelize";
import { Organisation } from "./organisation.ts";
import { User } from "./user.ts";
import { Membership } from "./membership.ts";
import { Invitation } from "./invitation.ts";
import { PasswordReset } from "./password-reset.ts";
import { TrailEntry } from "./trail-entry.ts";
import { TrailHead } from "./trail-head.ts";
import { OutboxMessage } from "./outbox-message.ts";
import { Wine } from "./wine.ts";
import { Contract } from "./contract.ts";
import { SpecVersion } from "./spec-version.ts";
import { SpecRequirement } from "./spec-requirement.ts";
import { SpecComment } from "./spec-comment.ts";
import { Analysis } from "./analysis.ts";
import { AnalysisResult } from "./analysis-result.ts";
import { Lot } from "./lot.ts";
import { AnalysisEvaluation } from "./analysis-evaluation.ts";
import { Certificate } from "./certificate.ts";
import { IdempotencyKey } from "./idempotency-key.ts";
import { AuditOrder } from "./audit-order.ts";
import { AuditOrderLot } from "./audit-order-lot.ts";
import { AuditPayment } from "./audit-payment.ts";
import { LabPrice } from "./lab-price.ts";
import { StripeEvent } from "./stripe-event.ts";
import { Deviation } from "./deviation.ts";
import { DeviationAttachment } from "./deviation-attachment.ts";
import { DeviationMessage } from "./deviation-message.ts";
import { DeviationMessageEdit } from "./deviation-message-edit.ts";
import { Notification } from "./notification.ts";
import { NotificationPreference } from "./notification-preference.ts";
import { SignInThrottle } from "./sign-in-throttle.ts";
import { TrailTreeHead } from "./trail-tree-head.ts";

export function initModels(sequelize: Sequelize): void {
  for (const m of [
    Organisation,
    User,
    Membership,
    Invitation,
    PasswordReset,
    TrailEntry,
    TrailHead,
    OutboxMessage,
    Wine,
    Contract,
    SpecVersion,
    SpecRequirement,
    SpecComment,
    Lot,
    Analysis,
    AnalysisResult,
    AnalysisEvaluation,
    Deviation,
    Certificate,
    IdempotencyKey,
    DeviationMessage,
    DeviationMessageEdit,
    DeviationAttachment,
    Notification,
    NotificationPreference,
    SignInThrottle,
    TrailTreeHead,
    LabPrice,
    AuditOrder,
    AuditOrderLot,
    AuditPayment,
    StripeEvent,
  ]) {
    m.initModel(sequelize);
  }
  Membership.belongsTo(User, { foreignKey: "userId", as: "user" });
  Membership.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  User.hasMany(Membership, { foreignKey: "userId", as: "memberships" });
  Organisation.hasMany(Membership, { foreignKey: "organisationId", as: "memberships" });
  Invitation.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  Contract.belongsTo(Wine, { foreignKey: "wineId", as: "wine" });
  Contract.belongsTo(Organisation, { foreignKey: "retailerOrgId", as: "retailer" });
  Contract.belongsTo(Organisation, { foreignKey: "producerOrgId", as: "producer" });
  Contract.hasMany(SpecVersion, { foreignKey: "contractId", as: "versions" });
  SpecVersion.belongsTo(Contract, { foreignKey: "contractId", as: "contract" });
  SpecVersion.hasMany(SpecRequirement, { foreignKey: "specVersionId", as: "requirements" });
  SpecVersion.hasMany(SpecComment, { foreignKey: "specVersionId", as: "comments" });
  SpecComment.belongsTo(User, { foreignKey: "authorUserId", as: "author" });
  Lot.hasMany(Analysis, { foreignKey: "lotId", as: "analyses" });
  Analysis.belongsTo(Lot, { foreignKey: "lotId", as: "lot" });
  Analysis.hasMany(AnalysisResult, { foreignKey: "analysisId", as: "results" });
  AnalysisResult.belongsTo(Analysis, { foreignKey: "analysisId", as: "analysis" });
  Analysis.hasOne(AnalysisEvaluation, { foreignKey: "analysisId", as: "evaluation" });
  Analysis.hasMany(Certificate, { foreignKey: "analysisId", as: "certificates" });
  Lot.belongsTo(Contract, { foreignKey: "contractId", as: "contract" });
  Deviation.belongsTo(Lot, { foreignKey: "lotId", as: "lot" });
  Deviation.hasMany(DeviationMessage, { foreignKey: "deviationId", as: "messages" });
  DeviationMessage.belongsTo(User, { foreignKey: "authorUserId", as: "author" });
  DeviationMessage.hasMany(DeviationMessageEdit, { foreignKey: "messageId", as: "edits" });
  DeviationMessage.hasMany(DeviationAttachment, { foreignKey: "messageId", as: "attachments" });
  AuditOrder.hasMany(AuditOrderLot, { foreignKey: "auditOrderId", as: "lots" });
  AuditOrder.hasMany(AuditPayment, { foreignKey: "auditOrderId", as: "payments" });
  AuditOrder.belongsTo(Contract, { foreignKey: "contractId", as: "contract" });
  AuditOrder.belongsTo(Organisation, { foreignKey: "laboratoryOrgId", as: "laboratory" });
  AuditOrder.belongsTo(User, { foreignKey: "orderedBy", as: "orderer" });
  AuditOrderLot.belongsTo(Lot, { foreignKey: "lotId", as: "lot" });
  AuditOrderLot.belongsTo(AuditOrder, { foreignKey: "auditOrderId", as: "order" });
}
