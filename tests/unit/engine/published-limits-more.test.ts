/**
 * The rules added for organic wine, named-wine derogations, category definitions, the rest of the OIV
 * list and Australia/New Zealand, each checked at its boundary against the source named beside it.
 * Where several rules apply, the strictest governs, so these checks read the strictest stated value.
 */
import { describe, expect, it } from "vitest";
import { applicableLimits, type MarketId, type ParameterId, type WineProfile } from "../../../shared/engine/index.ts";
import { still } from "../../support/wine-profiles.ts";

function governing(market: MarketId, parameter: ParameterId, profile: WineProfile, side: "max" | "min" = "max") {
  const values = applicableLimits([market], profile, { parameter })
    .limits.filter((l) => l.side === side)
    .map((l) => l.statedValue);
  return values.length ? (side === "max" ? Math.min(...values) : Math.max(...values)) : undefined;
}

/** [market, parameter, profile, side, expected governing value, source] */
const ROWS: [MarketId, ParameterId, WineProfile, "max" | "min", number | undefined, string][] = [
  // Organic wine: secondary sources (organic-wines.cz, foodtimes.eu on Reg. 203/2012 carried into 2021/1165): 100 red / 150 white below 2 g/L, otherwise the conventional limit less 30 mg/L.
  ["EU", "total_so2", still("red", { organic: true, sugarGPerL: 1.9 }), "max", 100, "organic red below 2 g/L: 100 mg/L"],
  [
    "EU",
    "total_so2",
    still("red", { organic: true, sugarGPerL: 2 }),
    "max",
    120,
    "organic red at 2 g/L ('lower than 2' excludes 2): 150 − 30",
  ],
  ["EU", "total_so2", still("white", { organic: true, sugarGPerL: 1.9 }), "max", 150, "organic white below 2 g/L: 150 mg/L"],
  ["EU", "total_so2", still("rose", { organic: true, sugarGPerL: 4.9 }), "max", 170, "organic rosé 2–5 g/L: 200 − 30"],
  ["EU", "total_so2", still("red", { organic: true, sugarGPerL: 5 }), "max", 170, "organic red from 5 g/L: 200 − 30"],
  ["EU", "total_so2", still("white", { organic: true, sugarGPerL: 40, euSo2Derogation: 300 }), "max", 270, "organic listed wine: 300 − 30"],
  ["EU", "total_so2", still("white", { organic: true, category: "sparkling" }), "max", 205, "organic sparkling: 235 − 30"],
  ["EU", "total_so2", still("white", { organic: true, category: "quality-sparkling" }), "max", 155, "organic quality sparkling: 185 − 30"],
  ["EU", "total_so2", still("red", { organic: false, sugarGPerL: 1 }), "max", 150, "a wine that is not organic keeps 2019/934 A.1(a)"],
  // Volatile acidity derogations: European Commission, list under point 3 of Part C of Annex I to 2019/934 (February 2020 update).
  ["EU", "volatile_acidity", still("white", { euVaDerogation: 30 }), "max", 30, "German PDO Eiswein/Beerenauslese: 30 meq/L"],
  ["EU", "volatile_acidity", still("white", { euVaDerogation: 35 }), "max", 35, "German PDO Trockenbeerenauslese: 35 meq/L"],
  ["EU", "volatile_acidity", still("white", { euVaDerogation: 25 }), "max", 25, "French listed PDO wines (Barsac…): 25 meq/L"],
  [
    "EU",
    "volatile_acidity",
    still("white", { euVaDerogation: 24.48, alcoholPercentVol: 15.5, sugarGPerL: 50 }),
    "max",
    24.48,
    "French listed PGI wines above 15 % vol and 45 g/L: 24.48 meq/L",
  ],
  [
    "EU",
    "volatile_acidity",
    still("white", { euVaDerogation: 24.48, alcoholPercentVol: 15, sugarGPerL: 50 }),
    "max",
    18,
    "'higher than 15 %' excludes 15: the listed PGI wine keeps point 1",
  ],
  [
    "EU",
    "volatile_acidity",
    still("white", { euVaDerogation: 24.48, alcoholPercentVol: 16, sugarGPerL: 45 }),
    "max",
    18,
    "'more than 45 g/l' excludes 45: point 1",
  ],
  [
    "GB",
    "volatile_acidity",
    still("white", { euVaDerogation: 30 }),
    "max",
    18,
    "the Member States' derogations are not GB law: UK SI 2011/2936 Sch. 2 values",
  ],
  // Additives: 2019/934 Annex I Part A Table 2, values as the OIV sets them (OIV-MA-C1-01; COEI-1-POTSOR).
  ["EU", "citric_acid", still("white"), "max", 1, "citric acid 1 g/L"],
  ["EU", "sorbic_acid", still("white"), "max", 200, "sorbic acid 200 mg/L"],
  // Category definitions: Reg. (EU) 1308/2013 Annex VII Part II (from memory: the act's text was not read).
  ["EU", "alcohol", still("white"), "min", 8.5, "wine: at least 8.5 % vol actual (zones A and B)"],
  ["EU", "alcohol", still("white", { euZonesAB: false }), "min", 9, "wine from other zones: at least 9 % vol actual"],
  ["EU", "alcohol", still("white", { category: "liqueur", sugarGPerL: 80 }), "min", 15, "liqueur wine: actual 15 % vol or more"],
  ["EU", "alcohol", still("white", { category: "liqueur", sugarGPerL: 80 }), "max", 22, "liqueur wine: actual 22 % vol or less"],
  ["EU", "alcohol", still("white", { category: "semi-sparkling" }), "min", 7, "semi-sparkling wine: actual 7 % vol or more"],
  [
    "EU",
    "alcohol",
    still("white", { category: "quality-sparkling", sparklingCategory: "quality-aromatic" }),
    "min",
    6,
    "quality aromatic sparkling wine: actual 6 % vol or more",
  ],
  [
    "EU",
    "alcohol",
    still("white", { category: "quality-sparkling", sparklingCategory: "quality" }),
    "min",
    undefined,
    "quality sparkling (not aromatic): no actual-alcohol minimum in this pack",
  ],
  ["EU", "overpressure", still("white", { category: "sparkling" }), "min", 3, "sparkling wine: not less than 3 bar at 20 °C"],
  ["EU", "overpressure", still("white", { category: "semi-sparkling" }), "min", 1, "semi-sparkling wine: not less than 1 bar"],
  ["EU", "overpressure", still("white", { category: "semi-sparkling" }), "max", 2.5, "semi-sparkling wine: not more than 2.5 bar"],
  // OIV-MA-C1-01 (2019 issue, oiv.int).
  [
    "OIV",
    "total_so2",
    still("white", { sugarGPerL: 60, oivSweetWhiteSo2Exception: true }),
    "max",
    400,
    "'400 mg/L: in exceptional cases some sweet white wines'",
  ],
  [
    "OIV",
    "total_so2",
    still("rose", { sugarGPerL: 60, oivSweetWhiteSo2Exception: true }),
    "max",
    300,
    "the exception names white wines only: rosé keeps 300",
  ],
  [
    "OIV",
    "total_so2",
    still("white", { sugarGPerL: 4, oivSweetWhiteSo2Exception: true }),
    "max",
    200,
    "at 4 g/L a white is not sweet: 200 mg/L",
  ],
  ["OIV", "sulphates", still("red", { oivSulphateCase: "none" }), "max", 1, "sulphates 1 g/L as potassium sulphate"],
  [
    "OIV",
    "sulphates",
    still("red", { oivSulphateCase: "cask-sweetened-or-fortified" }),
    "max",
    1.5,
    "raised to 1.5 g/L for cask-aged ≥ 2 years, sweetened, fortified wines",
  ],
  [
    "OIV",
    "sulphates",
    still("red", { oivSulphateCase: "concentrated-must-or-naturally-sweet" }),
    "max",
    2,
    "raised to 2 g/L for added concentrated must, naturally sweet wines (value from memory: cut off in the copy read)",
  ],
  ["OIV", "fluoride", still("white", { cryoliteTreatedVineyard: false }), "max", 1, "fluoride 1 mg/L (OENO 8/91)"],
  ["OIV", "fluoride", still("white", { cryoliteTreatedVineyard: true }), "max", 3, "fluoride 3 mg/L after cryolite treatment"],
  ["OIV", "silver", still("white"), "max", 0.1, "silver < 0.1 mg/L"],
  ["OIV", "diethylene_glycol", still("white"), "max", 10, "diethylene glycol 10 mg/L"],
  ["OIV", "ethylene_glycol", still("white"), "max", 10, "ethanediol 10 mg/L"],
  ["OIV", "malvidin_diglucoside", still("red"), "max", 15, "malvidol diglucoside 15 mg/L"],
  ["OIV", "propylene_glycol", still("white"), "max", 150, "propylene glycol, still wines 150 mg/L (OENO 20/2003)"],
  ["OIV", "propylene_glycol", still("white", { category: "sparkling" }), "max", 300, "propylene glycol, sparkling wines 300 mg/L"],
  // Wine Australia, 'Know your sulphite limits' (Food Standards Code Standard 4.5.1).
  [
    "AU-NZ",
    "total_so2",
    still("red", { sugarGPerL: 35 }),
    "max",
    250,
    "under 35 g/L residual sugar: 250 mg/L (35 itself read as not 'higher than 35')",
  ],
  [
    "AU-NZ",
    "total_so2",
    still("white", { sugarGPerL: 35.1, category: "liqueur" }),
    "max",
    300,
    "higher than 35 g/L, fortified wine included: 300 mg/L",
  ],
];

describe("added rules against their published sources", () => {
  it.each(ROWS)("%s %s for %j, %s, governs at %s (%s)", (market, parameter, profile, side, expected) => {
    expect(governing(market, parameter, profile, side)).toBe(expected);
  });
});

describe("conditions the law sets, and facts it needs", () => {
  it("when a wine does not say whether it is organic, then the organic SO2 limit is undetermined and names the fact", () => {
    const { undetermined } = applicableLimits(["EU"], still("red", { sugarGPerL: 1 }), { parameter: "total_so2" });
    expect(undetermined.map((u) => [u.ruleId, u.missing])).toEqual([["eu-organic-so2-red-below-2", ["organic"]]]);
  });

  it("when a sweet wine bears a derogation name but its sugar is below 5 g/L, then the general dry limit governs (2019/934 Annex I Part B A.2, opening words)", () => {
    expect(governing("EU", "total_so2", still("white", { euSo2Derogation: 400, sugarGPerL: 3 }))).toBe(200);
  });

  it("when a listed PGI wine's alcohol is unknown, then both its derogation and point 1 are undetermined, never guessed", () => {
    const { limits, undetermined } = applicableLimits(
      ["EU"],
      { colour: "white", category: "still", sugarGPerL: 60, euVaDerogation: 24.48 },
      { parameter: "volatile_acidity" },
    );
    expect(limits).toEqual([]);
    expect(undetermined.map((u) => u.missing)).toEqual([["alcoholPercentVol"], ["alcoholPercentVol"]]);
  });

  it("when the OIV sulphate case is not given, then every sulphate rule is undetermined", () => {
    const { limits, undetermined } = applicableLimits(["OIV"], still("red"), { parameter: "sulphates" });
    expect(limits).toEqual([]);
    expect(new Set(undetermined.flatMap((u) => u.missing))).toEqual(new Set(["oivSulphateCase"]));
  });

  it("when a quality sparkling wine's kind is not given, then the aromatic-type alcohol minimum is undetermined", () => {
    const { undetermined } = applicableLimits(["EU"], still("white", { category: "quality-sparkling" }), { parameter: "alcohol" });
    expect(undetermined.map((u) => u.ruleId)).toEqual(["eu-alcohol-aromatic-min"]);
  });
});
