/** Command line: migrate up|down|reset, seed. Uses the same config as the server. */
import { loadConfig } from "../config.ts";
import { createSequelize } from "../db/connection.ts";
import { createMigrator, createSeeder } from "../db/migrator.ts";
import { dropAllTables } from "../db/reset.ts";

const config = loadConfig();
const sequelize = createSequelize(config);
const [cmd = "up"] = process.argv.slice(2);
try {
  const migrator = createMigrator(sequelize);
  if (cmd === "up") {
    const done = await migrator.up();
    console.log(`migrations applied: ${done.length} (database ${config.DB_NAME})`);
  } else if (cmd === "down") {
    await migrator.down();
    console.log("last migration reverted");
  } else if (cmd === "reset") {
    await dropAllTables(sequelize);
    const done = await migrator.up();
    console.log(`database ${config.DB_NAME} rebuilt: ${done.length} migrations`);
  } else if (cmd === "seed") {
    const done = await createSeeder(sequelize).up();
    console.log(`seeders run: ${done.length} (database ${config.DB_NAME})`);
  } else {
    throw new Error(`unknown command ${cmd}; use up, down, reset or seed`);
  }
} finally {
  await sequelize.close();
}
