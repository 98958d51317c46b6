import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Notification extends Model<InferAttributes<Notification>, InferCreationAttributes<Notification>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare kind: string;
  declare title: string;
  declare body: string;
  declare link: string;
  declare readAt: CreationOptional<Date | null>;
  declare digestedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Notification.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.STRING(30), allowNull: false },
        title: { type: DataTypes.STRING(250), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        link: { type: DataTypes.STRING(250), allowNull: false },
        readAt: { type: DataTypes.DATE(3), allowNull: true },
        digestedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "notifications", underscored: true, updatedAt: false },
    );
  }
}
