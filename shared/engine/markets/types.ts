import type { Citation, WineCategory } from "../labelling.ts";
import type { ParameterId } from "../parameters.ts";
import type { UnitId } from "../units.ts";

export type Colour = "red" | "white" | "rose";

/** The OIV raises its 1 g/L sulphate limit for wines matured in cask for at least 2 years, sweetened or fortified, and further for others. */
export const OIV_SULPHATE_CASES = ["none", "cask-sweetened-or-fortified", "concentrated-must-or-naturally-sweet"] as const;
export type OivSulphateCase = (typeof OIV_SULPHATE_CASES)[number];

/** What a market's law needs to know about a wine to pick its limits. */
export interface WineProfile {
  colour: Colour;
  category: WineCategory;
  /** Glucose + fructose, g/L. */
  sugarGPerL?: number;
  harvestYear?: number;
  alcoholPercentVol?: number;
  /** EU wines listed for higher SO2 (2019/934 Annex I Part B A.2(c)–(e)). */
  euSo2Derogation?: 300 | 350 | 400;
  /** EU wines a Member State lists for a higher volatile acid limit (2019/934 Annex I Part C point 3), meq/L. */
  euVaDerogation?: 24.48 | 25 | 30 | 35;
  /** Made only from grapes harvested in EU wine-growing zones A and B (1308/2013 Annex VII Part II point 1). */
  euZonesAB?: boolean;
  /** One of the sweet white wines a country admits to the OIV's exceptional 400 mg/L SO2 limit. */
  oivSweetWhiteSo2Exception?: boolean;
  /** Which of the OIV's raised sulphate limits the wine falls under, if any (OIV-MA-C1-01). */
  oivSulphateCase?: OivSulphateCase;
  /** From vineyards treated with cryolite as national law allows (the OIV's fluoride limit is then 3 mg/L). */
  cryoliteTreatedVineyard?: boolean;
  /** Wine made from unameliorated juice of 28 °Brix or more (27 CFR 4.21). */
  usHighBrixJuice?: boolean;
  /** Filtered before filling; some turbidity limits exempt unfiltered wines. */
  filtered?: boolean;
  /** Made under the organic production rules. */
  organic?: boolean;
  /** Protected designation of origin, protected geographical indication, or neither. */
  protectedOrigin?: "pdo" | "pgi" | "none";
  /** Made from overripe grapes. */
  overripeGrapes?: boolean;
  /** A liqueur wine made from unfermented or only slightly fermented grape must. */
  liqueurFromUnfermentedMust?: boolean;
  /** A sparkling wine's category, where the law tells them apart. */
  sparklingCategory?: "sparkling" | "quality" | "quality-aromatic" | "aerated";
}

/** The facts of a profile in words, for a message that names what is missing. */
export const PROFILE_FACT_LABELS: Record<keyof WineProfile, string> = {
  colour: "colour",
  category: "category",
  sugarGPerL: "sugar content",
  harvestYear: "harvest year",
  alcoholPercentVol: "alcoholic strength",
  euSo2Derogation: "listing for a higher SO2 limit",
  euVaDerogation: "listing for a higher volatile acidity limit",
  euZonesAB: "whether its grapes come only from EU wine-growing zones A and B",
  oivSweetWhiteSo2Exception: "whether it is admitted to the OIV's sweet white wine exception for SO2",
  oivSulphateCase: "which OIV sulphate case it falls under",
  cryoliteTreatedVineyard: "whether its vineyards were treated with cryolite",
  usHighBrixJuice: "whether it is made from juice of 28 °Brix or more",
  filtered: "whether it is filtered",
  organic: "whether it is organic",
  protectedOrigin: "PDO or PGI status",
  overripeGrapes: "whether it is made from overripe grapes",
  liqueurFromUnfermentedMust: "whether the liqueur wine is made from unfermented or slightly fermented must",
  sparklingCategory: "sparkling wine category",
};

/** true/false, or the profile fields the rule needs but did not get. */
export type Applicability = true | false | { missing: (keyof WineProfile)[] };

export interface LegalLimitRule {
  id: string;
  parameter: ParameterId;
  /** max: results above the value do not conform; min: results below it do not. The value itself conforms. */
  side: "max" | "min";
  value: number;
  unit: UnitId;
  /** When the rule applies, in words. */
  condition: string;
  applies: (p: WineProfile) => Applicability;
  citation: Citation;
  /** How far the value was confirmed against its source. */
  confirmed: string;
}

export interface MarketPack {
  id: MarketId;
  name: string;
  /** Version of this pack in Cellarpact; bumped whenever a rule changes. */
  version: string;
  /** The state of the law the pack implements. */
  edition: string;
  rules: readonly LegalLimitRule[];
}

export type MarketId = "EU" | "GB" | "US" | "OIV" | "AU-NZ" | "UK-QWS" | "CN" | "CA-ON";

/** Helper for rules that need one profile field. */
export function needs<K extends keyof WineProfile>(
  p: WineProfile,
  keys: K[],
  test: (p: Required<Pick<WineProfile, K>> & WineProfile) => boolean,
): Applicability {
  const missing = keys.filter((k) => p[k] === undefined);
  if (missing.length) return { missing };
  return test(p as Required<Pick<WineProfile, K>> & WineProfile);
}

/** Both conditions must hold: false wins, then every missing fact is named. */
export function and(a: Applicability, b: Applicability): Applicability {
  if (a === false || b === false) return false;
  const missing = [...(a === true ? [] : a.missing), ...(b === true ? [] : b.missing)];
  return missing.length ? { missing: [...new Set(missing)] } : true;
}
