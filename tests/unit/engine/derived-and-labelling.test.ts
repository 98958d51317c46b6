import { describe, expect, it } from "vitest";
import {
  quantity,
  boundSo2,
  fixedAcidity,
  freeSo2ForMolecular,
  molecularSo2,
  reducedExtract,
  sugarFreeExtract,
  euAlcoholLabelCheck,
  euSparklingSugarTerms,
  euStillSugarTerms,
  sulphiteStatement,
  usAlcoholLabelCheck,
} from "../../../shared/engine/index.ts";

const mg = (x: number) => quantity(x, "mg/L");
const g = (x: number) => quantity(x, "g/L");

describe("SO2", () => {
  it("when free SO2 is 40 mg/L at pH 3.5, then molecular SO2 is 0.80 mg/L with pKa 1.81 (Wine Business free-SO2 table: pH 3.5 needs 40 mg/L for 0.8 molecular)", () => {
    expect(molecularSo2(mg(40), quantity(3.5, "pH"))).toBeCloseTo(0.8, 2);
    expect(freeSo2ForMolecular(mg(0.8), quantity(3.5, "pH"))).toBeCloseTo(40, 0);
  });

  it("when the pKa is set to 1.77 (Monash Scientific page, K = 10^-1.77), then less of the free SO2 is molecular and 0.8 mg/L needs about 44 mg/L at pH 3.5", () => {
    expect(molecularSo2(mg(40), quantity(3.5, "pH"), 1.77)).toBeLessThan(molecularSo2(mg(40), quantity(3.5, "pH")));
    expect(freeSo2ForMolecular(mg(0.8), quantity(3.5, "pH"), 1.77)).toBeCloseTo(43.8, 1);
  });

  it("when free exceeds total, then bound SO2 is refused; otherwise it is total − free", () => {
    expect(boundSo2(mg(120), mg(30))).toBe(90);
    expect(() => boundSo2(mg(20), mg(30))).toThrow(RangeError);
  });
});

describe("extract and acidity (OIV-MA-AS2-03B, OIV-MA-AS313-03 definitions)", () => {
  it("when sugars are 3 g/L in 25 g/L of extract, then sugar-free extract subtracts all of them and reduced extract only those above 1 g/L", () => {
    expect(sugarFreeExtract(g(25), g(3))).toBe(22);
    expect(reducedExtract(g(25), g(3))).toBe(23);
    expect(reducedExtract(g(25), g(0.6))).toBe(25);
    expect(reducedExtract(g(25), g(3), { potassiumSulphate: g(1.4), mannitol: g(0.5) })).toBeCloseTo(22.1, 10);
  });

  it("when volatile acidity is subtracted from total acidity in meq/L, then fixed acidity remains", () => {
    expect(fixedAcidity(quantity(80, "meq/L"), quantity(10, "meq/L"))).toBe(70);
  });
});

describe("EU sugar terms (Delegated Reg. (EU) 2019/33 Annex III; OIV labelling standard 3.1.6)", () => {
  it("when sugar is at most 4 g/L, or 9 g/L with acidity not more than 2 g/L below it, then the wine is dry", () => {
    expect(euStillSugarTerms(4).fits).toEqual(["dry"]);
    expect(euStillSugarTerms(9, 7).fits).toEqual(["dry"]); // "9 g/l bei zumindest 7 g/l Säure"
    expect(euStillSugarTerms(9, 6.9).fits).toEqual(["medium dry"]);
  });

  it("when sugar is 18 g/L with 8 g/L acidity, then medium dry; 19 g/L is medium sweet", () => {
    expect(euStillSugarTerms(18, 8).fits).toEqual(["medium dry"]);
    expect(euStillSugarTerms(19, 8).fits).toEqual(["medium sweet"]);
  });

  it("when sugar is exactly 45 g/L, then both 'medium sweet' and 'sweet' fit and the note says why", () => {
    const r = euStillSugarTerms(45);
    expect(r.fits).toEqual(["medium sweet", "sweet"]);
    expect(r.note).toMatch(/both/);
    expect(euStillSugarTerms(46).fits).toEqual(["sweet"]);
  });

  it("when a sparkling wine has 2, 12, 33 or 51 g/L, then the Part A terms follow", () => {
    expect(euSparklingSugarTerms(2).fits).toEqual(["brut nature", "extra brut", "brut"]);
    expect(euSparklingSugarTerms(12).fits).toEqual(["extra dry"]);
    expect(euSparklingSugarTerms(33).fits).toEqual(["demi-sec"]);
    expect(euSparklingSugarTerms(51).fits).toEqual(["doux"]);
  });
});

describe("alcohol labelling tolerances", () => {
  it("when an EU still wine is labelled 12.5 % vol, then 12.0–13.0 passes (Reg. (EC) 607/2009 Art. 54(1): ±0.5 % vol)", () => {
    expect(euAlcoholLabelCheck(12.5, 12.9, "still").withinTolerance).toBe(true);
    expect(euAlcoholLabelCheck(12.5, 13.1, "still").withinTolerance).toBe(false);
    expect(euAlcoholLabelCheck(12.5, 13.25, "sparkling").withinTolerance).toBe(true); // ±0.8 for sparkling
    expect(euAlcoholLabelCheck(12.3, 12.3, "still").problems[0]).toMatch(/whole or half units/);
  });

  it("when a US label says 12 % or 18 %, then 10.5–13.5 and 17–19 pass (TTB bulletin on 27 CFR 4.36)", () => {
    expect(usAlcoholLabelCheck(12, 10.5).withinTolerance).toBe(true);
    expect(usAlcoholLabelCheck(12, 13.6).withinTolerance).toBe(false);
    expect(usAlcoholLabelCheck(18, 17).allowed).toEqual({ min: 17, max: 19 });
  });

  it("when a US wine labelled 15.5 % contains 16.5 %, then the tax class rule fails it despite the tolerance (TTB bulletin example)", () => {
    const r = usAlcoholLabelCheck(15.5, 16.5);
    expect(r.withinTolerance).toBe(false);
    expect(r.problems.join(" ")).toMatch(/tax class/);
  });
});

describe("sulphite statement trigger", () => {
  it("when total SO2 is exactly 10 mg/L, then the EU does not require it ('more than 10', Reg. 1169/2011 Annex II) but the US does ('10 or more', 27 CFR 4.32(e))", () => {
    expect(sulphiteStatement("EU", { kind: "value", value: 10 }).required).toBe(false);
    expect(sulphiteStatement("US", { kind: "value", value: 10 }).required).toBe(true);
    expect(sulphiteStatement("EU", { kind: "value", value: 10.5 }).required).toBe(true);
  });

  it("when total SO2 is censored, then below 8 is not required and n.d. without a limit is undetermined", () => {
    expect(sulphiteStatement("US", { kind: "below", limit: 8 }).required).toBe(false);
    expect(sulphiteStatement("EU", { kind: "below", limit: null }).required).toBe("undetermined");
  });
});
