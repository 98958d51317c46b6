import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { OrganisationKind } from "../../shared/auth/roles.ts";
import { id, required, timestamps, type Fields } from "../db/columns.ts";

const columns = {
  id,
  name: required<string>(DataTypes.STRING(160)),
  kind: required<OrganisationKind>(DataTypes.ENUM("retailer", "producer", "laboratory")),
  country: required<string>(DataTypes.CHAR(2)),
  ...timestamps,
};

export interface Organisation extends Fields<typeof columns> {}
export class Organisation extends Model<InferAttributes<Organisation>, InferCreationAttributes<Organisation>> {
  static initModel(sequelize: Sequelize) {
    Organisation.init(columns, { sequelize, tableName: "organisations", underscored: true });
  }
}
