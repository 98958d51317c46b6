/**
 * EU total SO2 limits (Delegated Regulation (EU) 2019/934, Annex I, Part B) and the lower limits for
 * organic wine, which the organic rules set as those limits lowered (Implementing Regulation (EU) 2021/1165).
 */
import { and, needs, type Applicability, type LegalLimitRule, type WineProfile } from "./types.ts";

const SO2 = { document: "Commission Delegated Regulation (EU) 2019/934", edition: "OJ L 149, 7.6.2019" };
const READ_A = "read in the source (legislation.gov.uk copy of 2019/934, Annex I Part B, section A)";
const SECTION_NOT_READ =
  "citation not yet confirmed: the value was read in secondary sources; the section letter follows the act's order (A other wines, B liqueur wines, C sparkling wines), of which only section A was read";

/** Section A covers wines "other than sparkling wines and liqueur wines". */
const sectionA = (p: WineProfile) => p.category === "still" || p.category === "semi-sparkling";
const quality = (p: WineProfile) => p.category === "quality-sparkling";
const sugar = (p: WineProfile, test: (g: number) => boolean) => needs(p, ["sugarGPerL"], (q) => test(q.sugarGPerL));
const when = (holds: boolean, then: () => Applicability): Applicability => (holds ? then() : false);

interface So2Rule {
  id: string;
  value: number;
  condition: string;
  applies: (p: WineProfile) => Applicability;
  article: string;
  confirmed: string;
  /** A.1's dry wines, for which the organic rules set their own figure below 2 g/L sugar. */
  dryColour?: "red" | "white";
}

const CONVENTIONAL: So2Rule[] = [
  ...(
    [
      ["red-dry", 150, "red", false, "A.1(a)"],
      ["white-dry", 200, "white-rose", false, "A.1(b)"],
      ["red-sweet", 200, "red", true, "A.2(a)"],
      ["white-sweet", 250, "white-rose", true, "A.2(b)"],
    ] as const
  ).map(([name, value, colour, sweet, point]): So2Rule => ({
    id: `eu-so2-${name}`,
    value,
    condition: `${colour === "red" ? "red" : "white and rosé"} wine other than sparkling and liqueur wine, sugar ${sweet ? "at least 5" : "below 5"} g/L`,
    // A.1 holds for every dry wine, listed or not; A.2(a)/(b) for sweet wines the derogations of A.2(c)–(e) do not name.
    applies: (p) =>
      when(sectionA(p) && (colour === "red") === (p.colour === "red") && (!sweet || p.euSo2Derogation === undefined), () =>
        sugar(p, (g) => g >= 5 === sweet),
      ),
    article: `Annex I, Part B, section A, point ${point}`,
    confirmed: READ_A,
    ...(sweet ? {} : { dryColour: colour === "red" ? ("red" as const) : ("white" as const) }),
  })),
  ...([300, 350, 400] as const).map((v, i): So2Rule => ({
    id: `eu-so2-derogation-${v}`,
    value: v,
    condition: `wine listed for ${v} mg/L (e.g. ${["Spätlese", "Auslese", "Beerenauslese, Eiswein, Sauternes"][i]}) with sugar of at least 5 g/L`,
    // Point 2 raises the limit only "as regards wines with a sugar content ... of not less than five grams per litre".
    applies: (p) => when(p.euSo2Derogation === v, () => sugar(p, (g) => g >= 5)),
    article: `Annex I, Part B, section A, point 2(${["c", "d", "e"][i]})`,
    confirmed:
      v === 300 ? READ_A : "citation not yet confirmed: the value was read in a secondary source, the point letter not read in the act",
  })),
  {
    id: "eu-so2-liqueur",
    value: 150,
    condition: "liqueur wine, sugar below 5 g/L",
    applies: (p) => when(p.category === "liqueur", () => sugar(p, (g) => g < 5)),
    article: "Annex I, Part B, section B (liqueur wines), point (a)",
    confirmed: SECTION_NOT_READ,
  },
  {
    id: "eu-so2-liqueur-sweet",
    value: 200,
    condition: "liqueur wine, sugar at least 5 g/L",
    applies: (p) => when(p.category === "liqueur", () => sugar(p, (g) => g >= 5)),
    article: "Annex I, Part B, section B (liqueur wines), point (b)",
    confirmed: SECTION_NOT_READ,
  },
  {
    id: "eu-so2-quality-sparkling",
    value: 185,
    condition: "every category of quality sparkling wine, aromatic included",
    applies: quality,
    article: "Annex I, Part B, section C (sparkling wines), point 1(a)",
    confirmed: SECTION_NOT_READ,
  },
  {
    id: "eu-so2-sparkling",
    value: 235,
    condition: "other sparkling wine (sparkling and aerated sparkling wine)",
    applies: (p) => p.category === "sparkling",
    article: "Annex I, Part B, section C (sparkling wines), point 1(b)",
    confirmed: SECTION_NOT_READ,
  },
];

const ORGANIC = {
  document: "Commission Implementing Regulation (EU) 2021/1165",
  article: "Annex V (oenological products and processes for organic wine), sulphur dioxide",
  edition: "OJ L 253, 16.7.2021",
};
const ORGANIC_NOTE =
  "citation not yet confirmed: the values (100 and 150 mg/L below 2 g/L sugar, otherwise the conventional limit less 30 mg/L) were read in secondary sources; the point in Annex V was not read";
const organic = (p: WineProfile) => needs(p, ["organic"], (q) => q.organic);

/** Organic wine keeps every conventional limit and adds a lower one: 100/150 mg/L for dry A.1 wines below 2 g/L sugar, else the conventional value less 30 mg/L. */
function organicVariants(r: So2Rule): So2Rule[] {
  const lowered: So2Rule = {
    ...r,
    id: r.id.replace(/^eu-so2-/, "eu-organic-so2-"),
    value: r.value - 30,
    condition: `organic ${r.condition}${r.dryColour ? ", sugar at least 2 g/L" : ""} (the limit less 30 mg/L)`,
    applies: (p) => and(and(r.applies(p), organic(p)), r.dryColour ? sugar(p, (g) => g >= 2) : true),
    confirmed: ORGANIC_NOTE,
  };
  if (!r.dryColour) return [lowered];
  const red = r.dryColour === "red";
  const dry: So2Rule = {
    ...r,
    id: `eu-organic-so2-${red ? "red" : "white"}-below-2`,
    value: red ? 100 : 150,
    condition: `organic ${red ? "red" : "white and rosé"} wine other than sparkling and liqueur wine, sugar below 2 g/L`,
    applies: (p) =>
      and(
        and(r.applies(p), organic(p)),
        sugar(p, (g) => g < 2),
      ),
    confirmed: ORGANIC_NOTE,
  };
  return [dry, lowered];
}

const toRule = (r: So2Rule, citation: { document: string; article: string; edition: string }): LegalLimitRule => ({
  id: r.id,
  parameter: "total_so2",
  side: "max",
  value: r.value,
  unit: "mg/L",
  condition: r.condition,
  applies: r.applies,
  citation,
  confirmed: r.confirmed,
});

export const EU_SO2_RULES: LegalLimitRule[] = CONVENTIONAL.map((r) => toRule(r, { ...SO2, article: r.article }));

export const EU_ORGANIC_SO2_RULES: LegalLimitRule[] = CONVENTIONAL.flatMap(organicVariants).map((r) => toRule(r, ORGANIC));
