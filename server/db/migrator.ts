/** umzug instances for schema migrations and demo seeders; our own resolver so .ts files load under vitest too. */
import path from "node:path";
import { pathToFileURL } from "node:url";
import { Umzug, SequelizeStorage } from "umzug";
import type { Sequelize, QueryInterface } from "sequelize";

const root = path.resolve(import.meta.dirname, "../..");

function build(sequelize: Sequelize, folder: "migrations" | "seeders", table: string) {
  return new Umzug<QueryInterface>({
    migrations: {
      glob: [`${folder}/*.{ts,js}`, { cwd: root, ignore: ["**/*.d.ts"] }],
      resolve: ({ name, path: file, context }) => ({
        name: name.replace(/\.(ts|js)$/, ""),
        up: async () => (await import(pathToFileURL(file!).href)).up({ context }),
        down: async () => (await import(pathToFileURL(file!).href)).down?.({ context }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: `${table}` }),
    logger: undefined,
  });
}

export const createMigrator = (s: Sequelize) => build(s, "migrations", "schema_migrations");
export const createSeeder = (s: Sequelize) => build(s, "seeders", "seed_runs");
export type Migration = ReturnType<typeof createMigrator>["_types"]["migration"];
