/**
 * EU maximum volatile acid content (Delegated Regulation (EU) 2019/934, Annex I, Part C): the general
 * limits of point 1, and the higher limits Member States set under point 3 for named wines, as the
 * Commission publishes them.
 */
import { and, needs, type Applicability, type LegalLimitRule, type WineProfile } from "./types.ts";

const PART_C = { document: "Commission Delegated Regulation (EU) 2019/934", edition: "OJ L 149, 7.6.2019" };
const LIST = {
  document:
    "European Commission (DG AGRI), list of derogations to the maximum volatile acid content of wine notified under point 3 of Part C of Annex I to Delegated Regulation (EU) 2019/934",
  edition: "update of February 2020",
};
const GENERAL_NOTE =
  "citation not yet confirmed: Part C and its point 1 are named in the Commission's published list of derogations; the values were read in UK SI 2011/2936 Sch. 2, which repeats 18/18/20 meq/L, not in the act";
const LIST_NOTE = "read in the source (the Commission's published list, February 2020 update)";

/** The list sets both conditions in the same entry for its French PGI wines. */
const pgiConditions = (p: WineProfile) =>
  needs(p, ["alcoholPercentVol", "sugarGPerL"], (q) => q.alcoholPercentVol > 15 && q.sugarGPerL > 45);
const not = (a: Applicability): Applicability => (a === true ? false : a === false ? true : a);

/** The general limits hold for wines no derogation names, and for a listed PGI wine that misses either condition. */
const general = (p: WineProfile): Applicability =>
  p.euVaDerogation === undefined ? true : p.euVaDerogation === 24.48 ? not(pgiConditions(p)) : false;

const DEROGATIONS: { value: NonNullable<WineProfile["euVaDerogation"]>; who: string; extra?: (p: WineProfile) => Applicability }[] = [
  { value: 30, who: "German PDO wine meeting the requirements for 'Eiswein' or 'Beerenauslese'" },
  { value: 35, who: "German PDO wine meeting the requirements for 'Trockenbeerenauslese'" },
  {
    value: 25,
    who: "French PDO wine named in the list (e.g. Barsac, Cadillac, Loupiac, Sainte-Croix-du-Mont), on the list's own conditions",
  },
  {
    value: 24.48,
    who: "French PGI wine named in the list, with a total alcoholic strength above 15 % vol and more than 45 g/L residual sugar",
    extra: pgiConditions,
  },
];

export const EU_VA_RULES: LegalLimitRule[] = [
  {
    id: "eu-va-white",
    parameter: "volatile_acidity",
    side: "max",
    value: 18,
    unit: "meq/L",
    condition: "white and rosé wine no derogation names",
    applies: (p) => and(p.colour !== "red", general(p)),
    citation: { ...PART_C, article: "Annex I, Part C, point 1" },
    confirmed: GENERAL_NOTE,
  },
  {
    id: "eu-va-red",
    parameter: "volatile_acidity",
    side: "max",
    value: 20,
    unit: "meq/L",
    condition: "red wine no derogation names",
    applies: (p) => and(p.colour === "red", general(p)),
    citation: { ...PART_C, article: "Annex I, Part C, point 1" },
    confirmed: GENERAL_NOTE,
  },
  ...DEROGATIONS.map((d): LegalLimitRule => ({
    id: `eu-va-derogation-${String(d.value).replace(".", "-")}`,
    parameter: "volatile_acidity",
    side: "max",
    value: d.value,
    unit: "meq/L",
    condition: d.who,
    applies: (p) => (p.euVaDerogation === d.value ? (d.extra?.(p) ?? true) : false),
    citation: { ...LIST, article: `point 3 derogations, ${d.value} meq/L` },
    confirmed: LIST_NOTE,
  })),
];
