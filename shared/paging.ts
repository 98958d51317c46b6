/**
 * Paged lists: every list answers a page of items and a cursor that continues after the last one.
 * Cursors are keyset positions (the sort key of the last row), so a page costs the same at the
 * millionth row as at the first, and rows added meanwhile neither repeat nor go missing.
 */
import { z } from "zod";

export const PAGE_SIZE_DEFAULT = 50;
export const PAGE_SIZE_MAX = 200;

/** A page of a list. `nextCursor` is null on the last page; `total` counts every row the filters match. */
export interface Page<T> {
  items: T[];
  nextCursor: string | null;
  total: number;
}

/** The paging part of a list's query string, spread into the list's own query schema. */
export const pageQuery = {
  limit: z.coerce
    .number({ error: "The page size is a number." })
    .int({ error: "The page size is a whole number." })
    .min(1, { error: "A page holds at least 1 row." })
    .max(PAGE_SIZE_MAX, { error: `A page holds at most ${PAGE_SIZE_MAX} rows.` })
    .default(PAGE_SIZE_DEFAULT),
  cursor: z.string().max(400, { error: "This cursor is not one the list gave." }).optional(),
};
