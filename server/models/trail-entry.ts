import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { column, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  seq: column<number>({ type: DataTypes.BIGINT, primaryKey: true }),
  occurredAt: required<Date>(DataTypes.DATE(3)),
  actorUserId: optional<number>(DataTypes.INTEGER),
  organisationId: optional<number>(DataTypes.INTEGER),
  action: required<string>(DataTypes.STRING(80)),
  entityType: required<string>(DataTypes.STRING(40)),
  entityId: optional<string>(DataTypes.STRING(64)),
  beforeDigest: optional<string>(DataTypes.CHAR(64)),
  afterDigest: optional<string>(DataTypes.CHAR(64)),
  details: optional<Record<string, unknown>>(DataTypes.JSON),
  prevHash: required<string>(DataTypes.CHAR(64)),
  hash: required<string>(DataTypes.CHAR(64)),
};

export interface TrailEntry extends Fields<typeof columns> {}
export class TrailEntry extends Model<InferAttributes<TrailEntry>, InferCreationAttributes<TrailEntry>> {
  static initModel(sequelize: Sequelize) {
    TrailEntry.init(columns, { sequelize, tableName: "trail_entries", underscored: true, timestamps: false });
  }
}
