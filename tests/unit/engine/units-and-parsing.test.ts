import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { convert, quantity, UnitError, type MgPerL, parseReading, parseDecimal, molecularSo2 } from "../../../shared/engine/index.ts";

describe("acid expressions", () => {
  it("when 18 and 20 meq/L of volatile acidity are expressed as acetic acid, then 1.08 and 1.20 g/L (Oxford Companion to Wine 2006, 'volatile acidity': 1 meq = 0.060 g acetic)", () => {
    expect(convert(18, "meq/L", "g/L as acetic acid")).toBeCloseTo(1.081, 3);
    expect(convert(20, "meq/L", "g/L as acetic acid")).toBeCloseTo(1.201, 3);
  });

  it("when 18 and 20 meq/L are expressed as sulfuric acid, then 0.88 and 0.98 g/L (Bourgogne wines glossary, 'Volatile acidity': 1 meq = 0.049 g H2SO4)", () => {
    expect(convert(18, "meq/L", "g/L as sulfuric acid")).toBeCloseTo(0.883, 3);
    expect(convert(20, "meq/L", "g/L as sulfuric acid")).toBeCloseTo(0.981, 3);
  });

  it("when total acidity as sulfuric acid is converted to tartaric, then the factor is 1.531 (Institut Heidger, 'Total acid')", () => {
    // Molar masses 150.09/2 and 98.08/2 give 1.5302; the source rounds to 1.531.
    expect(convert(1, "g/L as sulfuric acid", "g/L as tartaric acid")).toBeCloseTo(1.531, 2);
    expect(convert(1, "g/L as sulfuric acid", "meq/L")).toBeCloseTo(20.39, 2); // conversion table: 1 g/L H2SO4 = 20.39 meq/L
  });

  it("when the EU minimum of 3.5 g/L as tartaric acid is expressed in meq/L, then 46.6 (Reg. (EU) 1308/2013 Annex VII Part II point 1)", () => {
    expect(convert(3.5, "g/L as tartaric acid", "meq/L")).toBeCloseTo(46.6, 1);
  });

  it("when the US limit of 0.14 g/100 mL (27 CFR 4.21) is expressed per litre, then 1.4 g/L as acetic acid", () => {
    expect(convert(0.14, "g/100 mL as acetic acid", "g/L as acetic acid")).toBeCloseTo(1.4, 10);
  });
});

describe("other conversions", () => {
  it("when 12 % vol is expressed in g/L ethanol, then 94.71 (ethanol 789.24 kg/m³ at 20 °C: sum of the A coefficients, Council Directive 76/766/EEC Annex)", () => {
    expect(convert(12, "% vol", "g/L ethanol")).toBeCloseTo(94.709, 3);
    expect(convert(94.709, "g/L ethanol", "% vol")).toBeCloseTo(12, 3);
  });

  it("when counts are per 100 mL, then they scale by 100 (membrane filtration of 100 mL, common practice)", () => {
    expect(convert(5, "CFU/100 mL", "CFU/mL")).toBeCloseTo(0.05, 10);
    expect(convert(1, "CFU/mL", "CFU/100 mL")).toBe(100);
  });

  it("when mass concentrations change scale, then ng/L to g/100 mL and ppm = mg/L (27 CFR 4.22(b)(1) states SO2 in ppm)", () => {
    expect(convert(2500, "ng/L", "µg/L")).toBeCloseTo(2.5, 10);
    expect(convert(0.392, "g/100 mL", "g/L")).toBeCloseTo(3.92, 10);
    expect(convert(350, "ppm", "mg/L")).toBe(350);
  });

  it("when a per-kilogram limit is compared with a per-litre result, then the wine's density converts it", () => {
    expect(convert(0.1, "mg/kg", "mg/L", { densityGPerMl: 0.9936 })).toBeCloseTo(0.09936, 6);
    expect(convert(2, "µg/kg", "µg/L", { densityGPerMl: 1 })).toBe(2);
  });

  it("when dimensions differ, then the conversion is refused", () => {
    expect(() => convert(1, "mg/L", "meq/L")).toThrow(UnitError);
    expect(() => convert(1, "NTU", "%")).toThrow(UnitError);
  });

  it("when a value of the wrong unit is passed to a typed function, then the compiler refuses it", () => {
    const free = quantity(40, "mg/L");
    const ph = quantity(3.5, "pH");
    // @ts-expect-error: pH and mg/L swapped
    expect(() => molecularSo2(ph, free)).not.toThrow();
    // @ts-expect-error: a plain number has no unit
    const plain: MgPerL = 40;
    expect(plain).toBe(40);
  });
});

describe("laboratory notation", () => {
  it("when results use decimal commas or spaces between thousands, then they are read as numbers", () => {
    expect(parseReading("12,5")).toEqual({ ok: true, reading: { kind: "value", value: 12.5 } });
    expect(parseReading(" 0,35 ")).toEqual({ ok: true, reading: { kind: "value", value: 0.35 } });
    expect(parseDecimal("1 234,5")).toBe(1234.5);
    expect(parseDecimal("-0.2")).toBe(-0.2);
  });

  it("when a result is below or above the reportable range, then it stays censored", () => {
    expect(parseReading("<0.5")).toEqual({ ok: true, reading: { kind: "below", limit: 0.5 } });
    expect(parseReading("< 0,5")).toEqual({ ok: true, reading: { kind: "below", limit: 0.5 } });
    expect(parseReading("> 300")).toEqual({ ok: true, reading: { kind: "above", limit: 300 } });
    expect(parseReading("n.d.")).toEqual({ ok: true, reading: { kind: "below", limit: null } });
    expect(parseReading("ND", { loq: 0.1 })).toEqual({ ok: true, reading: { kind: "below", limit: 0.1 } });
  });

  it("when a result is not a number, then the error names the text", () => {
    expect(parseReading("1,2,3.4.5")).toMatchObject({ ok: false, error: '"1,2,3.4.5" is not a number, "<" or ">" a number, or "n.d.".' });
    expect(parseReading("twelve")).toMatchObject({ ok: false, error: expect.stringContaining("is not a number") });
    expect(parseReading("<")).toMatchObject({ ok: false });
    expect(parseReading("")).toEqual({ ok: false, error: "No result given." });
  });

  it("when a present/absent parameter is read, then words map to presence", () => {
    expect(parseReading("crystals", { presence: true })).toEqual({ ok: true, reading: { kind: "presence", present: true } });
    expect(parseReading("none", { presence: true })).toEqual({ ok: true, reading: { kind: "presence", present: false } });
  });
});

describe("lab notation as laboratories write it (common practice in lab reports)", () => {
  const value = (v: number) => ({ ok: true, reading: { kind: "value", value: v } });
  const below = (limit: number | null) => ({ ok: true, reading: { kind: "below", limit } });

  it("when a censored result is written with ≤, <=, ≥ or >=, then it stays censored on the right side", () => {
    expect(parseReading("≤0.5")).toEqual(below(0.5));
    expect(parseReading("<=0,5")).toEqual(below(0.5));
    expect(parseReading("≥ 300")).toEqual({ ok: true, reading: { kind: "above", limit: 300 } });
    expect(parseReading(">=300")).toEqual({ ok: true, reading: { kind: "above", limit: 300 } });
  });

  it("when a laboratory names its reporting limit, or writes not quantified or traces, then the result is below that limit", () => {
    expect(parseReading("< LOQ (0.5)")).toEqual(below(0.5));
    expect(parseReading("<LQ 0,2")).toEqual(below(0.2));
    expect(parseReading("<LQ")).toEqual(below(null));
    expect(parseReading("n.q.", { loq: 0.1 })).toEqual(below(0.1));
    expect(parseReading("tr.")).toEqual(below(null));
  });

  it("when a cell holds the value with its expanded uncertainty, then both are read, the uncertainty with k = 2", () => {
    expect(parseReading("0.82 ± 0.05")).toEqual({
      ok: true,
      reading: { kind: "value", value: 0.82 },
      uncertainty: { kind: "expanded", value: 0.05, k: 2 },
    });
    expect(parseReading("0,82 +/- 0,05")).toMatchObject({ uncertainty: { value: 0.05 } });
    expect(parseReading("<0.5 ± 0.1")).toMatchObject({ ok: false, error: expect.stringContaining("not a censored one") });
  });

  it("when a unit follows the number, then it is taken if it is the expected one and refused if not", () => {
    expect(parseReading("0.82 g/L as acetic acid", { unit: "g/L as acetic acid" })).toMatchObject({
      ok: true,
      reading: { kind: "value", value: 0.82 },
      unit: "g/L as acetic acid",
    });
    expect(parseReading("31 mg/L", { unit: "mg/L" })).toMatchObject({ ok: true, unit: "mg/L" });
    expect(parseReading("31 mg/L", { unit: "g/L" })).toEqual({
      ok: false,
      error: '"31 mg/L" is in mg/L, but this result is expected in g/L; convert it or choose that unit.',
    });
    expect(parseReading("31 furlongs")).toEqual({ ok: false, error: '"31 furlongs": "furlongs" is not a unit Cellarpact knows.' });
  });

  it("when thousands are grouped, then both conventions read, and a number that reads two ways follows the stated format", () => {
    expect(parseReading("1,234.5")).toEqual(value(1234.5));
    expect(parseReading("1.234,5")).toEqual(value(1234.5));
    expect(parseReading("1 234,5")).toEqual(value(1234.5));
    expect(parseReading("12.500.000")).toEqual(value(12500000));
    expect(parseReading("1.234", { numberFormat: "comma" })).toEqual(value(1234));
    expect(parseReading("1.234", { numberFormat: "point" })).toEqual(value(1.234));
    expect(parseReading("1,234", { numberFormat: "point" })).toEqual(value(1234));
    expect(parseReading("1,234", { numberFormat: "comma" })).toEqual(value(1.234));
    // Typed alone, a single mark is a decimal mark; a leading zero never starts a thousands group.
    expect(parseReading("1.012")).toEqual(value(1.012));
    expect(parseReading("0,455", { numberFormat: "point" })).toEqual(value(0.455));
  });

  it("when a result is negative, not finite or written with a Unicode minus, then it is refused with the text named, never read as a pass or a fail", () => {
    expect(parseReading("−0.5")).toEqual({ ok: false, error: '"-0.5": a measured result cannot be negative.' });
    expect(parseReading("-3")).toMatchObject({ ok: false, error: expect.stringContaining("cannot be negative") });
    for (const bad of ["NaN", "Infinity", "-Infinity", "1e999", "0x10", "1/2"]) {
      const r = parseReading(bad);
      expect([bad, r.ok]).toEqual([bad, false]);
      if (!r.ok) expect(r.error).toContain(bad === "1e999" ? "1e999" : bad.replace("−", "-"));
    }
  });

  it("when random lab text is read, then the parser answers and never throws (fast-check)", () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 30 }), (text) => {
        const r = parseReading(text);
        expect(typeof r.ok).toBe("boolean");
        if (r.ok && r.reading.kind === "value") expect(Number.isFinite(r.reading.value) && r.reading.value >= 0).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it("when a plain number is read by the quick path, then the answer is the one the full rules give (fast-check)", () => {
    // A leading space skips the quick path, so both readings of the same text can be compared.
    fc.assert(
      fc.property(
        fc.stringMatching(/^[0-9]{1,6}([.,][0-9]{0,6})?$/),
        fc.constantFrom<"point" | "comma" | undefined>("point", "comma", undefined),
        fc.boolean(),
        (text, numberFormat, presence) => {
          const opts = { ...(numberFormat ? { numberFormat } : {}), presence, unit: "g/L" };
          expect(parseReading(text, opts)).toEqual(parseReading(` ${text}`, opts));
        },
      ),
      { numRuns: 3000 },
    );
  });

  it("when a number is written in either format and read with that format, then it is the number written (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 9_999_999 }),
        fc.integer({ min: 0, max: 999 }),
        fc.constantFrom<"point" | "comma">("point", "comma"),
        (whole, frac, format) => {
          const [dec, th] = format === "point" ? [".", ","] : [",", "."];
          const grouped = whole.toLocaleString("en-US").replaceAll(",", th);
          const text = `${grouped}${dec}${String(frac).padStart(3, "0")}`;
          const r = parseReading(text, { numberFormat: format });
          expect(r).toEqual(value(Number(`${whole}.${String(frac).padStart(3, "0")}`)));
        },
      ),
      { numRuns: 500 },
    );
  });
});
