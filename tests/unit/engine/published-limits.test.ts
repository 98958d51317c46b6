/**
 * Every legal limit in the market packs, checked row by row against the value in its published
 * source, including the boundaries the texts word as "more than", "not less than" or "at least".
 */
import { describe, expect, it } from "vitest";
import {
  applicableLimits,
  citationConfirmed,
  MARKET_PACKS,
  euSparklingSugarTerms,
  euStillSugarTerms,
  sulphiteStatement,
  usAlcoholLabelCheck,
  usTaxClass,
  type MarketId,
  type ParameterId,
  type WineProfile,
} from "../../../shared/engine/index.ts";
import { still } from "../../support/wine-profiles.ts";

/** [market, parameter, profile, expected value as the law states it, source] */
const ROWS: [MarketId, ParameterId, WineProfile, number, string][] = [
  ["EU", "total_so2", still("red"), 150, "Reg. (EU) 2019/934 Annex I Part B A.1(a): red, sugar < 5 g/L"],
  ["EU", "total_so2", still("white"), 200, "Reg. (EU) 2019/934 Annex I Part B A.1(b): white, sugar < 5 g/L"],
  ["EU", "total_so2", still("rose"), 200, "Reg. (EU) 2019/934 Annex I Part B A.1(b): rosé, sugar < 5 g/L"],
  [
    "EU",
    "total_so2",
    still("red", { sugarGPerL: 5 }),
    200,
    "Reg. (EU) 2019/934 A.2(a): red, sugar 'not less than five grams per litre' (5 included)",
  ],
  ["EU", "total_so2", still("white", { sugarGPerL: 5 }), 250, "Reg. (EU) 2019/934 A.2(b): white, sugar not less than 5 g/L"],
  ["EU", "total_so2", still("rose", { sugarGPerL: 30 }), 250, "Reg. (EU) 2019/934 A.2(b): rosé, sugar not less than 5 g/L"],
  [
    "EU",
    "total_so2",
    still("white", { euSo2Derogation: 300, sugarGPerL: 40 }),
    300,
    "Reg. (EU) 2019/934 A.2(c): listed wines, e.g. Spätlese, with sugar not less than 5 g/L",
  ],
  [
    "EU",
    "total_so2",
    still("white", { euSo2Derogation: 300, sugarGPerL: 5 }),
    300,
    "Reg. (EU) 2019/934 Annex I Part B A.2, opening words: 'not less than five grams per litre' (5 included)",
  ],
  [
    "EU",
    "total_so2",
    still("white", { euSo2Derogation: 300, sugarGPerL: 4.9 }),
    200,
    "Reg. (EU) 2019/934 A.2 applies only from 5 g/L: a dry listed wine keeps A.1(b) (legislation.gov.uk copy)",
  ],
  [
    "EU",
    "total_so2",
    still("white", { euSo2Derogation: 350, sugarGPerL: 80 }),
    350,
    "KVNW summary of 2019/934: listed wines, e.g. Auslese",
  ],
  [
    "EU",
    "total_so2",
    still("white", { euSo2Derogation: 400, sugarGPerL: 120 }),
    400,
    "KVNW summary of 2019/934: Beerenauslese, Eiswein, Sauternes…",
  ],
  ["EU", "total_so2", still("white", { category: "sparkling" }), 235, "KVNW summary of 2019/934: sparkling wine"],
  ["EU", "total_so2", still("red", { category: "quality-sparkling" }), 185, "KVNW summary of 2019/934: quality sparkling wine"],
  ["EU", "total_so2", still("red", { category: "liqueur", sugarGPerL: 4.9 }), 150, "KVNW summary of 2019/934: liqueur wine, sugar < 5 g/L"],
  ["EU", "total_so2", still("red", { category: "liqueur", sugarGPerL: 5 }), 200, "KVNW summary of 2019/934: liqueur wine, sugar ≥ 5 g/L"],
  ["EU", "volatile_acidity", still("white"), 18, "UK SI 2011/2936 Sch. 2 para 3 repeating the EU rule: white 18 meq/L"],
  ["EU", "volatile_acidity", still("rose"), 18, "UK SI 2011/2936 Sch. 2 para 3 repeating the EU rule: rosé 18 meq/L"],
  ["EU", "volatile_acidity", still("red"), 20, "UK SI 2011/2936 Sch. 2 para 3 repeating the EU rule: red 20 meq/L"],
  ["EU", "total_acidity", still("red"), 3.5, "Reg. (EU) 1308/2013 Annex VII Part II point 1: at least 3.5 g/L as tartaric acid"],
  ["EU", "lead", still("red", { harvestYear: 2001 }), 0.2, "Reg. (EU) 2021/1317 (Federvini note): 2001–2015 harvests 0.20 mg/kg"],
  ["EU", "lead", still("red", { harvestYear: 2015 }), 0.2, "Reg. (EU) 2021/1317: 2015 is the last year of the 0.20 band"],
  ["EU", "lead", still("red", { harvestYear: 2016 }), 0.15, "Reg. (EU) 2021/1317: 2016–2021 harvests 0.15 mg/kg"],
  ["EU", "lead", still("red", { harvestYear: 2021 }), 0.15, "Reg. (EU) 2021/1317: 2021 is the last year of the 0.15 band"],
  ["EU", "lead", still("red", { harvestYear: 2022 }), 0.1, "Reg. (EU) 2021/1317: from the 2022 harvest 0.10 mg/kg"],
  ["EU", "lead", still("red", { harvestYear: 2022, category: "liqueur" }), 0.15, "Reg. (EU) 2021/1317: liqueur wine from 2022, 0.15 mg/kg"],
  [
    "EU",
    "ochratoxin_a",
    still("red", { harvestYear: 2005, alcoholPercentVol: 14.9 }),
    2.0,
    "Reg. (EC) 123/2005 Annex 2.2.4: 2.0 µg/kg from the 2005 harvest",
  ],
  ["US", "volatile_acidity", still("red"), 0.14, "27 CFR 4.21(a)(1)(iv): natural red wine 0.14 g/100 mL"],
  ["US", "volatile_acidity", still("white"), 0.12, "27 CFR 4.21(a)(1)(iv): other grape wine 0.12 g/100 mL"],
  [
    "US",
    "volatile_acidity",
    still("red", { usHighBrixJuice: true }),
    0.17,
    "27 CFR 4.21(a)(1)(iv): red from juice of 28 °Brix or more, 0.17 g/100 mL",
  ],
  [
    "US",
    "volatile_acidity",
    still("white", { usHighBrixJuice: true }),
    0.15,
    "27 CFR 4.21(a)(1)(iv): white from juice of 28 °Brix or more, 0.15 g/100 mL",
  ],
  ["US", "total_so2", still("white"), 350, "27 CFR 4.22(b)(1): not more than 350 ppm total SO2"],
  [
    "US",
    "carbon_dioxide",
    still("white"),
    0.401,
    "27 CFR 24.245 (values as in the identical 26.222(a) text): 0.392 g/100 mL + 0.009 tolerance",
  ],
  ["OIV", "volatile_acidity", still("white"), 20, "OIV-MA-C1-01 (2019): volatile acidity 20 meq/L"],
  ["OIV", "citric_acid", still("white"), 1, "OIV-MA-C1-01 (2019): citric acid 1 g/L"],
  ["OIV", "arsenic", still("white"), 0.2, "OIV-MA-C1-01 (2019 issue, oiv.int): arsenic 0.2 mg/L"],
  ["OIV", "boron", still("red"), 80, "OIV-MA-C1-01 (2019 issue): boron 80 mg/L expressed as boric acid"],
  ["OIV", "bromine", still("white"), 1, "OIV-MA-C1-01 (2019 issue): bromine 1 mg/L"],
  ["OIV", "cadmium", still("rose"), 0.01, "OIV-MA-C1-01 (2019 issue): cadmium 0.01 mg/L"],
  ["OIV", "excess_sodium", still("red"), 80, "OIV-MA-C1-01 (2019 issue), OENO 09/2007: excess sodium 80 mg/L"],
  ["OIV", "copper", still("white"), 1, "OIV-MA-C1-01 (2019), OENO 434-2011: copper 1 mg/L"],
  [
    "OIV",
    "copper",
    still("white", { category: "liqueur", liqueurFromUnfermentedMust: true }),
    2,
    "OIV-MA-C1-01 (2019): copper 2 mg/L for liqueur wines from unfermented or slightly fermented must",
  ],
  [
    "OIV",
    "copper",
    still("white", { category: "liqueur", liqueurFromUnfermentedMust: false }),
    1,
    "OIV-MA-C1-01 (2019): any other liqueur wine keeps copper 1 mg/L",
  ],
  ["OIV", "lead", still("red", { harvestYear: 2019 }), 0.1, "OIV-OENO 638-2019: lead 0.10 mg/L from the 2019 harvest"],
  ["OIV", "lead", still("red", { harvestYear: 2018 }), 0.15, "OIV-MA-C1-01: 0.15 mg/L for the 2006–2018 harvests"],
  ["OIV", "lead", still("red", { harvestYear: 2019, category: "liqueur" }), 0.15, "OIV-OENO 638-2019: liqueur wine 0.15 mg/L"],
  ["OIV", "ochratoxin_a", still("red"), 2, "OIV-MA-C1-01 (CST 1/2002): ochratoxin A 2 µg/L"],
  ["OIV", "methanol", still("red"), 400, "OIV-MA-C1-01 (OENO 19/2004): methanol 400 mg/L red"],
  ["OIV", "methanol", still("rose"), 250, "OIV-MA-C1-01 (OENO 19/2004): methanol 250 mg/L white and rosé"],
  ["OIV", "total_so2", still("red", { sugarGPerL: 4 }), 150, "OIV-MA-C1-01: red with at most 4 g/L reducing substances, 150 mg/L"],
  ["OIV", "total_so2", still("white", { sugarGPerL: 4 }), 200, "OIV-MA-C1-01: white/rosé with at most 4 g/L reducing substances, 200 mg/L"],
  ["OIV", "total_so2", still("red", { sugarGPerL: 4.1 }), 300, "OIV-MA-C1-01: more than 4 g/L reducing substances, 300 mg/L"],
  ["OIV", "sorbic_acid", still("white"), 200, "OIV Codex COEI-1-POTSOR (2000): 200 mg/L as sorbic acid"],
  ["UK-QWS", "free_so2", still("white", { sugarGPerL: 4, protectedOrigin: "pdo" }), 45, "UK SI 2011/2936 Sch. 2: free SO2 45 mg/L, dry"],
  ["UK-QWS", "free_so2", still("white", { sugarGPerL: 12, protectedOrigin: "pgi" }), 60, "UK SI 2011/2936 Sch. 2: free SO2 60 mg/L, other"],
  ["UK-QWS", "copper", still("white", { protectedOrigin: "pdo" }), 0.5, "UK SI 2011/2936 Sch. 2: copper 0.5 mg/L"],
  ["UK-QWS", "iron", still("white", { protectedOrigin: "pdo" }), 8, "UK SI 2011/2936 Sch. 2: iron 8 mg/L"],
  [
    "UK-QWS",
    "total_acidity",
    still("white", { protectedOrigin: "pdo" }),
    4,
    "UK SI 2011/2936 Sch. 2: total acidity at least 4 g/L as tartaric acid",
  ],
  ["UK-QWS", "alcohol", still("white", { protectedOrigin: "pdo" }), 9, "UK SI 2011/2936 Sch. 2: total alcohol at least 9 % vol"],
  ["CN", "sugar_free_extract", still("white"), 16, "Vintessential quoting Wine Australia: white ≥ 16 g/L"],
  ["CN", "sugar_free_extract", still("rose"), 17, "Vintessential quoting Wine Australia: rosé ≥ 17 g/L"],
  ["CN", "sugar_free_extract", still("red"), 18, "Vintessential quoting Wine Australia: red ≥ 18 g/L"],
  ["CA-ON", "turbidity", still("white", { filtered: true }), 5, "AWRI pre-bottling specifications (LCBO): white 5 NTU"],
  ["CA-ON", "turbidity", still("rose", { filtered: true }), 8, "AWRI pre-bottling specifications (LCBO): rosé 8 NTU"],
  ["CA-ON", "turbidity", still("red", { filtered: true }), 10, "AWRI pre-bottling specifications (LCBO): red 10 NTU"],
];

describe("market pack values against their published sources", () => {
  it.each(ROWS)("%s %s for %j is %d (%s)", (market, parameter, profile, expected) => {
    const { limits } = applicableLimits([market], profile, { parameter });
    expect(limits.map((l) => l.statedValue)).toEqual([expected]);
  });

  it("when a wine has 15 % vol, then the EU ochratoxin A limit does not apply (Reg. (EC) 123/2005 footnote: wines below 15 % vol)", () => {
    expect(applicableLimits(["EU"], still("red", { alcoholPercentVol: 15 }), { parameter: "ochratoxin_a" }).limits).toEqual([]);
  });

  it("when a harvest predates 2005, then no ochratoxin A limit applies (Reg. (EC) 123/2005: from the 2005 harvest)", () => {
    expect(applicableLimits(["EU", "OIV"], still("red", { harvestYear: 2004 }), { parameter: "ochratoxin_a" }).limits).toEqual([]);
  });
});

describe("labelling boundaries worded 'more than', 'at least', 'not over'", () => {
  it("when total SO2 is 10.0 mg/L, then the EU 'more than 10 mg/L' does not trigger and the US '10 or more' does", () => {
    expect(sulphiteStatement("EU", { kind: "value", value: 10 }).required).toBe(false); // Reg. (EU) 1169/2011 Annex II item 12
    expect(sulphiteStatement("US", { kind: "value", value: 10 }).required).toBe(true); // 27 CFR 4.32(e)
    expect(sulphiteStatement("US", { kind: "value", value: 9.9 }).required).toBe(false);
  });

  it("when sugar is exactly 4 g/L, then 'dry' (at most 4); 4.1 g/L without acidity is 'medium dry' (2019/33 Annex III Part B)", () => {
    expect(euStillSugarTerms(4).fits).toEqual(["dry"]);
    expect(euStillSugarTerms(4.1).fits).toEqual(["medium dry"]);
    expect(euStillSugarTerms(12).fits).toEqual(["medium dry"]);
    expect(euStillSugarTerms(12.1).fits).toEqual(["medium sweet"]);
  });

  it("when sparkling wine sits on a band edge, then the inclusive/exclusive wording of 2019/33 Annex III Part A holds", () => {
    expect(euSparklingSugarTerms(3).fits).not.toContain("brut nature"); // "less than 3"
    expect(euSparklingSugarTerms(11.9).fits).toContain("brut"); // "less than 12"
    expect(euSparklingSugarTerms(12).fits).not.toContain("brut");
    expect(euSparklingSugarTerms(17).fits).toEqual(["extra dry", "dry"]); // 12–17 and 17–32 touch at 17
    expect(euSparklingSugarTerms(50).fits).toEqual(["demi-sec"]); // "more than 50" for doux
  });

  it("when a US label states exactly 14 %, then the 1.5-point tolerance applies; above 14 % it is 1.0 (27 CFR 4.36)", () => {
    expect(usAlcoholLabelCheck(14, 12.5).tolerance).toBe(1.5);
    expect(usAlcoholLabelCheck(14.5, 14).tolerance).toBe(1);
  });

  it("when alcohol is exactly 16 %, then the still-wine class is 'not over 16%' (26 U.S.C. 5041(b))", () => {
    expect(usTaxClass(16)).toBe("not over 16%");
    expect(usTaxClass(16.01)).toBe("over 16% to 21%");
  });
});

describe("citations people can check", () => {
  it("when any rule of any pack is cited, then its citation never says 'from memory'; an unconfirmed one says why in its confirmation note", () => {
    for (const pack of Object.values(MARKET_PACKS)) {
      for (const rule of pack.rules) {
        const text = `${rule.citation.document} ${rule.citation.article} ${rule.citation.edition}`;
        expect([rule.id, /from memory/i.test(text)]).toEqual([rule.id, false]);
        expect([rule.id, citationConfirmed(rule.confirmed) || rule.confirmed.length > 20]).toEqual([rule.id, true]);
      }
    }
  });

  it("when a contaminant limit is cited, then it names the regulation in force, EU 2023/915, not a repealed act", () => {
    for (const rule of MARKET_PACKS.EU.rules.filter((r) => r.parameter === "lead" || r.parameter === "ochratoxin_a")) {
      expect([rule.id, rule.citation.document]).toEqual([rule.id, "Commission Regulation (EU) 2023/915"]);
    }
  });
});
