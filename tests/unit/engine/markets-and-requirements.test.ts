import { describe, expect, it } from "vitest";
import {
  applicableLimits,
  MARKET_PACKS,
  buildRequirement,
  validateBuyerRequirement,
  RequirementError,
  PARAMETERS,
  type WineProfile,
} from "../../../shared/engine/index.ts";

const redDry: WineProfile = { colour: "red", category: "still", sugarGPerL: 2, harvestYear: 2023, alcoholPercentVol: 13.5 };
const whiteOffDry: WineProfile = { colour: "white", category: "still", sugarGPerL: 6, harvestYear: 2024, alcoholPercentVol: 11.5 };
const only = (
  market: "EU" | "GB" | "US" | "OIV" | "UK-QWS" | "CN" | "CA-ON",
  p: WineProfile,
  parameter: (typeof PARAMETERS)[number]["id"],
) => applicableLimits([market], p, { parameter }).limits;

describe("catalogue", () => {
  it("when the catalogue is listed, then it has at least 30 parameters, each with canonical unit among its accepted units", () => {
    expect(PARAMETERS.length).toBeGreaterThanOrEqual(30);
    for (const p of PARAMETERS) expect(p.units as readonly string[]).toContain(p.unit);
    expect(new Set(PARAMETERS.map((p) => p.id)).size).toBe(PARAMETERS.length);
  });

  it("when a pack is listed, then every rule carries a citation and a confirmation note", () => {
    for (const pack of Object.values(MARKET_PACKS)) {
      expect(pack.version).toMatch(/\d/);
      for (const rule of pack.rules) {
        expect(rule.citation.document.length, rule.id).toBeGreaterThan(3);
        expect(rule.citation.article.length, rule.id).toBeGreaterThan(1);
        expect(rule.confirmed.length, rule.id).toBeGreaterThan(3);
      }
    }
  });
});

describe("EU total SO2 (Delegated Reg. (EU) 2019/934 Annex I Part B section A)", () => {
  it("when a red still wine has 2 g/L sugar, then 150 mg/L applies under point A.1(a)", () => {
    const [l] = only("EU", redDry, "total_so2");
    expect(l).toMatchObject({ value: 150, side: "max" });
    expect(l!.citation.article).toMatch(/A\.1\(a\)/);
  });

  it("when sugar is exactly 5 g/L ('not less than five grams per litre'), then the higher band applies: 200 red, 250 white", () => {
    expect(only("EU", { ...redDry, sugarGPerL: 5 }, "total_so2")[0]!.value).toBe(200);
    expect(only("EU", { ...whiteOffDry, sugarGPerL: 5 }, "total_so2")[0]!.value).toBe(250);
    expect(only("EU", { ...whiteOffDry, sugarGPerL: 4.9 }, "total_so2")[0]!.value).toBe(200);
  });

  it("when the wine is sparkling, quality sparkling or listed for a derogation, then 235, 185 or the listed value (KVNW summary of 2019/934)", () => {
    expect(only("EU", { ...redDry, category: "sparkling" }, "total_so2").map((l) => l.value)).toEqual([235]);
    expect(only("EU", { ...redDry, category: "quality-sparkling" }, "total_so2").map((l) => l.value)).toEqual([185]);
    expect(only("EU", { ...whiteOffDry, euSo2Derogation: 400 }, "total_so2").map((l) => l.value)).toEqual([400]);
  });

  it("when sugar is unknown, then the SO2 limit is undetermined and says what is missing", () => {
    const r = applicableLimits(["EU"], { colour: "red", category: "still" }, { parameter: "total_so2" });
    expect(r.limits).toEqual([]);
    expect(r.undetermined[0]!.missing).toEqual(["sugarGPerL"]);
  });
});

describe("other EU, US, OIV and scheme limits", () => {
  it("when lead is checked by harvest year, then 0.20 / 0.15 / 0.10 mg/kg (Reg. (EU) 2021/1317 as summarised by Federvini)", () => {
    expect(only("EU", { ...redDry, harvestYear: 2010 }, "lead")[0]!.statedValue).toBe(0.2);
    expect(only("EU", { ...redDry, harvestYear: 2018 }, "lead")[0]!.statedValue).toBe(0.15);
    expect(only("EU", { ...redDry, harvestYear: 2022 }, "lead")[0]!.statedValue).toBe(0.1);
    expect(
      applicableLimits(["EU"], { ...redDry, harvestYear: 2022 }, { parameter: "lead", densityGPerMl: 0.994 }).limits[0]!.value,
    ).toBeCloseTo(0.0994, 6);
  });

  it("when volatile acidity is checked in the US, then 0.14 g/100 mL red and 0.12 white, as acetic acid (27 CFR 4.21(a)(1)(iv))", () => {
    const red = only("US", redDry, "volatile_acidity")[0]!;
    expect(red.statedValue).toBe(0.14);
    expect(red.value).toBeCloseTo(23.31, 2); // meq/L
    expect(only("US", whiteOffDry, "volatile_acidity")[0]!.statedValue).toBe(0.12);
  });

  it("when a wine is outside 7–24 % vol, then 27 CFR part 4's limits do not apply; at 7 and 24 they do (27 CFR 4.6: 'not less than 7 percent and not more than 24 percent')", () => {
    for (const [abv, applies] of [
      [6.9, false],
      [7, true],
      [24, true],
      [24.1, false],
    ] as const) {
      expect([abv, only("US", { ...redDry, alcoholPercentVol: abv }, "volatile_acidity").length > 0]).toEqual([abv, applies]);
      expect([abv, only("US", { ...redDry, alcoholPercentVol: abv }, "total_so2").length > 0]).toEqual([abv, applies]);
    }
    // Without an alcoholic strength the scope cannot be decided: the rule is undetermined, not applied.
    const { alcoholPercentVol: _a, ...noAbv } = redDry;
    expect(applicableLimits(["US"], noAbv, { parameter: "total_so2" }).undetermined[0]!.missing).toEqual(["alcoholPercentVol"]);
  });

  it("when wine is placed on the market in Great Britain, then the retained 2019/934 limits apply, cited as retained (legislation.gov.uk revised text, Annex I Part B A.1 and A.2)", () => {
    expect(only("GB", redDry, "total_so2").map((l) => l.value)).toEqual([150]);
    expect(only("GB", { ...whiteOffDry, sugarGPerL: 5 }, "total_so2").map((l) => l.value)).toEqual([250]);
    expect(only("GB", { ...whiteOffDry, sugarGPerL: 60, euSo2Derogation: 300 }, "total_so2").map((l) => l.value)).toEqual([300]);
    const so2 = only("GB", redDry, "total_so2")[0]!;
    expect(so2.citation.document).toBe("Commission Delegated Regulation (EU) 2019/934 as retained in the law of Great Britain");
    expect(so2.confirmed).toMatch(/^read in the source/);
    expect(only("GB", redDry, "volatile_acidity").map((l) => l.value)).toEqual([20]);
    // Contaminant limits are not in the GB pack yet (GB did not take over Reg. (EU) 2023/915).
    expect(only("GB", redDry, "lead")).toEqual([]);
  });

  it("when CO2 in a US still wine is checked, then 0.392 + 0.009 g/100 mL, cited to 27 CFR 24.245 (26.222 covers Puerto Rico and the Virgin Islands only)", () => {
    const co2 = only("US", redDry, "carbon_dioxide")[0]!;
    expect(co2.value).toBeCloseTo(4.01, 10);
    expect(co2.citation.article).toMatch(/^§ 24\.245/);
  });

  it("when OIV limits apply, then methanol 400 red / 250 white and lead 0.10 mg/L from the 2019 harvest (OIV-MA-C1-01, 2019 issue)", () => {
    expect(only("OIV", redDry, "methanol")[0]!.value).toBe(400);
    expect(only("OIV", whiteOffDry, "methanol")[0]!.value).toBe(250);
    expect(only("OIV", redDry, "lead")[0]!.value).toBe(0.1);
    expect(only("OIV", { ...redDry, harvestYear: 2015 }, "lead")[0]!.value).toBe(0.15);
  });

  it("when a protected-origin wine made in England and Wales is checked, then free SO2 45 dry / 60 other, copper 0.5, iron 8 (The Wine Regulations 2011, SI 2011/2936 Sch. 2)", () => {
    const pdo = { protectedOrigin: "pdo" as const };
    expect(only("UK-QWS", { ...redDry, ...pdo }, "free_so2")[0]!.value).toBe(45);
    expect(only("UK-QWS", { ...whiteOffDry, ...pdo }, "free_so2")[0]!.value).toBe(60);
    expect(only("UK-QWS", { ...redDry, ...pdo }, "copper")[0]!.value).toBe(0.5);
    expect(only("UK-QWS", { ...redDry, ...pdo }, "iron")[0]!.value).toBe(8);
  });

  it("when a rule needs a fact the wine's profile lacks, then the warning names the fact in words", () => {
    const r = buildRequirement({ parameter: "copper", unit: "mg/L", upper: 1, rule: { kind: "simple" } }, ["UK-QWS"], redDry);
    expect(r.issues.map((w) => w.message).join(" ")).toContain(
      "it needs the wine's PDO or PGI status. State it on the contract to decide.",
    );
  });

  it("when a wine has no protected origin, or its origin is not known, then the scheme's limits do not apply, or are undetermined with the missing fact named", () => {
    expect(only("UK-QWS", { ...redDry, protectedOrigin: "none" }, "copper")).toEqual([]);
    const { undetermined } = applicableLimits(["UK-QWS"], redDry, { parameter: "copper" });
    expect(undetermined.map((u) => u.missing)).toEqual([["protectedOrigin"]]);
  });

  it("when wine goes to China or Ontario, then sugar-free extract minima and turbidity maxima by colour (Vintessential/Wine Australia; AWRI)", () => {
    expect(only("CN", redDry, "sugar_free_extract")[0]).toMatchObject({ side: "min", value: 18 });
    expect(only("CN", { ...redDry, colour: "rose" }, "sugar_free_extract")[0]!.value).toBe(17);
    expect(only("CA-ON", { ...whiteOffDry, filtered: true }, "turbidity")[0]!.value).toBe(5);
    // Unfiltered wines are exempt from the turbidity maxima; an unknown filtration leaves the rule undetermined.
    expect(only("CA-ON", { ...whiteOffDry, filtered: false }, "turbidity")).toEqual([]);
    expect(applicableLimits(["CA-ON"], whiteOffDry, { parameter: "turbidity" }).undetermined[0]!.missing).toEqual(["filtered"]);
  });

  it("when a liqueur wine's copper is checked, then 2 mg/L only for one made from unfermented or slightly fermented must, otherwise 1 mg/L (OIV-MA-C1-01, OENO 434-2011)", () => {
    expect(only("OIV", { ...redDry, category: "liqueur", liqueurFromUnfermentedMust: true }, "copper").map((l) => l.value)).toEqual([2]);
    expect(only("OIV", { ...redDry, category: "liqueur", liqueurFromUnfermentedMust: false }, "copper").map((l) => l.value)).toEqual([1]);
    expect(
      applicableLimits(["OIV"], { ...redDry, category: "liqueur" }, { parameter: "copper" }).undetermined.map((u) => u.missing),
    ).toEqual([["liqueurFromUnfermentedMust"], ["liqueurFromUnfermentedMust"]]);
  });
});

describe("requirement = buyer range ∩ market law", () => {
  const va = { parameter: "volatile_acidity", unit: "g/L as acetic acid", rule: { kind: "simple" as const } };

  it("when the buyer's VA limit is looser than EU law, then the law governs and the warning cites it", () => {
    const r = buildRequirement({ ...va, upper: 1.5 }, ["EU"], redDry);
    expect(r.upper!.value).toBe(20);
    expect(r.upper!.source.kind).toBe("law");
    expect(r.issues[0]!.message).toMatch(
      /looser than the law: European Union allows at most 20 meq\/L \(Commission Delegated Regulation \(EU\) 2019\/934/,
    );
  });

  it("when the buyer is stricter, then the buyer's limit governs", () => {
    const r = buildRequirement({ ...va, upper: 0.9 }, ["EU", "US"], redDry);
    expect(r.upper!.source).toEqual({ kind: "buyer" });
    expect(r.upper!.value).toBeCloseTo(14.99, 2);
  });

  it("when a white wine goes to the EU and the US, then the strictest law governs and names its market", () => {
    const r = buildRequirement({ ...va, upper: 2 }, ["US", "EU"], whiteOffDry);
    expect(r.upper!.source.kind === "law" && r.upper!.source.limit.market).toBe("EU");
    expect(r.upper!.value).toBe(18);
    expect(r.legalLimits.map((l) => l.market).sort()).toEqual(["EU", "US"]);
  });

  it("when total acidity has only a legal minimum, then the law supplies the lower bound", () => {
    const r = buildRequirement(
      { parameter: "total_acidity", unit: "g/L as tartaric acid", upper: 8, rule: { kind: "simple" } },
      ["EU", "UK-QWS"],
      { ...redDry, protectedOrigin: "pdo" },
    );
    expect(r.lower!.source.kind === "law" && r.lower!.source.limit.market).toBe("UK-QWS");
    expect(r.lower!.value).toBeCloseTo(53.3, 1); // 4 g/L as tartaric acid
  });

  it("when the range is impossible, then each error names its field", () => {
    expect(validateBuyerRequirement({ parameter: "ph", unit: "pH", lower: 3.8, upper: 3.2, rule: { kind: "simple" } })).toContainEqual({
      severity: "error",
      field: "lower",
      message: "The lower limit (3.8) is above the upper limit (3.2).",
    });
    expect(
      validateBuyerRequirement({ parameter: "ph", unit: "pH", lower: 3.2, upper: 3.6, target: 3.7, rule: { kind: "simple" } }),
    ).toContainEqual({ severity: "error", field: "target", message: "The target lies outside the range." });
    expect(validateBuyerRequirement({ parameter: "alcohol", unit: "mg/L", upper: 14, rule: { kind: "simple" } })[0]!.message).toBe(
      "mg/L is not a unit for Actual alcoholic strength; use % vol, g/L ethanol.",
    );
    expect(() => buildRequirement({ parameter: "alcohol", unit: "NTU", upper: 14, rule: { kind: "simple" } }, [], redDry)).toThrow(
      RequirementError,
    );
  });
});
