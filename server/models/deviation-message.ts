import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { DeviationProposal, MessageKind, QuotedResult } from "../../shared/deviations/vocabulary.ts";
import { createdAt, id, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  deviationId: required<number>(DataTypes.INTEGER),
  parentId: optional<number>(DataTypes.INTEGER),
  authorUserId: required<number>(DataTypes.INTEGER),
  organisationId: required<number>(DataTypes.INTEGER),
  kind: required<MessageKind>(DataTypes.ENUM("comment", "proposal", "acceptance", "decision")),
  body: required<string>(DataTypes.TEXT),
  proposal: optional<DeviationProposal>(DataTypes.JSON),
  quote: optional<QuotedResult>(DataTypes.JSON),
  mentions: required<number[]>(DataTypes.JSON),
  editedAt: optional<Date>(DataTypes.DATE(3)),
  createdAt,
};

export interface DeviationMessage extends Fields<typeof columns> {}
export class DeviationMessage extends Model<InferAttributes<DeviationMessage>, InferCreationAttributes<DeviationMessage>> {
  static initModel(sequelize: Sequelize) {
    DeviationMessage.init(columns, { sequelize, tableName: "deviation_messages", underscored: true, updatedAt: false });
  }
}
