/** Columns every uploaded-file row shares (certificates, deviation attachments). */
import { DataTypes } from "sequelize";
import { createdAt, id, required } from "../db/columns.ts";

/** A model spreads these into its own columns, beside the id of what the file belongs to. */
export const storedFileColumns = {
  id,
  originalName: required<string>(DataTypes.STRING(200)),
  storedName: required<string>(DataTypes.STRING(80)),
  mime: required<string>(DataTypes.STRING(60)),
  sizeBytes: required<number>(DataTypes.INTEGER),
  sha256: required<string>(DataTypes.CHAR(64)),
  uploadedBy: required<number>(DataTypes.INTEGER),
  createdAt,
};
