import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { SPEC_STATUSES, type SpecStatus, type Stage } from "../../shared/specs/vocabulary.ts";
import { defaulted, id, optional, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  contractId: required<number>(DataTypes.INTEGER),
  number: required<number>(DataTypes.INTEGER),
  status: required<SpecStatus>(DataTypes.ENUM(...SPEC_STATUSES)),
  title: optional<string>(DataTypes.STRING(160)),
  vintageFrom: required<number>(DataTypes.SMALLINT),
  vintageTo: optional<number>(DataTypes.SMALLINT),
  stages: required<Stage[]>(DataTypes.JSON),
  basedOnVersionId: optional<number>(DataTypes.INTEGER),
  lockVersion: defaulted<number>(DataTypes.INTEGER, 0),
  createdBy: required<number>(DataTypes.INTEGER),
  sentAt: optional<Date>(DataTypes.DATE(3)),
  decidedAt: optional<Date>(DataTypes.DATE(3)),
  decidedBy: optional<number>(DataTypes.INTEGER),
  ...timestamps,
};

export interface SpecVersion extends Fields<typeof columns> {}
export class SpecVersion extends Model<InferAttributes<SpecVersion>, InferCreationAttributes<SpecVersion>> {
  static initModel(sequelize: Sequelize) {
    SpecVersion.init(columns, { sequelize, tableName: "spec_versions", underscored: true });
  }
}
