import { StoredFileModel, storedFileAttributes } from "./stored-file-attributes.ts";
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { DeviationDecision, DeviationKind, DeviationProposal, DeviationStatus, MessageKind, QuotedResult } from "../../shared/deviations/vocabulary.ts";

export class Deviation extends Model<InferAttributes<Deviation>, InferCreationAttributes<Deviation>> {
  declare id: CreationOptional<number>;
  declare contractId: number;
  declare lotId: number;
  declare analysisId: number | null;
  declare kind: DeviationKind;
  /** The paid audit whose results opened it; its laboratory may read it. */
  declare auditOrderId: CreationOptional<number | null>;
  declare status: DeviationStatus;
  declare parameters: string[];
  declare summary: string;
  declare openedBy: number | null;
  declare respondBy: CreationOptional<Date | null>;
  declare decision: CreationOptional<DeviationDecision | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare decidedBy: CreationOptional<number | null>;
  declare deadlineWarnedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Deviation.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        contractId: { type: DataTypes.INTEGER, allowNull: false },
        lotId: { type: DataTypes.INTEGER, allowNull: false },
        analysisId: { type: DataTypes.INTEGER, allowNull: true },
        kind: { type: DataTypes.ENUM("result", "transit", "manual", "audit"), allowNull: false },
        auditOrderId: { type: DataTypes.INTEGER, allowNull: true },
        status: { type: DataTypes.STRING(30), allowNull: false },
        parameters: { type: DataTypes.JSON, allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: false },
        openedBy: { type: DataTypes.INTEGER, allowNull: true },
        respondBy: { type: DataTypes.DATE(3), allowNull: true },
        decision: { type: DataTypes.JSON, allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        decidedBy: { type: DataTypes.INTEGER, allowNull: true },
        deadlineWarnedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "deviations", underscored: true },
    );
  }
}

export class DeviationMessage extends Model<InferAttributes<DeviationMessage>, InferCreationAttributes<DeviationMessage>> {
  declare id: CreationOptional<number>;
  declare deviationId: number;
  declare parentId: number | null;
  declare authorUserId: number;
  declare organisationId: number;
  declare kind: MessageKind;
  declare body: string;
  declare proposal: DeviationProposal | null;
  declare quote: QuotedResult | null;
  declare mentions: number[];
  declare editedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    DeviationMessage.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        deviationId: { type: DataTypes.INTEGER, allowNull: false },
        parentId: { type: DataTypes.INTEGER, allowNull: true },
        authorUserId: { type: DataTypes.INTEGER, allowNull: false },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.ENUM("comment", "proposal", "acceptance", "decision"), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        proposal: { type: DataTypes.JSON, allowNull: true },
        quote: { type: DataTypes.JSON, allowNull: true },
        mentions: { type: DataTypes.JSON, allowNull: false },
        editedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "deviation_messages", underscored: true, updatedAt: false },
    );
  }
}

export class DeviationMessageEdit extends Model<InferAttributes<DeviationMessageEdit>, InferCreationAttributes<DeviationMessageEdit>> {
  declare id: CreationOptional<number>;
  declare messageId: number;
  declare previousBody: string;
  declare editedAt: Date;

  static initModel(sequelize: Sequelize) {
    DeviationMessageEdit.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        messageId: { type: DataTypes.INTEGER, allowNull: false },
        previousBody: { type: DataTypes.TEXT, allowNull: false },
        editedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "deviation_message_edits", underscored: true, timestamps: false },
    );
  }
}

export class DeviationAttachment extends StoredFileModel<DeviationAttachment> {
  declare messageId: number;

  static initModel(sequelize: Sequelize) {
    DeviationAttachment.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        messageId: { type: DataTypes.INTEGER, allowNull: false },
        ...storedFileAttributes,
      },
      { sequelize, tableName: "deviation_attachments", underscored: true, updatedAt: false },
    );
  }
}

export class Notification extends Model<InferAttributes<Notification>, InferCreationAttributes<Notification>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare kind: string;
  declare title: string;
  declare body: string;
  declare link: string;
  declare readAt: CreationOptional<Date | null>;
  declare digestedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Notification.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.STRING(30), allowNull: false },
        title: { type: DataTypes.STRING(250), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        link: { type: DataTypes.STRING(250), allowNull: false },
        readAt: { type: DataTypes.DATE(3), allowNull: true },
        digestedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "notifications", underscored: true, updatedAt: false },
    );
  }
}

export class NotificationPreference extends Model<InferAttributes<NotificationPreference>, InferCreationAttributes<NotificationPreference>> {
  declare userId: number;
  declare emailMode: "immediate" | "daily_digest" | "off";
  declare kinds: string[];
  declare lastDigestAt: CreationOptional<Date | null>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NotificationPreference.init(
      {
        userId: { type: DataTypes.INTEGER, primaryKey: true },
        emailMode: { type: DataTypes.ENUM("immediate", "daily_digest", "off"), allowNull: false },
        kinds: { type: DataTypes.JSON, allowNull: false },
        lastDigestAt: { type: DataTypes.DATE(3), allowNull: true },
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "notification_preferences", underscored: true, createdAt: false },
    );
  }
}
