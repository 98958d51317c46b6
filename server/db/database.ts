/** The process-wide Sequelize instance, set once at boot (or by a test) and read by the services. */
import type { Sequelize, Transaction } from "sequelize";
import { initModels } from "../models/index.ts";

let current: Sequelize | null = null;

export function useDatabase(sequelize: Sequelize): void {
  initModels(sequelize);
  current = sequelize;
}

export function database(): Sequelize {
  if (!current) throw new Error("database not initialised; call useDatabase() at boot");
  return current;
}

export function inTransaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return database().transaction(work);
}
