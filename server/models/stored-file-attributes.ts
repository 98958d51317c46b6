/** Columns and fields every uploaded-file row shares (certificates, deviation attachments). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";

/** Subclasses add the id of what the file belongs to, and call init with `storedFileAttributes`. */
export abstract class StoredFileModel<M extends StoredFileModel<M>> extends Model<InferAttributes<M>, InferCreationAttributes<M>> {
  declare id: CreationOptional<number>;
  declare originalName: string;
  declare storedName: string;
  declare mime: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare uploadedBy: number;
  declare createdAt: CreationOptional<Date>;
}

export const storedFileAttributes = {
  originalName: { type: DataTypes.STRING(200), allowNull: false },
  storedName: { type: DataTypes.STRING(80), allowNull: false },
  mime: { type: DataTypes.STRING(60), allowNull: false },
  sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
  sha256: { type: DataTypes.CHAR(64), allowNull: false },
  uploadedBy: { type: DataTypes.INTEGER, allowNull: false },
  createdAt: DataTypes.DATE(3),
};
