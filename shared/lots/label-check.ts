/**
 * What the engine knows about a lot's label, from its latest results: bound and molecular SO2,
 * the labelled alcohol against each market's tolerance, the sugar-content term, and whether the
 * sulphite statement is required, each line with its citation. It informs; the market's own law
 * and an accredited laboratory decide.
 */
import {
  boundSo2,
  convert,
  DEFAULT_SO2_PKA,
  displayValue,
  euAlcoholLabelCheck,
  euSparklingSugarTerms,
  euStillSugarTerms,
  molecularSo2,
  quantity,
  retainedInGb,
  sulphiteStatement,
  usAlcoholLabelCheck,
  type Citation,
  type MarketId,
  type Reading,
  type UnitId,
  type WineCategory,
} from "../engine/index.ts";

export interface LabelCheckLine {
  topic: "Bound SO2" | "Molecular SO2" | "Alcohol on the label" | "Sugar-content term" | "Sulphite statement";
  market: MarketId | null;
  status: "ok" | "problem" | "info" | "undetermined";
  text: string;
  citation: Citation | null;
}

export interface LabelCheckInput {
  category: WineCategory;
  markets: readonly MarketId[];
  labelledAlcoholPercentVol: number | null;
  /** The lot's results, latest last; the latest result of each parameter is used. */
  results: readonly { parameter: string; reading: Reading; unit: UnitId }[];
}

const DERIVED: Citation = {
  document: "Cellarpact engine, shared/engine/derived.ts",
  article: "bound = total − free; molecular = free / (1 + 10^(pH − pKa))",
  edition: "common practice",
};

/** The latest numeric value of a parameter, in `unit`; the latest reading of any kind as well. */
function latest(results: LabelCheckInput["results"], parameter: string, unit: UnitId) {
  const r = [...results].reverse().find((x) => x.parameter === parameter);
  if (!r) return { reading: null, value: null };
  const value = r.reading.kind === "value" ? convert(r.reading.value, r.unit, unit) : null;
  const reading: Reading =
    r.reading.kind === "value"
      ? { kind: "value", value: value! }
      : r.reading.kind === "below" && r.reading.limit !== null
        ? { kind: "below", limit: convert(r.reading.limit, r.unit, unit) }
        : r.reading;
  return { reading, value };
}

export function labelCheck(input: LabelCheckInput): LabelCheckLine[] {
  const lines: LabelCheckLine[] = [];
  const free = latest(input.results, "free_so2", "mg/L");
  const total = latest(input.results, "total_so2", "mg/L");
  const ph = latest(input.results, "ph", "pH");
  const sugar = latest(input.results, "residual_sugar", "g/L");
  const acidity = latest(input.results, "total_acidity", "g/L as tartaric acid");
  const alcohol = latest(input.results, "alcohol", "% vol");

  if (free.value !== null && total.value !== null && free.value <= total.value) {
    const b = boundSo2(quantity(total.value, "mg/L"), quantity(free.value, "mg/L"));
    lines.push({
      topic: "Bound SO2",
      market: null,
      status: "info",
      text: `${displayValue("bound_so2", b, "mg/L")} mg/L (total ${displayValue("total_so2", total.value, "mg/L")} − free ${displayValue("free_so2", free.value, "mg/L")} mg/L).`,
      citation: DERIVED,
    });
  }
  if (free.value !== null && ph.value !== null) {
    const m = molecularSo2(quantity(free.value, "mg/L"), quantity(ph.value, "pH"));
    lines.push({
      topic: "Molecular SO2",
      market: null,
      status: "info",
      text: `${displayValue("molecular_so2", m, "mg/L")} mg/L at pH ${displayValue("ph", ph.value, "pH")} (pKa ${DEFAULT_SO2_PKA}).`,
      citation: DERIVED,
    });
  }

  for (const market of input.markets) {
    const abv = alcohol.value ?? input.labelledAlcoholPercentVol;
    if (market === "US" && abv !== null && (abv < 7 || abv > 24)) {
      lines.push({
        topic: "Alcohol on the label",
        market,
        status: "info",
        text: `27 CFR part 4 does not apply: it covers wine of 7 to 24 % vol, and this one has ${displayValue("alcohol", abv, "% vol")} % vol.`,
        citation: { document: "27 CFR", article: "§ 4.6", edition: "T.D. TTB-158, 85 FR 18721 (2020)" },
      });
      continue;
    }
    if (market === "EU" || market === "US" || market === "GB") {
      // Great Britain kept the EU labelling rules in its retained law; the same checks apply, cited as retained.
      const rules = market === "US" ? "US" : "EU";
      const retained = (c: Citation): Citation => (market === "GB" ? retainedInGb(c) : c);
      if (input.labelledAlcoholPercentVol === null || alcohol.value === null) {
        lines.push({
          topic: "Alcohol on the label",
          market,
          status: "undetermined",
          text:
            input.labelledAlcoholPercentVol === null
              ? "Enter the labelled alcohol on the lot to check it against the analysis."
              : "No numeric alcohol result yet.",
          citation: null,
        });
      } else {
        const c =
          rules === "EU"
            ? euAlcoholLabelCheck(input.labelledAlcoholPercentVol, alcohol.value, input.category)
            : usAlcoholLabelCheck(input.labelledAlcoholPercentVol, alcohol.value);
        const measured = displayValue("alcohol", alcohol.value, "% vol");
        lines.push({
          topic: "Alcohol on the label",
          market,
          status: c.withinTolerance && c.problems.length === 0 ? "ok" : "problem",
          text: c.problems.length
            ? c.problems.join(" ")
            : `Label ${input.labelledAlcoholPercentVol} % vol, analysis ${measured} % vol: within ±${c.tolerance} (${c.allowed.min}–${c.allowed.max} % vol).`,
          citation: retained(c.citation),
        });
      }
      const s = sulphiteStatement(rules, total.reading ?? { kind: "presence", present: true });
      lines.push({
        topic: "Sulphite statement",
        market,
        status: total.reading === null || s.required === "undetermined" ? "undetermined" : "info",
        text:
          total.reading === null
            ? "No total SO2 result yet."
            : s.required === "undetermined"
              ? `Undetermined: ${s.reason}.`
              : s.required
                ? `Required: "${s.wording}" (${s.reason}).`
                : `Not required (${s.reason}).`,
        citation: retained(s.citation),
      });
    } else {
      lines.push({
        topic: "Sulphite statement",
        market,
        status: "undetermined",
        text: `Cellarpact has no labelling rules for ${market}; follow that market's regulation.`,
        citation: null,
      });
    }
  }

  const sugarMarket = input.markets.find((m) => m === "EU" || m === "GB");
  if (sugarMarket) {
    if (sugar.value === null) {
      lines.push({
        topic: "Sugar-content term",
        market: sugarMarket,
        status: "undetermined",
        text: "No numeric residual sugar result yet.",
        citation: null,
      });
    } else {
      const sparkling = input.category === "sparkling" || input.category === "quality-sparkling";
      const terms = sparkling ? euSparklingSugarTerms(sugar.value) : euStillSugarTerms(sugar.value, acidity.value ?? undefined);
      const at = `${displayValue("residual_sugar", sugar.value, "g/L")} g/L sugar${!sparkling && acidity.value !== null ? `, ${displayValue("total_acidity", acidity.value, "g/L as tartaric acid")} g/L total acidity as tartaric acid` : ""}`;
      lines.push({
        topic: "Sugar-content term",
        market: sugarMarket,
        status: terms.fits.length ? "info" : "undetermined",
        text: `${terms.fits.length ? `May be labelled ${terms.fits.map((f) => `"${f}"`).join(" or ")}` : "No term fits"} at ${at}.${terms.note ? ` ${terms.note}` : ""}`,
        citation: sugarMarket === "GB" ? retainedInGb(terms.citation) : terms.citation,
      });
    }
  }
  return lines;
}
