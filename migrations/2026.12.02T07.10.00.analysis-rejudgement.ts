import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

/** A re-judgement is a new analysis with the same results, judged against the version now in force; it names the one it re-judges. */
export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("analyses", "rejudged_from_id", { type: DataTypes.INTEGER, allowNull: true });
  await qi.sequelize.query(
    "ALTER TABLE analyses ADD CONSTRAINT analyses_rejudged_from_fk FOREIGN KEY (rejudged_from_id) REFERENCES analyses (id)",
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  // Plain SQL: Sequelize's removeColumn trips over MariaDB's result shape.
  await qi.sequelize.query("ALTER TABLE analyses DROP FOREIGN KEY analyses_rejudged_from_fk, DROP COLUMN rejudged_from_id");
}
