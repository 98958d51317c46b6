/**
 * Inserts cut by size: MariaDB refuses a statement longer than max_allowed_packet (MariaDB KB,
 * "max_allowed_packet": default 16 MiB since 10.2.4), so rows are grouped by their SQL's size.
 */
import { describe, expect, it } from "vitest";
import { chunkByBytes, sqlBytesOf } from "../../server/db/bulk-insert.ts";

const row = (i: number, size: number) => ({ id: i, verdicts: "v".repeat(size) });

describe("chunks by bytes", () => {
  it("when rows of mixed sizes are chunked, then every chunk stays under the budget and every row is kept once, in order", () => {
    const rows = Array.from({ length: 500 }, (_, i) => row(i, i % 7 === 0 ? 9_000 : 120));
    const chunks = chunkByBytes(rows, 50_000);
    expect(chunks.flat().map((r) => r.id)).toEqual(rows.map((r) => r.id));
    for (const c of chunks) expect(c.reduce((n, r) => n + sqlBytesOf(r), 0)).toBeLessThanOrEqual(50_000);
    expect(chunks.length).toBeGreaterThan(1);
  });

  it("when one row alone is over the budget, then it goes in a chunk of its own rather than being dropped", () => {
    const chunks = chunkByBytes([row(1, 10), row(2, 100_000), row(3, 10)], 1_000);
    expect(chunks.map((c) => c.map((r) => r.id))).toEqual([[1], [2], [3]]);
  });

  it("when text needs escaping or is not ASCII, then the estimate still covers the SQL MariaDB receives", () => {
    const nasty = { t: `'\\"é€`.repeat(1000) };
    // Each character at worst: escaped (2 chars) and 3 UTF-8 bytes.
    expect(sqlBytesOf(nasty)).toBeGreaterThanOrEqual(Buffer.byteLength(nasty.t.replace(/['"\\]/g, "\\$&"), "utf8"));
  });
});
