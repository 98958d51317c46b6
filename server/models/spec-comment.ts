import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class SpecComment extends Model<InferAttributes<SpecComment>, InferCreationAttributes<SpecComment>> {
  declare id: CreationOptional<number>;
  declare specVersionId: number;
  declare requirementId: number | null;
  declare authorUserId: number;
  declare organisationId: number;
  declare body: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SpecComment.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        specVersionId: { type: DataTypes.INTEGER, allowNull: false },
        requirementId: { type: DataTypes.INTEGER, allowNull: true },
        authorUserId: { type: DataTypes.INTEGER, allowNull: false },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "spec_comments", underscored: true },
    );
  }
}
