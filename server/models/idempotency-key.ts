import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { createdAt, id, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  organisationId: required<number>(DataTypes.INTEGER),
  key: required<string>(DataTypes.STRING(100)),
  requestHash: required<string>(DataTypes.CHAR(64)),
  response: required<unknown>(DataTypes.JSON),
  createdAt,
};

export interface IdempotencyKey extends Fields<typeof columns> {}
export class IdempotencyKey extends Model<InferAttributes<IdempotencyKey>, InferCreationAttributes<IdempotencyKey>> {
  static initModel(sequelize: Sequelize) {
    IdempotencyKey.init(columns, { sequelize, tableName: "idempotency_keys", underscored: true, updatedAt: false });
  }
}
