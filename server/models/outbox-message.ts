import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<number>;
  declare messageKey: string;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare status: CreationOptional<"pending" | "sent" | "dead">;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date;
  declare lastError: CreationOptional<string | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OutboxMessage.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        messageKey: { type: DataTypes.CHAR(36), allowNull: false },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(250), allowNull: false },
        textBody: { type: DataTypes.TEXT("medium"), allowNull: false },
        status: { type: DataTypes.ENUM("pending", "sent", "dead"), allowNull: false, defaultValue: "pending" },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
        lastError: { type: DataTypes.STRING(500), allowNull: true },
        sentAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "outbox_messages", underscored: true },
    );
  }
}
