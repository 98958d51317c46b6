/** European Union wine and food law limits that a result can be checked against. */
import { needs, type LegalLimitRule, type MarketPack } from "./types.ts";
import { EU_ORGANIC_SO2_RULES, EU_SO2_RULES } from "./eu-so2.ts";
import { EU_CATEGORY_RULES } from "./eu-categories.ts";
import { EU_VA_RULES } from "./eu-volatile-acidity.ts";

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
  confirmed:
    "citation not yet confirmed: the 2023/915 row was not read; the values (introduced by Reg. (EU) 2021/1317) were read in secondary sources",
});

export const EU_PACK: MarketPack = {
  id: "EU",
  name: "European Union",
  version: "2026.4",
  edition: "Regulations in force on 1 December 2026 as read for Cellarpact",
  rules: [
    ...EU_SO2_RULES,
    ...EU_ORGANIC_SO2_RULES,
    ...EU_CATEGORY_RULES,
    ...EU_VA_RULES,
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
        p.category === "liqueur"
          ? false
          : needs(p, ["harvestYear", "alcoholPercentVol"], (q) => q.harvestYear >= 2005 && q.alcoholPercentVol < 15),
      citation: {
        document: "Commission Regulation (EU) 2023/915",
        article: "Annex I, ochratoxin A: wine",
        edition: "consolidated text in force",
      },
      confirmed:
        "citation not yet confirmed: the value was read in the repealed Reg. (EC) No 123/2005, Annex point 2.2.4 (footnotes b and d); the 2023/915 row was not read",
    },
  ],
};
