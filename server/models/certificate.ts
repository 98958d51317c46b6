import { StoredFileModel, storedFileAttributes } from "./stored-file-attributes.ts";
import { DataTypes, type Sequelize } from "sequelize";

export class Certificate extends StoredFileModel<Certificate> {
  declare analysisId: number;

  static initModel(sequelize: Sequelize) {
    Certificate.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        analysisId: { type: DataTypes.INTEGER, allowNull: false },
        ...storedFileAttributes,
      },
      { sequelize, tableName: "certificates", underscored: true, updatedAt: false },
    );
  }
}
