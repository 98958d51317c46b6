/**
 * Inserts of import size, through the mariadb driver on the transaction's own connection: model
 * instances and Sequelize's escaping cost more than the insert itself at thousands of rows.
 * Rows whose ids are not needed go by the driver's binary bulk protocol, which splits its packets
 * to fit max_allowed_packet. Rows whose ids are needed go as multi-row INSERT … RETURNING id, cut
 * by size so that no statement passes that limit; RETURNING rather than "insertId + i", because
 * on a Galera cluster auto_increment_increment is the number of nodes.
 */
import type { Connection, SqlError } from "mariadb";
import type { Transaction } from "sequelize";
import { database } from "./database.ts";
import { conflict } from "../errors.ts";

/** A row given as its column values, in the order of the column list. */
export type RowValues = readonly unknown[];

/**
 * The longest a row's SQL can be for its JSON length: escaping may double a character and a
 * non-ASCII one takes up to three bytes, so twice the UTF-8 length is a safe bound.
 */
export const sqlBytesOf = (row: object) => 2 * Buffer.byteLength(JSON.stringify(row), "utf8") + 16;

/** Groups rows so that no group's estimated SQL passes `budget` bytes (a row larger than the budget goes alone). */
export function chunkByBytes<T extends object>(rows: T[], budget: number): T[][] {
  const chunks: T[][] = [];
  let current: T[] = [];
  let size = 0;
  for (const row of rows) {
    const bytes = sqlBytesOf(row);
    if (current.length && size + bytes > budget) {
      chunks.push(current);
      current = [];
      size = 0;
    }
    current.push(row);
    size += bytes;
  }
  if (current.length) chunks.push(current);
  return chunks;
}

let packetBudget: Promise<number> | null = null;

/** A quarter of the server's max_allowed_packet, read once; the rest is headroom for the statement itself. */
function budgetOf(conn: Connection): Promise<number> {
  packetBudget ??= conn
    .query<{ packet: number | string }[]>("SELECT @@max_allowed_packet AS packet")
    .then((r) => Math.floor(Number(r[0]!.packet) / 4));
  return packetBudget;
}

/** Sequelize keeps the driver's connection on the transaction; every statement here runs inside it. */
const connectionOf = (t: Transaction) => (t as unknown as { connection: Connection }).connection;

const quote = (name: string) => `\`${name}\``;

/** Statements go through Sequelize's logging too, so the SQL log and the statement counts stay whole. */
function logged<T>(sql: string, run: () => Promise<T>): Promise<T> {
  const { logging } = (database() as unknown as { options: { logging?: unknown } }).options;
  if (typeof logging === "function") logging(sql);
  return run().catch((err: SqlError) => {
    // The unique indexes are the last word on duplicates that two writers raced to create.
    if (err.errno === 1062)
      throw conflict(`Another submission created the same record at the same moment; retry it. (${err.sqlMessage ?? ""})`);
    throw err;
  });
}

/** Inserts rows whose generated ids are not needed. */
export async function insertRows(t: Transaction, table: string, columns: readonly string[], rows: RowValues[]): Promise<void> {
  if (!rows.length) return;
  const sql = `INSERT INTO ${quote(table)} (${columns.map(quote).join(", ")}) VALUES (${columns.map(() => "?").join(", ")})`;
  await logged(sql, () => connectionOf(t).batch(sql, rows as unknown[][]));
}

/** Inserts rows and answers their generated ids, in the order given. */
export async function insertReturningIds(t: Transaction, table: string, columns: readonly string[], rows: RowValues[]): Promise<number[]> {
  const conn = connectionOf(t);
  const tuple = `(${columns.map(() => "?").join(", ")})`;
  const ids: number[] = [];
  for (const chunk of chunkByBytes(rows as unknown[][], await budgetOf(conn))) {
    const sql = `INSERT INTO ${quote(table)} (${columns.map(quote).join(", ")}) VALUES ${chunk.map(() => tuple).join(", ")} RETURNING id`;
    const inserted = await logged(sql, () => conn.query<{ id: number }[]>(sql, chunk.flat()));
    for (const row of inserted) ids.push(Number(row.id));
  }
  return ids;
}
