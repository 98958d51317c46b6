/**
 * Rebuilds the test database (never the demo's) before the run: drops every table, then runs all
 * migrations up, all the way down and up again (so every down() is exercised), then the seeders.
 */
import { QueryTypes } from "sequelize";
import { loadConfig } from "../../server/config.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { createMigrator, createSeeder } from "../../server/db/migrator.ts";

export default async function setup() {
  const config = loadConfig({ ...process.env, DB_NAME: "cellarpact_test" });
  const sequelize = createSequelize(config);
  try {
    await sequelize.authenticate();
  } catch (err) {
    throw new Error(`MariaDB is not reachable on ${config.DB_HOST}:${config.DB_PORT}; run "bash server/scripts/db.sh start" first (${(err as Error).message})`, { cause: err });
  }
  const tables = await sequelize.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()",
    { type: QueryTypes.SELECT },
  );
  await sequelize.query("SET FOREIGN_KEY_CHECKS = 0");
  for (const { name } of tables) await sequelize.query(`DROP TABLE \`${name}\``);
  await sequelize.query("SET FOREIGN_KEY_CHECKS = 1");
  const migrator = createMigrator(sequelize);
  await migrator.up();
  await migrator.down({ to: 0 });
  await migrator.up();
  await createSeeder(sequelize).up();
  await sequelize.close();
}
