import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** One row: the last sequence number and hash, used as the append lock and as the tail checkpoint. */
export class TrailHead extends Model<InferAttributes<TrailHead>, InferCreationAttributes<TrailHead>> {
  declare id: number;
  declare lastSeq: number;
  declare lastHash: string;

  static initModel(sequelize: Sequelize) {
    TrailHead.init(
      {
        id: { type: DataTypes.TINYINT, primaryKey: true },
        lastSeq: { type: DataTypes.BIGINT, allowNull: false },
        lastHash: { type: DataTypes.CHAR(64), allowNull: false },
      },
      { sequelize, tableName: "trail_head", underscored: true, timestamps: false },
    );
  }
}
