/**
 * Sources beside each check:
 * - 16.83 g/L of sugar = 1 % vol potential alcohol: Arrêté du 3 mai 1996 (réfractomètres), article 2 (JORF).
 * - °Oechsle = (d − 1) × 1000; °Baumé = 145 × (1 − 1/d); °Brix ≈ 261.3 × (1 − 1/d): the scales' definitions and the usual
 *   must-weight tables (from memory; d 1.090 ≈ 90 °Oe ≈ 21.5 °Bx ≈ 12 °Bé).
 * - Critical range of replicates: ISO 5725-6:1994, Table 1, f(2) = 2.8 (from memory).
 * - Global consumer's and producer's risks: JCGM 106:2012, clause 9; recomputed independently with jStat's normal functions.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import jStat from "jstat";
import {
  baumeFromDensity,
  brixFromDensity,
  checkReplicates,
  globalRisks,
  oechsleFromDensity,
  potentialAlcohol,
  quantity,
  totalAlcohol,
} from "../../../shared/engine/index.ts";

describe("alcohol from sugar and must weight", () => {
  it("when sugar remains, then potential alcohol is sugar / 16.83 and total alcohol adds it to the actual", () => {
    expect(potentialAlcohol(quantity(168.3, "g/L"))).toBeCloseTo(10, 12);
    expect(totalAlcohol(quantity(12, "% vol"), quantity(33.66, "g/L"))).toBeCloseTo(14, 12);
    expect(() => potentialAlcohol(quantity(-1, "g/L"))).toThrow(RangeError);
  });

  it("when a must's relative density is 1.090, then it reads about 90 °Oe, 21.5 °Bx and 12 °Bé", () => {
    expect(oechsleFromDensity(1.09)).toBeCloseTo(90, 9);
    expect(brixFromDensity(1.09)).toBeCloseTo(21.58, 2);
    expect(baumeFromDensity(1.09)).toBeCloseTo(11.97, 2);
  });
});

describe("replicates", () => {
  it("when two results differ by more than 2.8 σr, then they are not averaged; within it, their mean stands", () => {
    const ok = checkReplicates([0.4, 0.42], 0.01);
    expect(ok).toMatchObject({ acceptable: true, limit: expect.closeTo(0.028, 12) });
    expect(ok.mean).toBeCloseTo(0.41, 12);
    expect(checkReplicates([0.4, 0.43], 0.01).acceptable).toBe(false);
    expect(() => checkReplicates([0.4], 0.01)).toThrow("at least two");
    expect(() => checkReplicates([0.4, 0.41], 0)).toThrow("above 0");
  });
});

describe("global risks of a guard band", () => {
  const reference = (m: number, s: number, u: number, lower: number, upper: number, w: number) => {
    // Midpoint rule with jStat's normal pdf and cdf, inside and outside the tolerance apart: a second, independent integration.
    const integrate = (a: number, b: number, f: (eta: number) => number, n = 100_000) => {
      const h = (b - a) / n;
      let sum = 0;
      for (let i = 0; i < n; i++) sum += f(a + (i + 0.5) * h) * h;
      return sum;
    };
    const accept = (eta: number) => jStat.normal.cdf(upper - w, eta, u) - jStat.normal.cdf(lower + w, eta, u);
    const g = (eta: number) => jStat.normal.pdf(eta, m, s);
    const lo = m - 10 * s;
    const hi = m + 10 * s;
    return {
      consumer: integrate(lo, lower, (e) => g(e) * accept(e)) + integrate(upper, hi, (e) => g(e) * accept(e)),
      producer: integrate(lower, upper, (e) => g(e) * (1 - accept(e))),
    };
  };

  it("when a process sits near a limit, then the risks agree with an independent integration", () => {
    const input = { processMean: 0.55, processSd: 0.05, u: 0.03, lower: 0, upper: 0.6, guard: 0.03 };
    const r = globalRisks(input);
    const ref = reference(0.55, 0.05, 0.03, 0, 0.6, 0.03);
    expect(r.consumer).toBeCloseTo(ref.consumer, 6);
    expect(r.producer).toBeCloseTo(ref.producer, 6);
    expect(r.consumer).toBeGreaterThan(0);
    expect(r.producer).toBeGreaterThan(r.consumer);
  });

  it("when the guard band widens, then the consumer's risk falls and the producer's rises (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 0.7, noNaN: true }),
        fc.double({ min: 0.01, max: 0.1, noNaN: true }),
        fc.double({ min: 0.005, max: 0.05, noNaN: true }),
        (m, s, u) => {
          const at = (guard: number) => globalRisks({ processMean: m, processSd: s, u, upper: 0.6, guard }, 800);
          const [a, b] = [at(0), at(2 * u)];
          expect(b.consumer).toBeLessThanOrEqual(a.consumer + 1e-12);
          expect(b.producer).toBeGreaterThanOrEqual(a.producer - 1e-12);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("when the measurement is exact and there is no guard band, then neither risk exists", () => {
    const r = globalRisks({ processMean: 0.5, processSd: 0.05, u: 0, upper: 0.6, guard: 0 });
    expect(r.consumer).toBeCloseTo(0, 12);
    expect(r.producer).toBeCloseTo(0, 12);
  });
});
