import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { readCsv } from "../support/csv.ts";
import {
  ambiguousNumbers,
  buildSamples,
  guessMapping,
  normaliseDate,
  normaliseUnit,
  parseHeader,
  splitPlusMinus,
} from "../../shared/lots/csv.ts";
import { HEADER_SYNONYMS } from "../../shared/lots/header-synonyms.ts";
import { convert, implausibility, parseReading } from "../../shared/engine/index.ts";

const fixture = (name: string) => readFileSync(path.join(import.meta.dirname, "../fixtures", name), "utf8");

describe("CSV import: lab exports as they come", () => {
  it("when a file has a byte-order mark, semicolons and decimal commas with units in the headers, then every result is read with its unit", () => {
    const { samples, errors, mapping } = readCsv(fixture("lab-export-semicolon-bom.csv"));
    expect(errors).toEqual([]);
    expect(mapping[0]).toEqual({ kind: "lot" });
    expect(mapping[2]).toEqual({ kind: "parameter", parameter: "alcohol", unit: "% vol", headerUnit: "% vol" });
    expect(mapping[5]).toEqual({ kind: "parameter", parameter: "volatile_acidity", unit: "g/L as acetic acid", headerUnit: "g/L acetic" });
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
    expect(parseHeader("Free SO2 [mg/l]")).toEqual({ parameter: "free_so2", unit: "mg/L", unitText: "mg/l" });
    expect(parseHeader("Total acidity (g/L tartaric)")).toEqual({
      parameter: "total_acidity",
      unit: "g/L as tartaric acid",
      unitText: "g/L tartaric",
    });
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

describe("CSV import: a number keeps the meaning the file gives it", () => {
  it("when a French lab file has units in its headers, semicolons and decimal commas, then every value is read in the file's own unit", () => {
    const { samples, errors, mapping, implausible } = readCsv(fixture("laboratoire-francais.csv"));
    expect(errors).toEqual([]);
    expect(mapping.slice(0, 3)).toEqual([{ kind: "lot" }, { kind: "vintage" }, { kind: "date" }]);
    expect(mapping[6]).toMatchObject({ parameter: "volatile_acidity", unit: "g/L as sulfuric acid" });
    expect(mapping[7]).toMatchObject({ parameter: "total_acidity", unit: "g/L as sulfuric acid" });
    expect(mapping[3]).toMatchObject({ parameter: "alcohol", unit: "% vol" });
    expect(mapping[9]).toMatchObject({ parameter: "residual_sugar", unit: "g/L" });
    expect(samples.map((s) => [s.lotCode, s.vintage, s.sampleDate])).toEqual([
      ["SB-25-F1", 2025, "2026-11-14"],
      ["SB-25-F2", 2025, "2026-11-14"],
      ["SB-25-F3", 2025, "2026-11-15"],
    ]);
    const va = samples[0]!.results.find((r) => r.parameter === "volatile_acidity")!;
    expect(va).toMatchObject({ raw: "0,36", unit: "g/L as sulfuric acid" });
    // 0.36 g/L as H2SO4 is 0.36 / 49.04 × 1000 = 7.34 meq/L (equivalent mass of sulfuric acid 98.08 / 2, common practice),
    // not 0.36 meq/L: the value keeps the file's expression.
    expect(convert(0.36, va.unit, "meq/L")).toBeCloseTo(7.341, 3);
    expect(samples[1]!.results.find((r) => r.parameter === "volatile_acidity")).toMatchObject({
      raw: "0,41",
      uncertainty: { value: 0.03 },
    });
    // The alcohol of 125 % vol is held back for confirmation, with its row and column.
    expect(implausible).toHaveLength(1);
    expect(implausible[0]).toMatchObject({ row: 3, column: "TAV (% vol)" });
    expect(implausible[0]!.message).toMatch(/^Implausible: check the unit\./);
  });

  it("when a header names no unit for a parameter with several, then the mapping asks for it instead of guessing", () => {
    const headers = ["Lot", "Acidité volatile", "pH"];
    const mapping = guessMapping(headers);
    expect(mapping[1]).toMatchObject({ kind: "parameter", parameter: "volatile_acidity", unit: null });
    // pH has one unit only, so there is nothing to ask.
    expect(mapping[2]).toMatchObject({ kind: "parameter", parameter: "ph", unit: "pH" });
    const { samples, errors } = buildSamples(headers, [["L1", "0,36", "3,3"]], mapping, { sampleDate: "2026-11-30" });
    expect(samples).toEqual([]);
    expect(errors[0]).toMatchObject({ column: "Acidité volatile" });
    expect(errors[0]!.message).toMatch(/Choose the unit of column "Acidité volatile"/);
    // A unit the parameter cannot be reported in is not taken either: plain g/L names no acid.
    expect(guessMapping(["Lot", "Acidité volatile (g/L)"])[1]).toMatchObject({ unit: null, headerUnit: "g/L" });
  });

  it("when units are written in the usual spellings, then each is read as the unit it names", () => {
    const cases: [string, string][] = [
      ["g/L H2SO4", "g/L as sulfuric acid"],
      ["g/l as sulfuric", "g/L as sulfuric acid"],
      ["g/l en H2SO4", "g/L as sulfuric acid"],
      ["g/L tartaric", "g/L as tartaric acid"],
      ["g/l acide tartrique", "g/L as tartaric acid"],
      ["g/L ac. acétique", "g/L as acetic acid"],
      ["g/l Essigsäure", "g/L as acetic acid"],
      ["meq/L", "meq/L"],
      ["MEQ/l", "meq/L"],
      ["mg/l", "mg/L"],
      ["ppm", "ppm"],
      ["% vol", "% vol"],
      ["% v/v", "% vol"],
      ["%vol", "% vol"],
      ["vol%", "% vol"],
      ["UFC/ml", "CFU/mL"],
      ["g/100 ml acetic", "g/100 mL as acetic acid"],
    ];
    for (const [text, unit] of cases) expect([text, normaliseUnit(text)]).toEqual([text, unit]);
    expect(normaliseUnit("g/L")).toBe("g/L");
    expect(normaliseUnit("furlongs")).toBeNull();
  });

  it("when a lab names a parameter in English, French, Italian, Spanish, German or Portuguese, then the synonyms table finds it (common practice wording)", () => {
    const cases: [string, string][] = [
      ["Free SO2 (mg/L)", "free_so2"],
      ["SO2 libre (mg/l)", "free_so2"],
      ["SO2 libera", "free_so2"],
      ["Anhídrido sulfuroso libre", "free_so2"],
      ["Freie schweflige Säure", "free_so2"],
      ["Dióxido de enxofre livre", "free_so2"],
      ["Total SO2", "total_so2"],
      ["Anhydride sulfureux total", "total_so2"],
      ["Anidride solforosa totale", "total_so2"],
      ["SO2 total", "total_so2"],
      ["Gesamte schweflige Säure", "total_so2"],
      ["Dióxido de enxofre total", "total_so2"],
      ["Volatile acidity", "volatile_acidity"],
      ["Acidité volatile", "volatile_acidity"],
      ["Acidità volatile", "volatile_acidity"],
      ["Acidez volátil", "volatile_acidity"],
      ["Flüchtige Säure", "volatile_acidity"],
      ["Acidité totale", "total_acidity"],
      ["Acidità totale", "total_acidity"],
      ["Acidez total", "total_acidity"],
      ["Gesamtsäure", "total_acidity"],
      ["TAV", "alcohol"],
      ["Titolo alcolometrico", "alcohol"],
      ["Grado alcohólico", "alcohol"],
      ["Vorhandener Alkohol", "alcohol"],
      ["Teor alcoólico", "alcohol"],
      ["Sucres résiduels", "residual_sugar"],
      ["Zuccheri residui", "residual_sugar"],
      ["Azúcares residuales", "residual_sugar"],
      ["Restzucker", "residual_sugar"],
      ["Açúcares residuais", "residual_sugar"],
      ["Oxygène dissous", "dissolved_oxygen"],
      ["Ossigeno disciolto", "dissolved_oxygen"],
      ["Oxígeno disuelto", "dissolved_oxygen"],
      ["Gelöster Sauerstoff", "dissolved_oxygen"],
      ["Oxigénio dissolvido", "dissolved_oxygen"],
      ["Cuivre", "copper"],
      ["Rame", "copper"],
      ["Kupfer", "copper"],
      ["Fer", "iron"],
      ["Eisen", "iron"],
      ["Hierro", "iron"],
      ["Acide malique", "malic_acid"],
      ["Äpfelsäure", "malic_acid"],
      ["Gaz carbonique", "carbon_dioxide"],
      ["Kohlendioxid", "carbon_dioxide"],
      ["Turbidité", "turbidity"],
      ["Trübung", "turbidity"],
    ];
    for (const [header, parameter] of cases) expect([header, parseHeader(header).parameter]).toEqual([header, parameter]);
    // Every language of every entry names a parameter the catalogue knows.
    for (const [parameter, byLanguage] of Object.entries(HEADER_SYNONYMS)) {
      for (const names of Object.values(byLanguage)) for (const n of names) expect([n, parseHeader(n).parameter]).toEqual([n, parameter]);
    }
  });

  it("when a value lies far outside what wine can be, then it is called implausible; a usual value is not (ranges: common practice)", () => {
    const read = (raw: string) => {
      const r = parseReading(raw);
      if (!r.ok) throw new Error(r.error);
      return r.reading;
    };
    expect(implausibility("volatile_acidity", read("0.36"), "meq/L")).toMatch(/^Implausible: check the unit/);
    expect(implausibility("volatile_acidity", read("0.36"), "g/L as acetic acid")).toBeNull();
    expect(implausibility("alcohol", read("125"), "% vol")).toMatch(/above 25 % vol/);
    expect(implausibility("alcohol", read("12.5"), "% vol")).toBeNull();
    expect(implausibility("ph", read("33"), "pH")).not.toBeNull();
    expect(implausibility("free_so2", read("<5"), "mg/L")).toBeNull();
  });
});

describe("CSV import: numbers that read two ways", () => {
  it("when result cells hold a single mark followed by three digits, then the import must ask for the laboratory's number format; other numbers do not need it", () => {
    const headers = ["Lot", "Levures (UFC/ml)", "pH"];
    const mapping = guessMapping(headers);
    expect(
      ambiguousNumbers(
        [
          ["L1", "1.200", "3,30"],
          ["L2", "0,455", "3,31"],
          ["L3", "< 1.500", "3,2"],
        ],
        mapping,
      ),
    ).toEqual(["1.200", "1.500"]);
    expect(
      ambiguousNumbers(
        [
          ["L1", "120", "3,30"],
          ["L2", "12,5", "3,31"],
        ],
        mapping,
      ),
    ).toEqual([]);
  });
});
