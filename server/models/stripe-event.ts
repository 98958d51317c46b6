import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class StripeEvent extends Model<InferAttributes<StripeEvent>, InferCreationAttributes<StripeEvent>> {
  declare id: string;
  declare type: string;
  declare outcome: string;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize) {
    StripeEvent.init(
      {
        id: { type: DataTypes.STRING(80), primaryKey: true },
        type: { type: DataTypes.STRING(60), allowNull: false },
        outcome: { type: DataTypes.STRING(40), allowNull: false },
        receivedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "stripe_events", underscored: true, timestamps: false },
    );
  }
}
