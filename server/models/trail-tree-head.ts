import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  treeSize: required<number>(DataTypes.INTEGER),
  rootHash: required<string>(DataTypes.CHAR(64)),
  /** The signed timestamp exactly as signed (ISO 8601, UTC). */
  signedAt: required<string>(DataTypes.STRING(30)),
  keyId: required<string>(DataTypes.CHAR(64)),
  signature: required<string>(DataTypes.STRING(120)),
};

export interface TrailTreeHead extends Fields<typeof columns> {}
export class TrailTreeHead extends Model<InferAttributes<TrailTreeHead>, InferCreationAttributes<TrailTreeHead>> {
  static initModel(sequelize: Sequelize) {
    TrailTreeHead.init(columns, { sequelize, tableName: "trail_tree_heads", underscored: true, timestamps: false });
  }
}
