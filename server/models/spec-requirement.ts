import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { DecisionRule } from "../../shared/engine/index.ts";
import type { Severity, Stage } from "../../shared/specs/vocabulary.ts";
import type { UnitId } from "../../shared/engine/index.ts";
import { id, optional, required, type Fields } from "../db/columns.ts";

const columns = {
  id,
  specVersionId: required<number>(DataTypes.INTEGER),
  position: required<number>(DataTypes.SMALLINT),
  parameter: required<string>(DataTypes.STRING(40)),
  unit: required<UnitId>(DataTypes.STRING(30)),
  lower: optional<number>(DataTypes.DOUBLE),
  upper: optional<number>(DataTypes.DOUBLE),
  target: optional<number>(DataTypes.DOUBLE),
  method: optional<string>(DataTypes.STRING(120)),
  rule: required<DecisionRule>(DataTypes.JSON),
  severity: required<Severity>(DataTypes.ENUM("critical", "major", "minor")),
  stages: required<Stage[]>(DataTypes.JSON),
};

export interface SpecRequirement extends Fields<typeof columns> {}
export class SpecRequirement extends Model<InferAttributes<SpecRequirement>, InferCreationAttributes<SpecRequirement>> {
  static initModel(sequelize: Sequelize) {
    SpecRequirement.init(columns, { sequelize, tableName: "spec_requirements", underscored: true, timestamps: false });
  }
}
