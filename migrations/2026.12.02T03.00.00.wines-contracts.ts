import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const stamps = { created_at: { type: DataTypes.DATE(3), allowNull: false }, updated_at: { type: DataTypes.DATE(3), allowNull: false } };
const org = (onDelete = "CASCADE") => ({
  type: DataTypes.INTEGER,
  allowNull: false,
  references: { model: "organisations", key: "id" },
  onDelete,
});

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.createTable("wines", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    retailer_org_id: org(),
    producer_org_id: org(),
    name: { type: DataTypes.STRING(160), allowNull: false },
    colour: { type: DataTypes.ENUM("red", "white", "rose"), allowNull: false },
    category: { type: DataTypes.ENUM("still", "sparkling", "quality-sparkling", "semi-sparkling", "liqueur"), allowNull: false },
    region: { type: DataTypes.STRING(120), allowNull: false },
    markets: { type: DataTypes.JSON, allowNull: false },
    // The wine's usual sugar and alcohol: what the law needs to pick limits before any lot exists.
    nominal_sugar_g_per_l: { type: DataTypes.DOUBLE, allowNull: true },
    nominal_alcohol_percent_vol: { type: DataTypes.DOUBLE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex("wines", ["retailer_org_id"], { name: "wines_retailer" });
  await qi.addIndex("wines", ["producer_org_id"], { name: "wines_producer" });

  await qi.createTable("contracts", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    reference: { type: DataTypes.STRING(40), allowNull: false },
    retailer_org_id: org(),
    producer_org_id: org(),
    wine_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "wines", key: "id" }, onDelete: "CASCADE" },
    starts_on: { type: DataTypes.DATEONLY, allowNull: false },
    ends_on: { type: DataTypes.DATEONLY, allowNull: true },
    ...stamps,
  });
  await qi.addIndex("contracts", ["retailer_org_id", "reference"], { unique: true, name: "contracts_reference_unique" });
  await qi.addIndex("contracts", ["producer_org_id"], { name: "contracts_producer" });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("contracts");
  await qi.dropTable("wines");
}
