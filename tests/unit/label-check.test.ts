/**
 * The lot page's label check, against published values (see ../shared guides' trade reference):
 * - EU alcohol tolerance ±0.5 % vol for still wine: Reg. (EC) 607/2009 Art. 54(1), kept by 2019/33 Art. 44 (from memory).
 * - US tolerance ±1.5 points up to 14 % ABV: 27 CFR 4.36 (TTB's worked example: label 12 % → 10.5–13.5 % passes).
 * - EU "dry": sugar ≤ 4 g/L, or ≤ 9 g/L when total acidity (as tartaric) is not more than 2 g/L below it: 2019/33 Annex III Part B.
 * - Sulphite statement: EU when total SO2 is more than 10 mg/L (Reg. (EU) 1169/2011 Annex II item 12); US at 10 ppm or more (27 CFR 4.32(e)).
 * - Molecular SO2 with pKa 1.81: pH 3.5 and 40 mg/L free give about 0.8 mg/L (the usual molecular-SO2 tables; common practice).
 */
import { describe, expect, it } from "vitest";
import { labelCheck } from "../../shared/lots/label-check.ts";
import type { UnitId } from "../../shared/engine/index.ts";

const value = (parameter: string, v: number, unit: UnitId) => ({ parameter, reading: { kind: "value" as const, value: v }, unit });
const base = [
  value("free_so2", 40, "mg/L"),
  value("total_so2", 110, "mg/L"),
  value("ph", 3.5, "pH"),
  value("residual_sugar", 6, "g/L"),
  value("total_acidity", 5, "g/L as tartaric acid"),
  value("alcohol", 12.9, "% vol"),
];

describe("label check", () => {
  it("when a still wine is sold in the EU and the US, then each market's tolerance, sulphite rule and the EU sugar term are stated with their sources", () => {
    const lines = labelCheck({ category: "still", markets: ["EU", "US"], labelledAlcoholPercentVol: 12.5, results: base });
    const find = (topic: string, market: string | null) => lines.find((l) => l.topic === topic && l.market === market)!;
    expect(find("Bound SO2", null).text).toBe("70 mg/L (total 110 − free 40 mg/L).");
    expect(find("Molecular SO2", null).text).toBe("0.80 mg/L at pH 3.50 (pKa 1.81).");
    expect(find("Alcohol on the label", "EU")).toMatchObject({ status: "ok" });
    expect(find("Alcohol on the label", "EU").text).toContain("within ±0.5 (12–13 % vol)");
    expect(find("Alcohol on the label", "US")).toMatchObject({ status: "ok" });
    expect(find("Alcohol on the label", "US").text).toContain("within ±1.5 (11–14 % vol)");
    // 6 g/L sugar with 5 g/L acidity: 6 − 5 ≤ 2, so "dry" under the 9 g/L branch.
    expect(find("Sugar-content term", "EU").text).toMatch(/^May be labelled "dry" at 6.0 g\/L sugar/);
    expect(find("Sulphite statement", "EU").text).toMatch(/^Required: "Contains sulphites"/);
    expect(find("Sulphite statement", "US").citation?.article).toBe("§ 4.32(e)");
  });

  it("when the label is 0.6 % vol off for an EU still wine, then the check reports the problem; at exactly 10 mg/L total SO2 the EU and US differ", () => {
    const lines = labelCheck({
      category: "still",
      markets: ["EU", "US"],
      labelledAlcoholPercentVol: 13.5,
      results: [value("total_so2", 10, "mg/L"), value("alcohol", 12.9, "% vol")],
    });
    expect(lines.find((l) => l.topic === "Alcohol on the label" && l.market === "EU")!.status).toBe("problem");
    expect(lines.find((l) => l.topic === "Alcohol on the label" && l.market === "US")!.status).toBe("ok");
    expect(lines.find((l) => l.topic === "Sulphite statement" && l.market === "EU")!.text).toMatch(/^Not required/);
    expect(lines.find((l) => l.topic === "Sulphite statement" && l.market === "US")!.text).toMatch(/^Required: "Contains sulfites"/);
  });

  it("when the wine is sold in Great Britain, then the EU labelling checks apply as retained there, and say so", () => {
    const lines = labelCheck({ category: "still", markets: ["GB"], labelledAlcoholPercentVol: 12.5, results: base });
    expect(lines.find((l) => l.topic === "Alcohol on the label")).toMatchObject({ market: "GB", status: "ok" });
    expect(lines.find((l) => l.topic === "Sulphite statement")!.citation!.document).toBe(
      "Regulation (EU) No 1169/2011 as retained in the law of Great Britain",
    );
    expect(lines.find((l) => l.topic === "Sugar-content term")).toMatchObject({ market: "GB" });
  });

  it("when a wine is under 7 % vol, then the US line says 27 CFR part 4 does not apply (27 CFR 4.6)", () => {
    const lines = labelCheck({
      category: "still",
      markets: ["US"],
      labelledAlcoholPercentVol: 5.5,
      results: [value("alcohol", 5.5, "% vol"), value("total_so2", 40, "mg/L")],
    });
    expect(lines.filter((l) => l.market === "US")).toEqual([
      expect.objectContaining({
        status: "info",
        text: "27 CFR part 4 does not apply: it covers wine of 7 to 24 % vol, and this one has 5.50 % vol.",
      }),
    ]);
  });

  it("when the label's alcohol is unknown or a market has no rules, then the line says what is missing instead of guessing", () => {
    const lines = labelCheck({ category: "still", markets: ["EU", "CN"], labelledAlcoholPercentVol: null, results: base });
    expect(lines.find((l) => l.topic === "Alcohol on the label")).toMatchObject({
      status: "undetermined",
      text: "Enter the labelled alcohol on the lot to check it against the analysis.",
    });
    expect(lines.find((l) => l.market === "CN")).toMatchObject({ status: "undetermined" });
  });
});
