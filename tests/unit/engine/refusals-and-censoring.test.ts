/**
 * What the engine refuses, and what a censored or uncertain result can show.
 * - Decision rules and guard bands: ISO/IEC 17025:2017 7.8.6 and ILAC-G8:09/2019 (guarded acceptance, w = U).
 * - Sulphite statement: EU "more than 10 mg/l" (Reg. (EU) No 1169/2011 Annex II item 12); US "10 or more parts per million" (27 CFR 4.32(e)).
 * - A censored result "< L" means the true value lies in [0, L) (common practice in laboratory reporting).
 */
import { describe, expect, it } from "vitest";
import {
  buildRequirement,
  convert,
  evaluate,
  MarketError,
  sulphiteStatement,
  UnitError,
  applicableLimits,
  type UnitId,
  type WineProfile,
} from "../../../shared/engine/index.ts";
import { judgeAnalysis, judgeFor, readResult } from "../../../shared/lots/judge.ts";

const profile: WineProfile = { colour: "white", category: "still", harvestYear: 2025, sugarGPerL: 2 };
const guarded = { kind: "guarded" as const, guard: { kind: "expanded" as const, k: 2 } };
const row = (upper: number, rule: object = guarded) =>
  buildRequirement({ parameter: "copper", unit: "mg/L", upper, lower: null, target: null, rule } as never, [], profile);

describe("refused inputs name the value and the field", () => {
  it("when a unit is unknown, then the conversion refuses it by name instead of throwing a TypeError", () => {
    expect(() => convert(1, "furlongs" as UnitId, "mg/L")).toThrow(UnitError);
    expect(() => convert(1, "furlongs" as UnitId, "mg/L")).toThrow('"furlongs" is not a unit Cellarpact knows.');
    expect(() => convert(Number.NaN, "mg/L", "g/L")).toThrow("NaN is not a finite number.");
  });

  it("when a market is unknown, then the law is not taken as silent: the market is refused by name", () => {
    expect(() => applicableLimits(["XX" as never], profile)).toThrow(MarketError);
    expect(() => applicableLimits(["XX" as never], profile)).toThrow(/"XX" is not a market Cellarpact has rules for/);
  });

  it("when a coverage factor of 0 or below is given, then the result is refused rather than divided by it", () => {
    expect(() =>
      evaluate(row(1), { reading: { kind: "value", value: 0.3 }, unit: "mg/L", uncertainty: { kind: "expanded", value: 0.05, k: 0 } }),
    ).toThrow("A coverage factor must be above 0; k = 0 was given.");
    expect(() =>
      evaluate(row(1), { reading: { kind: "value", value: 0.3 }, unit: "mg/L", uncertainty: { kind: "expanded", value: 0.05, k: -2 } }),
    ).toThrow(RangeError);
  });

  it("when an analysis holds an unreadable result, then the judge marks it missing with the parser's reason, never a pass", () => {
    const judge = judgeFor({
      wine: { colour: "white", category: "still", nominalSugarGPerL: 2, nominalAlcoholPercentVol: 12, lawFacts: null, markets: ["EU"] },
      lot: { vintage: 2025, market: "EU" },
      requirements: [
        {
          id: 1,
          parameter: "copper",
          unit: "mg/L",
          lower: null,
          upper: 1,
          target: null,
          method: null,
          rule: guarded,
          severity: "major",
          stages: ["pre_filling"],
        },
      ],
    });
    const read = readResult({ parameter: "copper", raw: "-0.2", unit: "mg/L" });
    expect(read).toMatchObject({ reading: null, error: '"-0.2": a measured result cannot be negative.' });
    expect(judgeAnalysis(judge, "pre_filling", [read]).verdicts[0]!.outcome).toBe("missing");
  });
});

describe("what a result can show", () => {
  it("when a relative uncertainty in % is given, then it is honoured: U = 10 % of 0.5 mg/L is 0.05 mg/L, so u = 0.025 with k = 2", () => {
    const v = evaluate(row(1), {
      reading: { kind: "value", value: 0.5 },
      unit: "mg/L",
      uncertainty: { kind: "relative", value: 10, k: 2 },
    });
    expect(v.uncertainty).toMatchObject({ source: "laboratory" });
    expect(v.uncertainty!.u).toBeCloseTo(0.025, 12);
    expect(v.guardBand).toBeCloseTo(0.05, 12);
  });

  it("when a censored result's whole range lies inside the limit, then it passes even under a guard band: '<1.0' against 'not more than 1.0'", () => {
    expect(evaluate(row(1), { reading: { kind: "below", limit: 1 }, unit: "mg/L" }).outcome).toBe("pass");
    expect(evaluate(row(1), { reading: { kind: "below", limit: 1.2 }, unit: "mg/L" }).outcome).toBe("inconclusive");
    expect(evaluate(row(1), { reading: { kind: "above", limit: 1.2 }, unit: "mg/L" }).outcome).toBe("fail");
  });

  it("when a 'more than' total SO2 reading cannot settle the sulphite threshold, then the statement is undetermined; above the threshold it is required", () => {
    expect(sulphiteStatement("EU", { kind: "above", limit: 8 }).required).toBe("undetermined");
    expect(sulphiteStatement("US", { kind: "above", limit: 9.5 }).required).toBe("undetermined");
    expect(sulphiteStatement("EU", { kind: "above", limit: 10 }).required).toBe(true);
    expect(sulphiteStatement("US", { kind: "above", limit: 10 }).required).toBe(true);
  });

  it("when the uncertainty is so large that the guard band leaves no acceptance zone, then the verdict warns that no result can show conformity", () => {
    const v = evaluate(row(0.1), {
      reading: { kind: "value", value: 0.05 },
      unit: "mg/L",
      uncertainty: { kind: "expanded", value: 0.2, k: 2 },
    });
    expect(v.explanation).toContain("no result can show conformity under this rule");
    const fine = evaluate(row(1), {
      reading: { kind: "value", value: 0.05 },
      unit: "mg/L",
      uncertainty: { kind: "expanded", value: 0.02, k: 2 },
    });
    expect(fine.explanation).not.toContain("no result can show conformity");
  });
});

describe("mg/kg limits and the sample's density", () => {
  it("when the analysis measured the density at 20 °C, then a mg/kg limit and the result are converted with it alike", () => {
    // EU lead in wine from the 2022 harvest: 0.10 mg/kg (Commission Regulation (EU) 2023/915, values of 2021/1317; citation not yet confirmed).
    // At 1.050 g/mL that is 0.105 mg/L, so 0.104 mg/L conforms; taken at 1.000 g/mL it would not.
    const wine = {
      colour: "white" as const,
      category: "still" as const,
      nominalSugarGPerL: 60,
      nominalAlcoholPercentVol: 12,
      lawFacts: null,
      markets: ["EU" as const],
    };
    const judge = judgeFor({
      wine,
      lot: { vintage: 2024, market: "EU" },
      requirements: [
        {
          id: 1,
          parameter: "lead",
          unit: "mg/L",
          lower: null,
          upper: 0.2,
          target: null,
          method: null,
          rule: { kind: "simple" },
          severity: "major",
          stages: ["pre_filling"],
        },
      ],
    });
    const lead = readResult({ parameter: "lead", raw: "0.104", unit: "mg/L" });
    expect(judgeAnalysis(judge, "pre_filling", [lead]).verdicts[0]!.outcome).toBe("fail");
    const dense = judgeAnalysis(judge, "pre_filling", [lead, readResult({ parameter: "density", raw: "1.050", unit: "g/mL" })]);
    expect(dense.verdicts[0]!.outcome).toBe("pass");
    expect(dense.verdicts[0]!.upper!.value).toBeCloseTo(0.105, 9);
  });
});
