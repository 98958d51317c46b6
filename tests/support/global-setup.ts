/**
 * Rebuilds the test database (never the demo's) before the run: drops every table, then runs all
 * migrations up, all the way down and up again (so every down() is exercised), then the seeders.
 */
import { loadConfig } from "../../server/config.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { createMigrator, createSeeder } from "../../server/db/migrator.ts";
import { dropAllTables } from "../../server/db/reset.ts";

export default async function setup() {
  const config = loadConfig({ ...process.env, DB_NAME: "cellarpact_test" });
  const sequelize = createSequelize(config);
  try {
    await sequelize.authenticate();
  } catch (err) {
    throw new Error(
      `MariaDB is not reachable on ${config.DB_HOST}:${config.DB_PORT}; run "bash server/scripts/db.sh start" first (${(err as Error).message})`,
      { cause: err },
    );
  }
  await dropAllTables(sequelize);
  const migrator = createMigrator(sequelize);
  await migrator.up();
  await migrator.down({ to: 0 });
  await migrator.up();
  await createSeeder(sequelize).up();
  await sequelize.close();
}
