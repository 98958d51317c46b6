/** Drops every table of the connected database. Only for the test database and `migrate reset`. */
import { QueryTypes, type Sequelize } from "sequelize";

export async function dropAllTables(sequelize: Sequelize): Promise<void> {
  const tables = await sequelize.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()",
    { type: QueryTypes.SELECT },
  );
  await sequelize.query("SET FOREIGN_KEY_CHECKS = 0");
  for (const { name } of tables) await sequelize.query(`DROP TABLE \`${name}\``);
  await sequelize.query("SET FOREIGN_KEY_CHECKS = 1");
}
