import { StoredFileModel, storedFileAttributes } from "./stored-file-attributes.ts";
import { DataTypes, type Sequelize } from "sequelize";

export class DeviationAttachment extends StoredFileModel<DeviationAttachment> {
  declare messageId: number;

  static initModel(sequelize: Sequelize) {
    DeviationAttachment.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        messageId: { type: DataTypes.INTEGER, allowNull: false },
        ...storedFileAttributes,
      },
      { sequelize, tableName: "deviation_attachments", underscored: true, updatedAt: false },
    );
  }
}
