/**
 * Audit pricing, order status and the comparison of declared with independent results.
 * Scores are hand-worked from the ISO 13528 formulas (En = (x − X)/√(U_x² + U_X²); z = (x − X)/σ_pt;
 * reading thresholds from memory, as in the engine's own tests).
 */
import { describe, expect, it } from "vitest";
import { compareWithReference, convert } from "../../shared/engine/index.ts";
import { quoteAudit } from "../../shared/audits/pricing.ts";
import { formatMoney, orderStatus, parseMoney } from "../../shared/audits/vocabulary.ts";
import { cellKey, cellsFromSamples } from "../../shared/audits/lab-csv.ts";
import { buildSamples, guessMapping } from "../../shared/lots/csv.ts";

const value = (v: number) => ({ kind: "value" as const, value: v });
const U = (v: number) => ({ kind: "expanded" as const, value: v, k: 2 });

describe("comparing a declared result with the independent laboratory's", () => {
  it("gives the same En whichever unit each laboratory reports in (total acidity, g/L as tartaric acid vs meq/L)", () => {
    const inGrams = compareWithReference(
      "total_acidity",
      { reading: value(6.0), unit: "g/L as tartaric acid", uncertainty: U(0.2) },
      { reading: value(6.04), unit: "g/L as tartaric acid", uncertainty: U(0.2) },
    );
    // (6.00 − 6.04) / √(0.2² + 0.2²) = −0.1414 by hand.
    expect(inGrams.en).toBeCloseTo(-0.1414, 4);
    const labInMeq = convert(6.04, "g/L as tartaric acid", "meq/L");
    const uInMeq = convert(0.2, "g/L as tartaric acid", "meq/L");
    const mixed = compareWithReference(
      "total_acidity",
      { reading: value(6.0), unit: "g/L as tartaric acid", uncertainty: U(0.2) },
      { reading: value(labInMeq), unit: "meq/L", uncertainty: U(uInMeq) },
    );
    expect(mixed.en).toBeCloseTo(inGrams.en!, 10);
    expect(mixed.outcome).toBe("agrees");
  });

  it("stands in the catalogue's default uncertainty where a laboratory gave none, and says so", () => {
    // Free SO2 default: 10 % relative standard uncertainty, so U = 2 × 0.1 × value.
    const c = compareWithReference(
      "free_so2",
      { reading: value(30), unit: "mg/L" },
      { reading: value(36), unit: "mg/L", uncertainty: U(3) },
    );
    expect(c.declaredU).toBeCloseTo(6, 10);
    expect(c.en).toBeCloseTo(-6 / Math.hypot(6, 3), 10);
    expect(c.uncertaintySources).toEqual({ declared: "default", independent: "laboratory" });
    expect(c.explanation).toContain("default");
  });

  it("flags a discrepancy by En alone or by z alone", () => {
    // Wide uncertainties keep |En| ≤ 1, but z = (40 − 30)/(0.1 × 30) = 3.33 is unsatisfactory.
    const byZ = compareWithReference(
      "free_so2",
      { reading: value(40), unit: "mg/L", uncertainty: U(12) },
      { reading: value(30), unit: "mg/L", uncertainty: U(12) },
    );
    expect(Math.abs(byZ.en!)).toBeLessThanOrEqual(1);
    expect(byZ.z).toBeCloseTo(3.333, 3);
    expect(byZ.outcome).toBe("discrepant");
    // z = (34 − 30)/3 = 1.33 but tight uncertainties give En = 4/√(1² + 1²) = 2.83.
    const byEn = compareWithReference(
      "free_so2",
      { reading: value(34), unit: "mg/L", uncertainty: U(1) },
      { reading: value(30), unit: "mg/L", uncertainty: U(1) },
    );
    expect(byEn.en).toBeCloseTo(2.828, 3);
    expect(byEn.outcome).toBe("discrepant");
    // z = (37 − 30)/3 = 2.33: questionable, En = 7/√(5² + 5²) = 0.99.
    expect(
      compareWithReference(
        "free_so2",
        { reading: value(37), unit: "mg/L", uncertainty: U(5) },
        { reading: value(30), unit: "mg/L", uncertainty: U(5) },
      ).outcome,
    ).toBe("questionable");
  });

  it("does not score what is not a number, and says what was missing", () => {
    const below = { reading: { kind: "below" as const, limit: 1 }, unit: "µg/L" as const };
    expect(compareWithReference("ochratoxin_a", below, below).outcome).toBe("agrees");
    expect(compareWithReference("ochratoxin_a", below, { reading: value(1.4), unit: "µg/L" }).outcome).toBe("not comparable");
    const none = compareWithReference("alcohol", null, { reading: value(12.5), unit: "% vol" });
    expect(none.outcome).toBe("not comparable");
    expect(none.explanation).toMatch(/declared no result/);
  });
});

describe("pricing and the order's status", () => {
  it("prices each parameter once per lot in integer cents, and names what the laboratory does not offer", () => {
    const q = quoteAudit(
      [
        { parameter: "free_so2", priceCents: 1400 },
        { parameter: "volatile_acidity", priceCents: 1650 },
      ],
      3,
      ["free_so2", "volatile_acidity", "tca"],
    );
    expect(q.totalCents).toBe(3 * 1400 + 3 * 1650);
    expect(q.lines.map((l) => l.totalCents)).toEqual([4200, 4950]);
    expect(q.unpriced).toEqual(["tca"]);
    expect(formatMoney(9150)).toBe("€91.50");
  });

  it("derives the status from facts, so events in any order end the same way", () => {
    const base = { amountCents: 4500, paidCents: 0, refundedCents: 0, lastFailureAt: null, resultsSubmittedAt: null };
    expect(orderStatus(base)).toBe("awaiting_payment");
    expect(orderStatus({ ...base, lastFailureAt: new Date() })).toBe("payment_failed");
    expect(orderStatus({ ...base, lastFailureAt: new Date(), paidCents: 4500 })).toBe("paid");
    // A refund recorded before its payment (events out of order) is still a refund.
    expect(orderStatus({ ...base, refundedCents: 4500 })).toBe("refunded");
    expect(orderStatus({ ...base, paidCents: 4500, refundedCents: 4500 })).toBe("refunded");
    expect(orderStatus({ ...base, paidCents: 4500, refundedCents: 1000 })).toBe("paid");
    expect(orderStatus({ ...base, paidCents: 4500, resultsSubmittedAt: new Date() })).toBe("completed");
  });
});

describe("money and the laboratory's CSV", () => {
  it("reads prices as typed into whole cents and refuses what is not a price", () => {
    expect(parseMoney("14")).toBe(1400);
    expect(parseMoney("14,5")).toBe(1450);
    expect(parseMoney(" 14.05 ")).toBe(1405);
    for (const bad of ["14.005", "-3", "1e3", "€14", ""]) expect(parseMoney(bad)).toBeNull();
  });

  it("fills the ordered lots and parameters from a laboratory export and reports the rest", () => {
    const headers = ["Sample", "Volatile acidity (g/L as acetic acid)", "Free SO2 (mg/L)", "pH"];
    const rows = [
      ["SB-25-11", "0,52 ± 0,03", "34 ± 3", "3.21"],
      ["SB-99-99", "0,40", "30", "3.3"],
    ];
    const { samples } = buildSamples(headers, rows, guessMapping(headers), { sampleDate: "2026-11-28" });
    const { cells, skipped } = cellsFromSamples(samples, [{ lotId: 7, lotCode: "SB-25-11" }], ["volatile_acidity", "free_so2"]);
    expect(cells[cellKey(7, "volatile_acidity")]).toEqual({ raw: "0,52", unit: "g/L as acetic acid", u: "0.03" });
    expect(cells[cellKey(7, "free_so2")]).toEqual({ raw: "34", unit: "mg/L", u: "3" });
    expect(skipped).toEqual(["pH for SB-25-11 was not ordered", "lot SB-99-99 is not in this order"]);
  });
});
