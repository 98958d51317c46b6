/**
 * Multi-row inserts cut by size, not by row count: one INSERT must fit in the server's
 * max_allowed_packet, and rows carrying an evaluation's verdicts are a hundred times the size of a
 * result row.
 */
import type { QueryInterface, Transaction } from "sequelize";

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
function budgetOf(qi: QueryInterface): Promise<number> {
  packetBudget ??= qi.sequelize
    .query<{ packet: number | string }>("SELECT @@max_allowed_packet AS packet", { type: "SELECT" as never, plain: true })
    .then((r) => Math.floor(Number((r as unknown as { packet: number | string }).packet) / 4));
  return packetBudget;
}

export async function insertInChunks(qi: QueryInterface, t: Transaction, table: string, rows: object[]): Promise<void> {
  for (const chunk of chunkByBytes(rows, await budgetOf(qi))) await qi.bulkInsert(table, chunk, { transaction: t });
}
