import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { readCsv } from "../support/csv.ts";
import { normaliseDate, parseHeader, splitPlusMinus } from "../../shared/lots/csv.ts";

const fixture = (name: string) => readFileSync(path.join(import.meta.dirname, "../fixtures", name), "utf8");

describe("CSV import: lab exports as they come", () => {
  it("when a file has a byte-order mark, semicolons and decimal commas with units in the headers, then every result is read with its unit", () => {
    const { samples, errors, mapping } = readCsv(fixture("lab-export-semicolon-bom.csv"));
    expect(errors).toEqual([]);
    expect(mapping[0]).toEqual({ kind: "lot" });
    expect(mapping[2]).toEqual({ kind: "parameter", parameter: "alcohol", unit: "% vol" });
    expect(mapping[5]).toEqual({ kind: "parameter", parameter: "volatile_acidity", unit: "g/L as acetic acid" });
    expect(samples).toHaveLength(3);
    expect(samples[0]).toMatchObject({ lotCode: "SR-25-1", sampleDate: "2026-03-12" });
    const va = samples[0]!.results.find((r) => r.parameter === "volatile_acidity")!;
    expect(va).toMatchObject({ raw: "0,52", uncertainty: { kind: "expanded", value: 0.04, k: 2 } });
    // Censored results travel as the lab wrote them.
    expect(samples[2]!.results.find((r) => r.parameter === "free_so2")!.raw).toBe("n.d.");
    expect(samples[2]!.results.find((r) => r.parameter === "residual_sugar")!.raw).toBe("<0,5");
  });

  it("when a long-format file has bad rows, then each error names its row and column and good rows still import", () => {
    const { samples, errors } = readCsv(fixture("long-format-bad-rows.csv"));
    expect(samples).toHaveLength(1);
    expect(samples[0]!.results.map((r) => r.parameter).sort()).toEqual(["free_so2", "ph", "volatile_acidity"]);
    expect(errors).toEqual([
      { row: 4, column: "value", message: '"twelve" is not a number, "<" or ">" a number, or "n.d.".' },
      { row: 5, column: "parameter", message: '"Unobtainium" is not a parameter Cellarpact knows.' },
      { row: 6, column: "lot", message: "The lot code is empty." },
      { row: 7, column: "date", message: '"31/02/2026" is not a date; use 2026-03-31 or 31/03/2026.' },
    ]);
  });

  it("when headers, dates and ± cells vary, then they are normalised", () => {
    expect(parseHeader("Free SO2 [mg/l]")).toEqual({ parameter: "free_so2", unit: "mg/L" });
    expect(parseHeader("Total acidity (g/L tartaric)")).toEqual({ parameter: "total_acidity", unit: "g/L as tartaric acid" });
    expect(normaliseDate("03.11.2026")).toBe("2026-11-03");
    expect(normaliseDate("2026-02-29")).toBeNull();
    expect(splitPlusMinus("12,4 +/- 0,3")).toEqual({ raw: "12,4", uncertainty: 0.3 });
  });

  it("when 10,000 rows are read, then every one becomes a sample and none is lost", () => {
    const lines = ["Lot;Vintage;Free SO2 (mg/L);VA (g/L acetic);pH"];
    for (let i = 0; i < 10_000; i++) lines.push(`BULK-${i};2025;${20 + (i % 20)};0,${40 + (i % 30)};3,${40 + (i % 20)}`);
    const { samples, errors } = readCsv(lines.join("\n"));
    expect(errors).toEqual([]);
    expect(samples).toHaveLength(10_000);
    expect(samples[9_999]!.results).toHaveLength(3);
  });
});
