import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class IdempotencyKey extends Model<InferAttributes<IdempotencyKey>, InferCreationAttributes<IdempotencyKey>> {
  declare id: CreationOptional<number>;
  declare organisationId: number;
  declare key: string;
  declare requestHash: string;
  declare response: unknown;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    IdempotencyKey.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        key: { type: DataTypes.STRING(100), allowNull: false },
        requestHash: { type: DataTypes.CHAR(64), allowNull: false },
        response: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "idempotency_keys", underscored: true, updatedAt: false },
    );
  }
}
