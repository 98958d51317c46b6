import { describe, expect, it } from "vitest";
import jStat from "jstat";
import {
  normalCdf,
  conformanceProbability,
  guardWidth,
  statementForSide,
  type DecisionRule,
  buildRequirement,
  evaluate,
  type WineProfile,
} from "../../../shared/engine/index.ts";

const nonBinary: DecisionRule = { kind: "non-binary", guard: { kind: "expanded", k: 2 } };

describe("normal distribution function", () => {
  it("when compared with jStat's normal CDF (reference library from the registry), then they agree to 1e-12 from −8 to 8", () => {
    for (let z = -8; z <= 8; z += 0.137) expect(Math.abs(normalCdf(z) - jStat.normal.cdf(z, 0, 1))).toBeLessThan(1e-12);
  });
});

describe("conformance probability (JCGM 106:2012 7.3/7.4 for a normal PDF)", () => {
  it("when the result sits exactly on a one-sided limit, then p = 0.5", () => {
    expect(conformanceProbability(20, 0.5, undefined, 20)).toBeCloseTo(0.5, 12);
  });

  it("when the result lies 2u inside the limit, then p = Φ(2) = 0.9772", () => {
    expect(conformanceProbability(19, 0.5, undefined, 20)).toBeCloseTo(0.97725, 5);
  });

  it("when the interval is two-sided, then p = Φ((TU−y)/u) − Φ((TL−y)/u)", () => {
    expect(conformanceProbability(3.4, 0.05, 3.3, 3.5)).toBeCloseTo(jStat.normal.cdf(2, 0, 1) - jStat.normal.cdf(-2, 0, 1), 12);
  });
});

describe("decision rules (ILAC-G8:09/2019 §4.2)", () => {
  it("when simple acceptance is used, then the limit value itself passes and anything beyond fails", () => {
    expect(statementForSide({ kind: "simple" }, 0, 0)).toBe("pass");
    expect(statementForSide({ kind: "simple" }, -0.001, 0)).toBe("fail");
  });

  it("when the guard band is w = U = 2u, then the four non-binary zones follow §4.2.3", () => {
    const w = guardWidth(nonBinary, 0.5);
    expect(w).toBe(1);
    expect(statementForSide(nonBinary, 20 - 18.9, w)).toBe("pass");
    expect(statementForSide(nonBinary, 20 - 19.5, w)).toBe("conditional pass");
    expect(statementForSide(nonBinary, 20 - 20, w)).toBe("conditional pass");
    expect(statementForSide(nonBinary, 20 - 20.5, w)).toBe("conditional fail");
    expect(statementForSide(nonBinary, 20 - 21.1, w)).toBe("fail");
  });

  it("when guarded acceptance is binary, then a result inside the guard band fails (§4.2.2)", () => {
    const guarded: DecisionRule = { kind: "guarded", guard: { kind: "multiple-of-u", k: 1.64 } };
    expect(guardWidth(guarded, 1)).toBeCloseTo(1.64, 12); // Eurachem/CITAC: g = 1.64·u for at most 5 % risk
    expect(statementForSide(guarded, 1.7, 1.64)).toBe("pass");
    expect(statementForSide(guarded, 1.0, 1.64)).toBe("fail");
  });
});

describe("verdicts", () => {
  const red: WineProfile = { colour: "red", category: "still", sugarGPerL: 2, harvestYear: 2023, alcoholPercentVol: 13.5 };
  const vaReq = buildRequirement({ parameter: "volatile_acidity", unit: "meq/L", upper: 18, rule: nonBinary }, ["EU"], red);
  const value = (v: number) => ({
    reading: { kind: "value" as const, value: v },
    unit: "meq/L" as const,
    uncertainty: { kind: "expanded" as const, value: 1, k: 2 },
  });

  it("when a result is given with its expanded uncertainty, then u = U/k and the verdict names the governing limit", () => {
    const v = evaluate(vaReq, value(17.5));
    expect(v.outcome).toBe("conditional pass");
    expect(v.uncertainty).toMatchObject({ u: 0.5, source: "laboratory" });
    expect(v.decidingSide).toBe("upper");
    expect(v.governing.upper!.source).toEqual({ kind: "buyer" });
    expect(v.conformanceProbability).toBeCloseTo(jStat.normal.cdf(1, 0, 1), 10);
  });

  it("when the lab gives no uncertainty, then the method default is used and said so", () => {
    const v = evaluate(vaReq, { reading: { kind: "value", value: 10 }, unit: "meq/L" });
    expect(v.outcome).toBe("pass");
    expect(v.uncertainty!.source).toBe("default");
    expect(v.uncertainty!.basis).toMatch(/^no uncertainty reported; default used/);
  });

  it("when a result is in another accepted unit, then it is converted before the decision", () => {
    const v = evaluate(vaReq, {
      reading: { kind: "value", value: 1.3 },
      unit: "g/L as acetic acid",
      uncertainty: { kind: "standard", value: 0.01 },
    });
    expect(v.value).toBeCloseTo(21.65, 2);
    expect(v.outcome).toBe("fail");
  });

  it("when a result is missing, or not required at this stage, then each gets its own outcome", () => {
    expect(evaluate(vaReq, null).outcome).toBe("missing");
    expect(evaluate(vaReq, null, { requiredAtStage: false }).outcome).toBe("not required");
    const informative = evaluate(vaReq, value(25), { requiredAtStage: false });
    expect(informative).toMatchObject({ outcome: "not required", informativeOutcome: "fail" });
  });

  it("when a result is censored, then it is decided only when every possible value agrees, and never becomes a number", () => {
    const tca = buildRequirement({ parameter: "tca", unit: "ng/L", upper: 2, rule: nonBinary }, [], red);
    const below = (limit: number | null) => evaluate(tca, { reading: { kind: "below", limit }, unit: "ng/L" });
    expect(below(0.5)).toMatchObject({ outcome: "pass", value: null, resultText: "< 0.5" });
    expect(below(3).outcome).toBe("inconclusive");
    expect(below(null).explanation).toMatch(/limit of quantification/);
    const above = evaluate(tca, { reading: { kind: "above", limit: 10 }, unit: "ng/L" });
    expect(above.outcome).toBe("fail");
  });

  it("when a lower limit decides, then the verdict says so", () => {
    const ta = buildRequirement(
      { parameter: "total_acidity", unit: "g/L as tartaric acid", lower: 5, upper: 7, rule: { kind: "simple" } },
      ["EU"],
      red,
    );
    const v = evaluate(ta, { reading: { kind: "value", value: 4.5 }, unit: "g/L as tartaric acid" });
    expect(v).toMatchObject({ outcome: "fail", decidingSide: "lower" });
  });

  it("when a deposit is found in the refrigeration test, then it fails", () => {
    const cold = buildRequirement({ parameter: "cold_stability_deposit", unit: "presence", rule: { kind: "simple" } }, [], red);
    expect(evaluate(cold, { reading: { kind: "presence", present: true }, unit: "presence" }).outcome).toBe("fail");
    expect(evaluate(cold, { reading: { kind: "presence", present: false }, unit: "presence" }).outcome).toBe("pass");
  });
});
