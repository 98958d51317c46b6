/**
 * CSV exports defuse formulae: OWASP "CSV Injection" lists cells starting with =, +, -, @, tab and
 * carriage return as run by spreadsheet programs, and prepending a single quote as the defence.
 */
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { CSV_BOM, CSV_EXPORT_OPTIONS } from "../../shared/csv-export.ts";

describe("CSV exports", () => {
  it("when a text cell starts with a formula character, then it is written with a leading quote and reads back as text", () => {
    const cells = ['=HYPERLINK("http://x.test","go")', "+41", "-2+3", "@SUM(A1)", "\tlot", "\rlot", "SB-24-T1", "< 0.5"];
    const csv = Papa.unparse(
      cells.map((c) => ({ cell: c, number: -1.5 })),
      CSV_EXPORT_OPTIONS,
    );
    expect(CSV_BOM).toBe("\uFEFF");
    const back = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data.slice(1);
    expect(back.map((r) => r[0])).toEqual([
      `'=HYPERLINK("http://x.test","go")`,
      "'+41",
      "'-2+3",
      "'@SUM(A1)",
      "'\tlot",
      "'\rlot",
      "SB-24-T1",
      "< 0.5",
    ]);
    // A number is a number, negative or not.
    expect(back.every((r) => r[1] === "-1.5")).toBe(true);
  });
});
