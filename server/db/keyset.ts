/**
 * Keyset paging in SQL: the rows after a cursor are those whose sort key comes after the cursor's,
 * written as (k1 after v1) OR (k1 = v1 AND k2 after v2) OR ..., which an index on the keys serves.
 * The last key must be unique (the id), so the order is total and no row is skipped or repeated.
 */
import { literal, Op, where, type WhereOptions } from "sequelize";
import { validationFailed } from "../errors.ts";
import type { Page } from "../../shared/paging.ts";

export interface SortKey {
  /** The model attribute, or a fixed SQL expression (never user input) when the sort is computed. */
  attribute: string;
  sql?: string;
  direction: "ASC" | "DESC";
}

type KeyValue = string | number;

/** A DATETIME sort key's cursor value: the stored UTC time as MariaDB writes it (the connection's time zone is +00:00). */
export const sqlTime = (d: Date) => d.toISOString().replace("T", " ").replace("Z", "");

export const encodeCursor = (values: KeyValue[]) => Buffer.from(JSON.stringify(values), "utf8").toString("base64url");

export function decodeCursor(cursor: string, keys: SortKey[]): KeyValue[] {
  try {
    const values = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8")) as unknown;
    if (Array.isArray(values) && values.length === keys.length && values.every((v) => ["string", "number"].includes(typeof v)))
      return values as KeyValue[];
  } catch {
    // Falls through to the refusal below.
  }
  throw validationFailed([{ path: "query.cursor", message: "This cursor is not one the list gave; start again from the first page." }]);
}

const compare = (key: SortKey, op: symbol, value: KeyValue): WhereOptions =>
  key.sql ? where(literal(key.sql), { [op]: value }) : { [key.attribute]: { [op]: value } };

/** The rows after the cursor, as a WHERE clause; none when there is no cursor. */
export function afterCursor(keys: SortKey[], cursor: string | undefined): WhereOptions {
  if (!cursor) return {};
  const values = decodeCursor(cursor, keys);
  return {
    [Op.or]: keys.map((key, i) => ({
      [Op.and]: [
        ...keys.slice(0, i).map((k, j) => compare(k, Op.eq, values[j]!)),
        compare(key, key.direction === "ASC" ? Op.gt : Op.lt, values[i]!),
      ],
    })),
  };
}

/** ORDER BY for the keys. */
export const orderBy = (keys: SortKey[]) =>
  keys.map((k) => (k.sql ? [literal(k.sql), k.direction] : [k.attribute, k.direction])) as [string, string][];

/**
 * Turns `limit + 1` fetched rows into a page: the extra row only says there is more. `keyOf` reads
 * a row's sort key, in the order of `keys`.
 */
export async function toPage<R, T>(
  rows: R[],
  limit: number,
  keyOf: (row: R) => KeyValue[],
  view: (rows: R[]) => T[] | Promise<T[]>,
  total: number,
): Promise<Page<T>> {
  const more = rows.length > limit;
  const shown = more ? rows.slice(0, limit) : rows;
  return { items: await view(shown), nextCursor: more ? encodeCursor(keyOf(shown.at(-1)!)) : null, total };
}
