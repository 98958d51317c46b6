import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class DeviationMessageEdit extends Model<InferAttributes<DeviationMessageEdit>, InferCreationAttributes<DeviationMessageEdit>> {
  declare id: CreationOptional<number>;
  declare messageId: number;
  declare previousBody: string;
  declare editedAt: Date;

  static initModel(sequelize: Sequelize) {
    DeviationMessageEdit.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        messageId: { type: DataTypes.INTEGER, allowNull: false },
        previousBody: { type: DataTypes.TEXT, allowNull: false },
        editedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "deviation_message_edits", underscored: true, timestamps: false },
    );
  }
}
