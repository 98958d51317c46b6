/** Seeders act through the services (by way of tests/support/factories.ts), as people do: this gives the services their database and settings. */
import type { QueryInterface } from "sequelize";
import { useDatabase } from "../../server/db/database.ts";
import { loadConfig } from "../../server/config.ts";
import { settingsFrom, useServiceSettings } from "../../server/settings.ts";

export function useDemoServices(qi: QueryInterface): void {
  useDatabase(qi.sequelize);
  useServiceSettings(settingsFrom(loadConfig()));
}
