/** Columns every uploaded-file row shares (certificates, deviation attachments). */
import { DataTypes } from "sequelize";

export const storedFileAttributes = {
  originalName: { type: DataTypes.STRING(200), allowNull: false },
  storedName: { type: DataTypes.STRING(80), allowNull: false },
  mime: { type: DataTypes.STRING(60), allowNull: false },
  sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
  sha256: { type: DataTypes.CHAR(64), allowNull: false },
  uploadedBy: { type: DataTypes.INTEGER, allowNull: false },
  createdAt: DataTypes.DATE(3),
};
