import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class NotificationPreference extends Model<
  InferAttributes<NotificationPreference>,
  InferCreationAttributes<NotificationPreference>
> {
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
