import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { DecisionRule } from "../../shared/engine/index.ts";
import type { Severity, Stage } from "../../shared/specs/vocabulary.ts";
import type { UnitId } from "../../shared/engine/index.ts";

export class SpecRequirement extends Model<InferAttributes<SpecRequirement>, InferCreationAttributes<SpecRequirement>> {
  declare id: CreationOptional<number>;
  declare specVersionId: number;
  declare position: number;
  declare parameter: string;
  declare unit: UnitId;
  declare lower: number | null;
  declare upper: number | null;
  declare target: number | null;
  declare method: string | null;
  declare rule: DecisionRule;
  declare severity: Severity;
  declare stages: Stage[];

  static initModel(sequelize: Sequelize) {
    SpecRequirement.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        specVersionId: { type: DataTypes.INTEGER, allowNull: false },
        position: { type: DataTypes.SMALLINT, allowNull: false },
        parameter: { type: DataTypes.STRING(40), allowNull: false },
        unit: { type: DataTypes.STRING(30), allowNull: false },
        lower: { type: DataTypes.DOUBLE, allowNull: true },
        upper: { type: DataTypes.DOUBLE, allowNull: true },
        target: { type: DataTypes.DOUBLE, allowNull: true },
        method: { type: DataTypes.STRING(120), allowNull: true },
        rule: { type: DataTypes.JSON, allowNull: false },
        severity: { type: DataTypes.ENUM("critical", "major", "minor"), allowNull: false },
        stages: { type: DataTypes.JSON, allowNull: false },
      },
      { sequelize, tableName: "spec_requirements", underscored: true, timestamps: false },
    );
  }
}
