import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { DeviationProposal, MessageKind, QuotedResult } from "../../shared/deviations/vocabulary.ts";

export class DeviationMessage extends Model<InferAttributes<DeviationMessage>, InferCreationAttributes<DeviationMessage>> {
  declare id: CreationOptional<number>;
  declare deviationId: number;
  declare parentId: number | null;
  declare authorUserId: number;
  declare organisationId: number;
  declare kind: MessageKind;
  declare body: string;
  declare proposal: DeviationProposal | null;
  declare quote: QuotedResult | null;
  declare mentions: number[];
  declare editedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    DeviationMessage.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        deviationId: { type: DataTypes.INTEGER, allowNull: false },
        parentId: { type: DataTypes.INTEGER, allowNull: true },
        authorUserId: { type: DataTypes.INTEGER, allowNull: false },
        organisationId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.ENUM("comment", "proposal", "acceptance", "decision"), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        proposal: { type: DataTypes.JSON, allowNull: true },
        quote: { type: DataTypes.JSON, allowNull: true },
        mentions: { type: DataTypes.JSON, allowNull: false },
        editedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "deviation_messages", underscored: true, updatedAt: false },
    );
  }
}
