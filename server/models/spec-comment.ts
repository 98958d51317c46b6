import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  specVersionId: required<number>(DataTypes.INTEGER),
  requirementId: optional<number>(DataTypes.INTEGER),
  authorUserId: required<number>(DataTypes.INTEGER),
  organisationId: required<number>(DataTypes.INTEGER),
  body: required<string>(DataTypes.TEXT),
  ...timestamps,
};

export interface SpecComment extends Fields<typeof columns> {}
export class SpecComment extends Model<InferAttributes<SpecComment>, InferCreationAttributes<SpecComment>> {
  static initModel(sequelize: Sequelize) {
    SpecComment.init(columns, { sequelize, tableName: "spec_comments", underscored: true });
  }
}
