/** Labelling rules: EU sugar-content terms, alcohol tolerances and the sulphite statement trigger. */
import type { Reading } from "./parse.ts";

export interface Citation {
  document: string;
  article: string;
  edition: string;
}

// ---------------------------------------------------------------- sugar terms

export type StillSugarTerm = "dry" | "medium dry" | "medium sweet" | "sweet";

export interface SugarTermResult<T extends string> {
  /** Every term whose conditions the wine meets; the law's bands touch or overlap at some edges. */
  fits: T[];
  citation: Citation;
  note?: string;
}

const EU_2019_33_ANNEX_III = (part: string): Citation => ({
  document: "Commission Delegated Regulation (EU) 2019/33",
  article: `Annex III, Part ${part}`,
  edition: "OJ L 9, 11.1.2019",
});

/**
 * EU sugar-content terms for wines other than sparkling (2019/33 Annex III Part B). sugar and
 * total acidity in g/L, acidity as tartaric acid. At exactly 45 g/L both "medium sweet" (at most 45)
 * and "sweet" (at least 45) fit; both are returned and the note says so.
 */
export function euStillSugarTerms(sugarGPerL: number, totalAcidityTartaricGPerL?: number): SugarTermResult<StillSugarTerm> {
  const s = sugarGPerL;
  const balanced = (gap: number) => totalAcidityTartaricGPerL !== undefined && s - totalAcidityTartaricGPerL <= gap;
  const dry = s <= 4 || (s <= 9 && balanced(2));
  const mediumDry = !dry && (s <= 12 || (s <= 18 && balanced(10)));
  const mediumSweet = !dry && !mediumDry && s <= 45;
  const sweet = s >= 45;
  const fits: StillSugarTerm[] = [];
  if (dry) fits.push("dry");
  if (mediumDry) fits.push("medium dry");
  if (mediumSweet) fits.push("medium sweet");
  if (sweet) fits.push("sweet");
  return {
    fits,
    citation: EU_2019_33_ANNEX_III("B"),
    note:
      s === 45
        ? "At exactly 45 g/L the text allows both 'medium sweet' (at most 45 g/L) and 'sweet' (at least 45 g/L)."
        : totalAcidityTartaricGPerL === undefined && s > 4 && s <= 18
          ? "Without total acidity only the plain sugar limits (4 and 12 g/L) were applied."
          : undefined,
  };
}

export type SparklingSugarTerm = "brut nature" | "extra brut" | "brut" | "extra dry" | "dry" | "demi-sec" | "doux";

/** EU sugar-content terms for sparkling wines (2019/33 Annex III Part A); sugar in g/L. */
export function euSparklingSugarTerms(sugarGPerL: number): SugarTermResult<SparklingSugarTerm> {
  const s = sugarGPerL;
  const bands: [SparklingSugarTerm, boolean][] = [
    ["brut nature", s < 3],
    ["extra brut", s >= 0 && s <= 6],
    ["brut", s < 12],
    ["extra dry", s >= 12 && s <= 17],
    ["dry", s >= 17 && s <= 32],
    ["demi-sec", s >= 32 && s <= 50],
    ["doux", s > 50],
  ];
  return {
    fits: bands.filter(([, ok]) => ok).map(([t]) => t),
    citation: EU_2019_33_ANNEX_III("A"),
    note: s < 3 ? "'brut nature' also requires that no sugar was added after the secondary fermentation." : undefined,
  };
}

/** Allowed difference between the labelled and the analysed sugar content. */
export function euSugarLabelTolerance(category: "still" | "sparkling"): { gPerL: number; citation: Citation; confirmed: string } {
  return category === "still"
    ? {
        gPerL: 1,
        citation: { document: "Commission Delegated Regulation (EU) 2019/33", article: "Article 52(3)", edition: "OJ L 9, 11.1.2019" },
        confirmed: "read in the German text",
      }
    : {
        gPerL: 3,
        citation: {
          document: "Commission Regulation (EC) No 607/2009",
          article: "Article 58",
          edition: "predecessor text; the 2019/33 article is from memory",
        },
        confirmed: "secondary source",
      };
}

// ---------------------------------------------------------------- alcohol

export type WineCategory = "still" | "sparkling" | "quality-sparkling" | "semi-sparkling" | "liqueur";

export interface AlcoholCheck {
  withinTolerance: boolean;
  tolerance: number;
  allowed: { min: number; max: number };
  problems: string[];
  citation: Citation;
}

/**
 * EU: the labelled actual alcoholic strength is in whole or half units and may differ from the
 * analysis by 0.5 % vol, or 0.8 % vol for sparkling, semi-sparkling and liqueur wines and PDO/PGI
 * wines kept more than 3 years in bottle (607/2009 Art. 54(1); 2019/33 Art. 44 keeps it).
 */
export function euAlcoholLabelCheck(
  labelled: number,
  measured: number,
  category: WineCategory,
  opts: { agedInBottleOver3Years?: boolean } = {},
): AlcoholCheck {
  const wide = category !== "still" || opts.agedInBottleOver3Years === true;
  const tolerance = wide ? 0.8 : 0.5;
  const problems: string[] = [];
  if (Math.abs(labelled * 2 - Math.round(labelled * 2)) > 1e-9)
    problems.push(`The label must state whole or half units of % vol; ${labelled} is neither.`);
  const allowed = { min: round(labelled - tolerance), max: round(labelled + tolerance) };
  const within = measured >= allowed.min - 1e-9 && measured <= allowed.max + 1e-9;
  if (!within)
    problems.push(`The analysis (${measured} % vol) is outside ${allowed.min}–${allowed.max} % vol for a label of ${labelled} % vol.`);
  return {
    withinTolerance: within,
    tolerance,
    allowed,
    problems,
    citation: {
      document: "Commission Delegated Regulation (EU) 2019/33",
      article: "Article 44 (tolerance as in Reg. (EC) 607/2009 Art. 54(1))",
      edition: "OJ L 9, 11.1.2019",
    },
  };
}

/** US still-wine tax classes by % alcohol by volume (26 U.S.C. 5041(b)): the boundary at 16 % is read in the source; 21 and 24 are from memory. */
export function usTaxClass(abv: number): "not over 16%" | "over 16% to 21%" | "over 21% to 24%" | "over 24%" {
  if (abv <= 16) return "not over 16%";
  if (abv <= 21) return "over 16% to 21%";
  if (abv <= 24) return "over 21% to 24%";
  return "over 24%";
}

/**
 * US: 1.5 percentage points for wines of 14 % or less, 1.0 point above 14 %; and whatever the
 * tolerance, the analysis must fall in the same tax class as the label (27 CFR 4.36).
 */
export function usAlcoholLabelCheck(
  labelled: number,
  measured: number,
): AlcoholCheck & { taxClassLabel: string; taxClassMeasured: string } {
  const tolerance = labelled <= 14 ? 1.5 : 1.0;
  const allowed = { min: round(labelled - tolerance), max: round(labelled + tolerance) };
  const problems: string[] = [];
  let within = measured >= allowed.min - 1e-9 && measured <= allowed.max + 1e-9;
  if (!within) problems.push(`The analysis (${measured} %) is outside ${allowed.min}–${allowed.max} % for a label of ${labelled} %.`);
  const taxClassLabel = usTaxClass(labelled);
  const taxClassMeasured = usTaxClass(measured);
  if (taxClassLabel !== taxClassMeasured) {
    within = false;
    problems.push(`The tolerance cannot move a wine across a tax class: label "${taxClassLabel}", analysis "${taxClassMeasured}".`);
  }
  return {
    withinTolerance: within,
    tolerance,
    allowed,
    problems,
    taxClassLabel,
    taxClassMeasured,
    citation: { document: "27 CFR", article: "§ 4.36", edition: "as explained by TTB's labelling guidance" },
  };
}

// ---------------------------------------------------------------- sulphites

export type SulphiteMarket = "EU" | "US";

export interface SulphiteTrigger {
  required: boolean | "undetermined";
  thresholdMgPerL: number;
  wording: string;
  citation: Citation;
  reason: string;
}

/**
 * Whether the label must declare sulphites. EU: total SO2 "more than 10 mg/L" (Reg. (EU) 1169/2011
 * Annex II item 12). US: "10 or more parts per million" (27 CFR 4.32(e)). Exactly 10 therefore
 * differs: not required in the EU, required in the US.
 */
export function sulphiteStatement(market: SulphiteMarket, totalSo2: Reading): SulphiteTrigger {
  const eu = market === "EU";
  const threshold = 10;
  const base = eu
    ? {
        thresholdMgPerL: threshold,
        wording: "Contains sulphites",
        citation: { document: "Regulation (EU) No 1169/2011", article: "Annex II, item 12", edition: "OJ L 304, 22.11.2011" },
      }
    : {
        thresholdMgPerL: threshold,
        wording: "Contains sulfites",
        citation: { document: "27 CFR", article: "§ 4.32(e)", edition: "current" },
      };
  const triggers = (x: number) => (eu ? x > threshold : x >= threshold);
  switch (totalSo2.kind) {
    case "value":
      return {
        ...base,
        required: triggers(totalSo2.value),
        reason: `total SO2 ${totalSo2.value} mg/L ${triggers(totalSo2.value) ? "reaches" : "stays under"} the ${eu ? "more than 10" : "10 or more"} mg/L trigger`,
      };
    case "below":
      if (totalSo2.limit !== null && totalSo2.limit <= threshold) {
        return { ...base, required: false, reason: `total SO2 below ${totalSo2.limit} mg/L, so under the trigger` };
      }
      return {
        ...base,
        required: "undetermined",
        reason: "the reported limit of quantification is above the trigger; ask for a more sensitive method",
      };
    case "above":
      // "> 8" could be 9 or 12: only a reading above the threshold itself settles it.
      return totalSo2.limit >= threshold
        ? { ...base, required: true, reason: `total SO2 above ${totalSo2.limit} mg/L, so over the trigger` }
        : {
            ...base,
            required: "undetermined",
            reason: `total SO2 above ${totalSo2.limit} mg/L may lie on either side of the ${eu ? "more than 10" : "10 or more"} mg/L trigger; ask for the value`,
          };
    case "presence":
      return { ...base, required: "undetermined", reason: "total SO2 must be reported as a number" };
  }
}

const round = (x: number) => Math.round(x * 1000) / 1000;
