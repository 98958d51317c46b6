import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { SPEC_STATUSES, type SpecStatus, type Stage } from "../../shared/specs/vocabulary.ts";

export class SpecVersion extends Model<InferAttributes<SpecVersion>, InferCreationAttributes<SpecVersion>> {
  declare id: CreationOptional<number>;
  declare contractId: number;
  declare number: number;
  declare status: SpecStatus;
  declare title: string | null;
  declare vintageFrom: number;
  declare vintageTo: number | null;
  declare stages: Stage[];
  declare basedOnVersionId: number | null;
  declare lockVersion: CreationOptional<number>;
  declare createdBy: number;
  declare sentAt: CreationOptional<Date | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare decidedBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SpecVersion.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        contractId: { type: DataTypes.INTEGER, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.ENUM(...SPEC_STATUSES), allowNull: false },
        title: { type: DataTypes.STRING(160), allowNull: true },
        vintageFrom: { type: DataTypes.SMALLINT, allowNull: false },
        vintageTo: { type: DataTypes.SMALLINT, allowNull: true },
        stages: { type: DataTypes.JSON, allowNull: false },
        basedOnVersionId: { type: DataTypes.INTEGER, allowNull: true },
        lockVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdBy: { type: DataTypes.INTEGER, allowNull: false },
        sentAt: { type: DataTypes.DATE(3), allowNull: true },
        decidedAt: { type: DataTypes.DATE(3), allowNull: true },
        decidedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "spec_versions", underscored: true },
    );
  }
}
