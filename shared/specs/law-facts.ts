/**
 * The facts about a wine that the law asks before it picks a limit (organic, PDO/PGI, a listing for a
 * higher limit…). A wine keeps the ones its buyer has stated; a fact left unstated is never guessed:
 * the rules that need it are shown as undetermined.
 */
import { z } from "zod";
import {
  OIV_SULPHATE_CASES,
  PROFILE_FACT_LABELS,
  wineProfileSchema,
  type MarketId,
  type WineCategory,
  type WineProfile,
} from "../engine/index.ts";

export const LAW_FACT_KEYS = [
  "organic",
  "protectedOrigin",
  "filtered",
  "overripeGrapes",
  "sparklingCategory",
  "liqueurFromUnfermentedMust",
  "euSo2Derogation",
  "euVaDerogation",
  "euZonesAB",
  "oivSweetWhiteSo2Exception",
  "oivSulphateCase",
  "cryoliteTreatedVineyard",
  "usHighBrixJuice",
] as const satisfies readonly (keyof WineProfile)[];
export type LawFactKey = (typeof LAW_FACT_KEYS)[number];
export type WineLawFacts = Partial<Pick<WineProfile, LawFactKey>>;

export const wineLawFactsSchema = wineProfileSchema
  .pick(Object.fromEntries(LAW_FACT_KEYS.map((k) => [k, true])) as { [K in LawFactKey]: true })
  .strict();

const YES_NO = [
  { value: true, label: "Yes" },
  { value: false, label: "No" },
] as const;

/** Each fact with the choices a form offers; the empty choice ("Not stated") is always added. */
export const LAW_FACT_CHOICES: Record<LawFactKey, readonly { value: string | number | boolean; label: string }[]> = {
  organic: YES_NO,
  protectedOrigin: [
    { value: "pdo", label: "PDO" },
    { value: "pgi", label: "PGI" },
    { value: "none", label: "Neither" },
  ],
  filtered: YES_NO,
  overripeGrapes: YES_NO,
  sparklingCategory: [
    { value: "sparkling", label: "Sparkling wine" },
    { value: "quality", label: "Quality sparkling wine" },
    { value: "quality-aromatic", label: "Quality aromatic sparkling wine" },
    { value: "aerated", label: "Aerated sparkling wine" },
  ],
  liqueurFromUnfermentedMust: YES_NO,
  euSo2Derogation: [300, 350, 400].map((v) => ({ value: v, label: `Listed for ${v} mg/L` })),
  euVaDerogation: [24.48, 25, 30, 35].map((v) => ({ value: v, label: `Listed for ${v} meq/L` })),
  euZonesAB: YES_NO,
  oivSweetWhiteSo2Exception: YES_NO,
  oivSulphateCase: OIV_SULPHATE_CASES.map((v) => ({
    value: v,
    label: {
      none: "None of the raised cases",
      "cask-sweetened-or-fortified": "Cask-aged 2 years, sweetened or fortified",
      "concentrated-must-or-naturally-sweet": "Concentrated must added, or naturally sweet",
    }[v],
  })),
  cryoliteTreatedVineyard: YES_NO,
  usHighBrixJuice: YES_NO,
};

/** The question as the form asks it, from the engine's own words for the fact. */
export const lawFactQuestion = (k: LawFactKey) => PROFILE_FACT_LABELS[k].replace(/^./, (c) => c.toUpperCase());

/** Facts in words, for the contract page, documents and the trail. */
export function lawFactsText(facts: WineLawFacts): string[] {
  return LAW_FACT_KEYS.filter((k) => facts[k] !== undefined).map((k) => {
    const choice = LAW_FACT_CHOICES[k].find((c) => c.value === facts[k]);
    return `${lawFactQuestion(k)}: ${choice?.label ?? String(facts[k])}`;
  });
}

export const lawFactsUpdateSchema = z.object({ lawFacts: wineLawFactsSchema });

/** Which markets' rules ask each fact, and for which styles (none listed: every style). */
const ASKED_BY: Record<LawFactKey, { markets: readonly MarketId[]; categories?: readonly WineCategory[] }> = {
  organic: { markets: ["EU"] },
  protectedOrigin: { markets: ["UK-QWS"] },
  filtered: { markets: ["CA-ON"] },
  overripeGrapes: { markets: ["EU", "GB"] },
  sparklingCategory: { markets: ["EU", "GB"], categories: ["sparkling", "quality-sparkling"] },
  liqueurFromUnfermentedMust: { markets: ["OIV"], categories: ["liqueur"] },
  euSo2Derogation: { markets: ["EU", "GB"], categories: ["still", "semi-sparkling"] },
  euVaDerogation: { markets: ["EU"] },
  euZonesAB: { markets: ["EU", "GB"], categories: ["still"] },
  oivSweetWhiteSo2Exception: { markets: ["OIV"] },
  oivSulphateCase: { markets: ["OIV"] },
  cryoliteTreatedVineyard: { markets: ["OIV"] },
  usHighBrixJuice: { markets: ["US"] },
};

/** The facts worth asking for this wine: those its markets' rules use, and any already stated. */
export function relevantLawFacts(wine: {
  markets: readonly MarketId[];
  category: WineCategory;
  lawFacts: WineLawFacts | null;
}): LawFactKey[] {
  return LAW_FACT_KEYS.filter((k) => {
    if (wine.lawFacts?.[k] !== undefined) return true;
    const asked = ASKED_BY[k];
    return asked.markets.some((m) => wine.markets.includes(m)) && (!asked.categories || asked.categories.includes(wine.category));
  });
}

/** The form sends each choice as text ("" when not stated); this reads it back into the body the route takes. */
export const lawFactsFormSchema = z.object({
  lawFacts: z
    .object(Object.fromEntries(LAW_FACT_KEYS.map((k) => [k, z.string().optional()])) as Record<LawFactKey, z.ZodOptional<z.ZodString>>)
    .transform((v) =>
      Object.fromEntries(
        Object.entries(v)
          .filter(([, x]) => x !== undefined && x !== "")
          .map(([k, x]) => [k, JSON.parse(x!)]),
      ),
    )
    .pipe(wineLawFactsSchema),
});

/** A fact's choice as the form's text. */
export const lawFactFormValue = (v: unknown) => (v === undefined ? "" : JSON.stringify(v));
