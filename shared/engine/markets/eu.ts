/** European Union wine and food law limits that a result can be checked against. */
import { needs, type LegalLimitRule, type MarketPack, type WineProfile } from "./types.ts";

const SO2 = { document: "Commission Delegated Regulation (EU) 2019/934", edition: "OJ L 149, 7.6.2019" };
const stillOrOther = (p: WineProfile) => p.category === "still" || p.category === "semi-sparkling";
const notSpecial = (p: WineProfile) => p.euSo2Derogation === undefined;

const so2Rules: LegalLimitRule[] = [
  { id: "eu-so2-red-dry", value: 150, colour: "red", sugarHigh: false, point: "A.1(a)" },
  { id: "eu-so2-white-dry", value: 200, colour: "white-rose", sugarHigh: false, point: "A.1(b)" },
  { id: "eu-so2-red-sweet", value: 200, colour: "red", sugarHigh: true, point: "A.2(a)" },
  { id: "eu-so2-white-sweet", value: 250, colour: "white-rose", sugarHigh: true, point: "A.2(b)" },
].map((r) => ({
  id: r.id,
  parameter: "total_so2" as const,
  side: "max" as const,
  value: r.value,
  unit: "mg/L" as const,
  condition: `${r.colour === "red" ? "red" : "white and rosé"} wine other than sparkling and liqueur wine, sugar ${r.sugarHigh ? "at least 5" : "below 5"} g/L`,
  // A.1 holds for every dry wine, listed or not; A.2(a)/(b) for sweet wines the derogations of A.2(c)–(e) do not name.
  applies: (p: WineProfile) =>
    stillOrOther(p) && (r.colour === "red") === (p.colour === "red") && (!r.sugarHigh || notSpecial(p))
      ? needs(p, ["sugarGPerL"], (q) => (q.sugarGPerL >= 5) === r.sugarHigh)
      : false,
  citation: { ...SO2, article: `Annex I, Part B, section A, point ${r.point}` },
  confirmed: "read in the source (legislation.gov.uk copy)",
}));

const lead = (id: string, value: number, from: number, to: number | null, liqueur: boolean): LegalLimitRule => ({
  id,
  parameter: "lead",
  side: "max",
  value,
  unit: "mg/kg",
  condition: `${liqueur ? "liqueur wine" : "wine other than liqueur wine"} from the ${from}${to ? `–${to}` : " and later"} harvests`,
  applies: (p) =>
    (p.category === "liqueur") === liqueur
      ? needs(p, ["harvestYear"], (q) => q.harvestYear >= from && (to === null || q.harvestYear <= to))
      : false,
  citation: { document: "Commission Regulation (EU) 2023/915", article: "Annex I, lead: wine", edition: "consolidated text in force" },
  confirmed: "citation not yet confirmed: the 2023/915 row was not read; the values (introduced by Reg. (EU) 2021/1317) were read in secondary sources",
});

export const EU_PACK: MarketPack = {
  id: "EU",
  name: "European Union",
  version: "2026.3",
  edition: "Regulations in force on 1 December 2026 as read for Cellarpact",
  rules: [
    ...so2Rules,
    ...([300, 350, 400] as const).map(
      (v, i): LegalLimitRule => ({
        id: `eu-so2-derogation-${v}`,
        parameter: "total_so2",
        side: "max",
        value: v,
        unit: "mg/L",
        condition: `wine listed for ${v} mg/L (e.g. ${["Spätlese", "Auslese", "Beerenauslese, Eiswein, Sauternes"][i]}) with sugar of at least 5 g/L`,
        // Point 2 raises the limit only "as regards wines with a sugar content ... of not less than five grams per litre".
        applies: (p) => (p.euSo2Derogation === v ? needs(p, ["sugarGPerL"], (q) => q.sugarGPerL >= 5) : false),
        citation: { ...SO2, article: `Annex I, Part B, section A, point 2(${["c", "d", "e"][i]})` },
        confirmed: v === 300 ? "read in the source (legislation.gov.uk copy of 2019/934, Annex I Part B A.2(c))" : "citation not yet confirmed: the value was read in a secondary source, the point letter not read in the act",
      }),
    ),
    {
      id: "eu-so2-sparkling",
      parameter: "total_so2",
      side: "max",
      value: 235,
      unit: "mg/L",
      condition: "sparkling wine",
      applies: (p) => p.category === "sparkling",
      citation: { ...SO2, article: "Annex I, Part B, section A (sparkling wines)" },
      confirmed: "citation not yet confirmed: the value was read in a secondary source, not in the act itself",
    },
    {
      id: "eu-so2-quality-sparkling",
      parameter: "total_so2",
      side: "max",
      value: 185,
      unit: "mg/L",
      condition: "quality sparkling wine",
      applies: (p) => p.category === "quality-sparkling",
      citation: { ...SO2, article: "Annex I, Part B, section A (quality sparkling wines)" },
      confirmed: "citation not yet confirmed: the value was read in a secondary source, not in the act itself",
    },
    {
      id: "eu-so2-liqueur",
      parameter: "total_so2",
      side: "max",
      value: 150,
      unit: "mg/L",
      condition: "liqueur wine, sugar below 5 g/L",
      applies: (p) => (p.category === "liqueur" ? needs(p, ["sugarGPerL"], (q) => q.sugarGPerL < 5) : false),
      citation: { ...SO2, article: "Annex I, Part B, section A (liqueur wines)" },
      confirmed: "citation not yet confirmed: the value was read in a secondary source, not in the act itself",
    },
    {
      id: "eu-so2-liqueur-sweet",
      parameter: "total_so2",
      side: "max",
      value: 200,
      unit: "mg/L",
      condition: "liqueur wine, sugar at least 5 g/L",
      applies: (p) => (p.category === "liqueur" ? needs(p, ["sugarGPerL"], (q) => q.sugarGPerL >= 5) : false),
      citation: { ...SO2, article: "Annex I, Part B, section A (liqueur wines)" },
      confirmed: "citation not yet confirmed: the value was read in a secondary source, not in the act itself",
    },
    {
      id: "eu-va-white",
      parameter: "volatile_acidity",
      side: "max",
      value: 18,
      unit: "meq/L",
      condition: "white and rosé wine",
      applies: (p) => p.colour !== "red",
      citation: { document: "Commission Delegated Regulation (EU) 2019/934", article: "Annex I, Part C (volatile acid content)", edition: "OJ L 149, 7.6.2019" },
      confirmed: "citation not yet confirmed: the part letter was not read in the act; the values were read in UK SI 2011/2936 Sch. 2, which repeats 18/18/20 meq/L",
    },
    {
      id: "eu-va-red",
      parameter: "volatile_acidity",
      side: "max",
      value: 20,
      unit: "meq/L",
      condition: "red wine",
      applies: (p) => p.colour === "red",
      citation: { document: "Commission Delegated Regulation (EU) 2019/934", article: "Annex I, Part C (volatile acid content)", edition: "OJ L 149, 7.6.2019" },
      confirmed: "citation not yet confirmed: the part letter was not read in the act; the values were read in UK SI 2011/2936 Sch. 2, which repeats 18/18/20 meq/L",
    },
    {
      id: "eu-ta-min",
      parameter: "total_acidity",
      side: "min",
      value: 3.5,
      unit: "g/L as tartaric acid",
      condition: "wine",
      applies: () => true,
      citation: { document: "Regulation (EU) No 1308/2013", article: "Annex VII, Part II, point 1", edition: "OJ L 347, 20.12.2013" },
      confirmed: "citation not yet confirmed: the value was read in a secondary source, not in the act itself",
    },
    lead("eu-lead-2001", 0.2, 2001, 2015, false),
    lead("eu-lead-2016", 0.15, 2016, 2021, false),
    lead("eu-lead-2022", 0.1, 2022, null, false),
    lead("eu-lead-liqueur-2022", 0.15, 2022, null, true),
    {
      id: "eu-ota",
      parameter: "ochratoxin_a",
      side: "max",
      value: 2.0,
      unit: "µg/kg",
      condition: "wine below 15 % vol other than liqueur wine, from the 2005 harvest",
      applies: (p) =>
        p.category === "liqueur" ? false : needs(p, ["harvestYear", "alcoholPercentVol"], (q) => q.harvestYear >= 2005 && q.alcoholPercentVol < 15),
      citation: { document: "Commission Regulation (EU) 2023/915", article: "Annex I, ochratoxin A: wine", edition: "consolidated text in force" },
      confirmed: "citation not yet confirmed: the value was read in the repealed Reg. (EC) No 123/2005, Annex point 2.2.4 (footnotes b and d); the 2023/915 row was not read",
    },
  ],
};
