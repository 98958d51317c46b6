import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { column, required, type Fields } from "../db/columns.ts";

/** One row: the last sequence number and hash, used as the append lock and as the tail checkpoint. */
const columns = {
  id: column<number>({ type: DataTypes.TINYINT, primaryKey: true }),
  lastSeq: required<number>(DataTypes.BIGINT),
  lastHash: required<string>(DataTypes.CHAR(64)),
};

export interface TrailHead extends Fields<typeof columns> {}
export class TrailHead extends Model<InferAttributes<TrailHead>, InferCreationAttributes<TrailHead>> {
  static initModel(sequelize: Sequelize) {
    TrailHead.init(columns, { sequelize, tableName: "trail_head", underscored: true, timestamps: false });
  }
}
