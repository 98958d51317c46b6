import { Sequelize } from "sequelize";
import type { Config } from "../config.ts";
import type { Logger } from "pino";

export function createSequelize(config: Config, logger?: Logger): Sequelize {
  return new Sequelize(config.DB_NAME, config.DB_USER, config.DB_PASSWORD, {
    host: config.DB_HOST,
    port: config.DB_PORT,
    dialect: "mariadb",
    // Exact decimal strings, plain numbers for ids and counts (see DEVELOPERS.md).
    dialectOptions: { supportBigNumbers: false, bigIntAsNumber: true, insertIdAsNumber: true, connectTimeout: 5000 },
    timezone: "+00:00",
    pool: { max: config.DB_POOL_MAX, min: 0, acquire: 20000, idle: 10000 },
    logging: logger ? (sql) => logger.debug({ sql }, "sql") : false,
  });
}
