import { describe, expect, it } from "vitest";
import {
  capability,
  compareTransit,
  D2,
  D4,
  diffSpecs,
  driftWarning,
  E2,
  enNumber,
  ewmaChart,
  individualsChart,
  westernElectricSignals,
  zScore,
  zetaScore,
  backtest,
  backtestSteps,
  type BuyerRequirement,
  type PastResult,
} from "../../../shared/engine/index.ts";

// NIST/SEMATECH e-Handbook 6.3.2.4 EWMA example; the 20 values and s are from memory, checked by recomputing the published limits.
const NIST_EWMA_DATA = [
  52.0, 47.0, 53.0, 49.3, 50.1, 47.0, 51.0, 50.1, 51.2, 50.5, 49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1,
];

describe("EWMA chart (NIST/SEMATECH e-Handbook of Statistical Methods 6.3.2.4)", () => {
  const points = ewmaChart(NIST_EWMA_DATA, { lambda: 0.3, target: 50, sigma: 2.0539 });

  it("when λ = 0.3, s = 2.0539 and EWMA0 = 50, then UCL = 52.5884 and LCL = 47.4116", () => {
    expect(points[0]!.ucl).toBeCloseTo(52.5884, 4);
    expect(points[0]!.lcl).toBeCloseTo(47.4116, 4);
  });

  it("when the example series is smoothed, then the last EWMA is 51.99 (from memory; recomputed) and no point leaves the limits", () => {
    expect(points.at(-1)!.ewma).toBeCloseTo(51.99, 2);
    expect(points.every((p) => !p.outOfControl)).toBe(true);
  });

  it("when the exact time-varying limits are asked for, then they start narrow and approach the asymptotic ones", () => {
    const exact = ewmaChart(NIST_EWMA_DATA, { lambda: 0.3, target: 50, sigma: 2.0539, exact: true });
    expect(exact[0]!.ucl - 50).toBeCloseTo(3 * 2.0539 * 0.3, 10);
    expect(exact.at(-1)!.ucl).toBeCloseTo(52.5884, 3);
  });
});

describe("individuals and moving-range chart (PQ Systems SPC constants: E2 = 2.660, D4 = 3.268, d2 = 1.128)", () => {
  it("when the constants are used, then E2 = 3/d2", () => {
    expect(E2).toBeCloseTo(3 / D2, 2);
    expect(D4).toBe(3.268);
  });

  it("when results are 10, 12, 11, 13, then centre 11.5, MR̄ 5/3 and limits x̄ ± 2.660·MR̄", () => {
    const c = individualsChart([10, 12, 11, 13]);
    expect(c.centre).toBe(11.5);
    expect(c.averageMovingRange).toBeCloseTo(5 / 3, 12);
    expect(c.ucl).toBeCloseTo(11.5 + 2.66 * (5 / 3), 12);
    expect(c.movingRangeUcl).toBeCloseTo(3.268 * (5 / 3), 12);
  });
});

describe("Western Electric rules (Statistical Quality Control Handbook 1956, via the StatSoft glossary)", () => {
  it("when one point lies beyond 3σ, then rule 1 fires", () => {
    expect(westernElectricSignals([0, 0.5, 3.2], 0, 1).map((s) => s.rule)).toContain(1);
  });
  it("when 2 of 3 points lie beyond 2σ on one side, then rule 2 fires", () => {
    expect(westernElectricSignals([2.5, 0, 2.1], 0, 1).map((s) => s.rule)).toEqual([2]);
  });
  it("when 4 of 5 points lie beyond 1σ on one side, then rule 3 fires", () => {
    expect(westernElectricSignals([-1.5, -1.2, 0, -1.1, -1.3], 0, 1).filter((s) => s.rule === 3)).toHaveLength(1);
  });
  it("when 8 points in a row sit on one side, then rule 4 fires; 7 do not", () => {
    expect(westernElectricSignals([0.2, 0.1, 0.3, 0.2, 0.4, 0.1, 0.2], 0, 1)).toEqual([]);
    expect(westernElectricSignals([0.2, 0.1, 0.3, 0.2, 0.4, 0.1, 0.2, 0.3], 0, 1).map((s) => s.rule)).toEqual([4]);
  });
});

describe("capability and drift", () => {
  it("when σ = 1 and the spec is 94–106 around a mean of 100, then Cp = Cpk = 2 (textbook definitions, common practice)", () => {
    const c = capability([99, 101, 100], { lower: 94, upper: 106 }, 1);
    expect(c.cp).toBe(2);
    expect(c.cpk).toBe(2);
    expect(capability([99, 101, 100], { upper: 103 }, 1)).toMatchObject({ cp: null, cpk: 1, cpl: null });
  });

  it("when volatile acidity climbs steadily toward its limit, then the early warning names the upper limit", () => {
    expect(driftWarning([9, 9.2, 9.1, 9.4, 9.8, 10.3, 11, 11.9], { upper: 14 })?.towards).toBe("upper");
    expect(driftWarning([9, 9.2, 9.1, 9, 9.2, 9.1], { upper: 14 })).toBeNull();
  });
});

describe("producer against independent laboratory (ISO 13528)", () => {
  it("when the NIST Dataplot ISO 13528 En example is recomputed, then 1.006 → 0.393 implies 0.996 → −0.262 and 0.998 → −0.131", () => {
    // Dataplot reference manual, "ISO 13528 EN SCORE": assigned value 1, equal lab uncertainties.
    const ref = 1;
    const combined = 0.006 / 0.393;
    const uRef = 0.001;
    const uLab = Math.sqrt(combined ** 2 - uRef ** 2);
    expect(enNumber(1.006, uLab, ref, uRef).en).toBeCloseTo(0.393, 3);
    expect(enNumber(0.996, uLab, ref, uRef).en).toBeCloseTo(-0.262, 3);
    expect(enNumber(0.998, uLab, ref, uRef).en).toBeCloseTo(-0.131, 3);
  });

  it("when |En| ≤ 1 the comparison is satisfactory; |z| ≤ 2, 2–3 and ≥ 3 read satisfactory, questionable, unsatisfactory (ISO 13528, from memory)", () => {
    expect(enNumber(10.4, 0.3, 10, 0.3).reading).toBe("satisfactory");
    expect(enNumber(10.5, 0.3, 10, 0.3).reading).toBe("unsatisfactory");
    expect(zScore(12, 10, 1).reading).toBe("satisfactory");
    expect(zScore(12.5, 10, 1).reading).toBe("questionable");
    expect(zScore(7, 10, 1).reading).toBe("unsatisfactory");
    expect(zetaScore(10.3, 0.1, 10, 0.1).zeta).toBeCloseTo(0.3 / Math.SQRT2 / 0.1, 10);
  });
});

describe("transit (bulk wine)", () => {
  it("when free SO2 fell 14 mg/L and oxygen rose 0.5 mg/L, then only the SO2 loss exceeds its default allowance", () => {
    const f = compareTransit(
      { free_so2: { value: 32 }, dissolved_oxygen: { value: 0.6 }, volatile_acidity: { value: 8 } },
      { free_so2: { value: 18 }, dissolved_oxygen: { value: 1.1 }, volatile_acidity: { value: 8.4 } },
    );
    expect(f.find((x) => x.parameter === "free_so2")).toMatchObject({ exceeded: true, change: -14 });
    expect(f.find((x) => x.parameter === "dissolved_oxygen")!.exceeded).toBe(false);
    expect(f.find((x) => x.parameter === "free_so2")!.allowance.basis).toMatch(/common practice/);
  });

  it("when a spec overrides an allowance, then the override governs", () => {
    const f = compareTransit({ free_so2: { value: 32 } }, { free_so2: { value: 25 } }, [
      { parameter: "free_so2", direction: "decrease", allowed: 5, basis: "buyer spec" },
    ]);
    expect(f[0]!.exceeded).toBe(true);
  });
});

describe("spec versions", () => {
  const simple = { kind: "simple" as const };
  const v1: BuyerRequirement[] = [
    { parameter: "volatile_acidity", unit: "g/L as acetic acid", upper: 0.8, rule: simple },
    { parameter: "free_so2", unit: "mg/L", lower: 25, upper: 40, rule: simple },
    { parameter: "ph", unit: "pH", lower: 3.2, upper: 3.6, rule: simple },
  ];
  const v2: BuyerRequirement[] = [
    { parameter: "volatile_acidity", unit: "meq/L", upper: 11, rule: simple }, // 0.66 g/L as acetic acid
    { parameter: "free_so2", unit: "mg/L", lower: 28, upper: 45, rule: simple },
    { parameter: "turbidity", unit: "NTU", upper: 1, rule: simple },
  ];

  it("when two versions are compared, then each parameter is added, removed, tightened, loosened or both, in canonical units", () => {
    const d = Object.fromEntries(diffSpecs(v1, v2).map((x) => [x.parameter, x.kind]));
    expect(d).toEqual({ volatile_acidity: "tightened", free_so2: "tightened and loosened", ph: "removed", turbidity: "added" });
  });

  it("when a draft tightens VA, then the backtest says how many lots of which vintage would newly fail, with progress", () => {
    const results: PastResult[] = [0.6, 0.7, 0.75, 0.78, 0.5].map((va, i) => ({
      lotId: `L${i}`,
      lotCode: `HG-24-${i}`,
      vintage: i < 4 ? 2024 : 2023,
      parameter: "volatile_acidity",
      input: { reading: { kind: "value", value: va }, unit: "g/L as acetic acid", uncertainty: { kind: "standard", value: 0 } },
      profile: { colour: "red", category: "still", sugarGPerL: 2 },
    }));
    const steps = [
      ...(function* () {
        const it = backtestSteps(results, v1, v2, ["EU"], 2);
        let s = it.next();
        while (!s.done) {
          yield s.value;
          s = it.next();
        }
      })(),
    ];
    expect(steps).toEqual([
      { done: 2, total: 5 },
      { done: 4, total: 5 },
    ]);
    const summary = backtest(results, v1, v2, ["EU"]);
    expect(summary.sentences).toEqual(["3 lots of the 2024 vintage would now fail Volatile acidity"]);
  });
});
