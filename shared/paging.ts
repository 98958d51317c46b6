/**
 * Paged lists: every list answers a page of items and a cursor that continues after the last one.
 * Cursors are keyset positions (the sort key of the last row), so a page costs the same at the
 * millionth row as at the first, and rows added meanwhile neither repeat nor go missing.
 */
import { z } from "zod";
import { countQuery } from "./count-query.ts";

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
  limit: countQuery({
    fallback: PAGE_SIZE_DEFAULT,
    min: 1,
    max: PAGE_SIZE_MAX,
    notWhole: "The page size is a whole number.",
    tooFew: "A page holds at least 1 row.",
    tooMany: `A page holds at most ${PAGE_SIZE_MAX} rows.`,
  }),
  cursor: z.string().max(400, { error: "This cursor is not one the list gave." }).optional(),
};
