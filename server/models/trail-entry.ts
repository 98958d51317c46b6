import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class TrailEntry extends Model<InferAttributes<TrailEntry>, InferCreationAttributes<TrailEntry>> {
  declare seq: number;
  declare occurredAt: Date;
  declare actorUserId: number | null;
  declare organisationId: number | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  declare beforeDigest: string | null;
  declare afterDigest: string | null;
  declare details: Record<string, unknown> | null;
  declare prevHash: string;
  declare hash: string;

  static initModel(sequelize: Sequelize) {
    TrailEntry.init(
      {
        seq: { type: DataTypes.BIGINT, primaryKey: true },
        occurredAt: { type: DataTypes.DATE(3), allowNull: false },
        actorUserId: { type: DataTypes.INTEGER, allowNull: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: true },
        action: { type: DataTypes.STRING(80), allowNull: false },
        entityType: { type: DataTypes.STRING(40), allowNull: false },
        entityId: { type: DataTypes.STRING(64), allowNull: true },
        beforeDigest: { type: DataTypes.CHAR(64), allowNull: true },
        afterDigest: { type: DataTypes.CHAR(64), allowNull: true },
        details: { type: DataTypes.JSON, allowNull: true },
        prevHash: { type: DataTypes.CHAR(64), allowNull: false },
        hash: { type: DataTypes.CHAR(64), allowNull: false },
      },
      { sequelize, tableName: "trail_entries", underscored: true, timestamps: false },
    );
  }
}
