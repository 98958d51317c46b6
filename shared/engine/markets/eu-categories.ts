/**
 * EU limits that define the product categories (Regulation (EU) No 1308/2013, Annex VII, Part II) and
 * the limits on additives (Delegated Regulation (EU) 2019/934, Annex I, Part A, Table 2): a wine outside
 * them may not be sold under that category.
 */
import { needs, type Applicability, type LegalLimitRule, type WineProfile } from "./types.ts";
import type { ParameterId } from "../parameters.ts";
import type { UnitId } from "../units.ts";

const CMO = { document: "Regulation (EU) No 1308/2013", edition: "OJ L 347, 20.12.2013, as amended" };
const PRACTICES = {
  document: "Commission Delegated Regulation (EU) 2019/934",
  article: "Annex I, Part A, Table 2",
  edition: "OJ L 149, 7.6.2019",
};
const CMO_NOTE =
  "citation not yet confirmed: the value was not read in the text of Annex VII Part II; it is the category definition as the trade quotes it";
const TABLE_NOTE =
  "citation not yet confirmed: the limit was not read in Table 2 itself; it is the one the OIV sets for the same substance";

const rule = (
  id: string,
  parameter: ParameterId,
  side: "max" | "min",
  value: number,
  unit: UnitId,
  condition: string,
  applies: (p: WineProfile) => Applicability,
  point: string,
  confirmed = CMO_NOTE,
): LegalLimitRule => ({
  id,
  parameter,
  side,
  value,
  unit,
  condition,
  applies,
  citation: { ...CMO, article: `Annex VII, Part II, ${point}` },
  confirmed,
});

/** Quality sparkling wine of the aromatic type is told apart from other quality sparkling wine only by the profile's sparkling category. */
const aromatic = (p: WineProfile) =>
  p.category === "quality-sparkling" ? needs(p, ["sparklingCategory"], (q) => q.sparklingCategory === "quality-aromatic") : false;
const sparklingAny = (p: WineProfile) => p.category === "sparkling" || p.category === "quality-sparkling";

export const EU_CATEGORY_RULES: LegalLimitRule[] = [
  // Point 1 sets 8.5 % vol for wine from zones A and B and 9 % vol elsewhere: 8.5 holds for every wine, 9 needs the zone.
  rule(
    "eu-alcohol-wine-min",
    "alcohol",
    "min",
    8.5,
    "% vol",
    "wine (actual alcoholic strength; 9 % vol outside zones A and B)",
    (p) => p.category === "still",
    "point 1",
  ),
  rule(
    "eu-alcohol-wine-min-other-zones",
    "alcohol",
    "min",
    9,
    "% vol",
    "wine from grapes harvested outside wine-growing zones A and B",
    (p) => (p.category === "still" ? needs(p, ["euZonesAB"], (q) => !q.euZonesAB) : false),
    "point 1",
  ),
  rule(
    "eu-alcohol-liqueur-min",
    "alcohol",
    "min",
    15,
    "% vol",
    "liqueur wine (actual alcoholic strength)",
    (p) => p.category === "liqueur",
    "point 3",
  ),
  rule(
    "eu-alcohol-liqueur-max",
    "alcohol",
    "max",
    22,
    "% vol",
    "liqueur wine (actual alcoholic strength)",
    (p) => p.category === "liqueur",
    "point 3",
  ),
  rule(
    "eu-alcohol-semi-sparkling-min",
    "alcohol",
    "min",
    7,
    "% vol",
    "semi-sparkling wine (actual alcoholic strength)",
    (p) => p.category === "semi-sparkling",
    "point 8",
  ),
  rule(
    "eu-alcohol-aromatic-min",
    "alcohol",
    "min",
    6,
    "% vol",
    "quality aromatic sparkling wine (actual alcoholic strength)",
    aromatic,
    "point 6",
  ),
  // Every sparkling category needs at least 3 bar (quality sparkling 3.5 bar, but 3 bar in containers under 25 cl; the container is not in the profile).
  rule(
    "eu-overpressure-sparkling-min",
    "overpressure",
    "min",
    3,
    "bar",
    "sparkling, quality sparkling and aerated sparkling wine, at 20 °C in closed containers",
    sparklingAny,
    "points 4 to 7",
  ),
  rule(
    "eu-overpressure-semi-sparkling-min",
    "overpressure",
    "min",
    1,
    "bar",
    "semi-sparkling wine, at 20 °C in closed containers",
    (p) => p.category === "semi-sparkling",
    "point 8",
  ),
  rule(
    "eu-overpressure-semi-sparkling-max",
    "overpressure",
    "max",
    2.5,
    "bar",
    "semi-sparkling wine, at 20 °C in closed containers",
    (p) => p.category === "semi-sparkling",
    "point 8",
  ),
  {
    id: "eu-citric-acid",
    parameter: "citric_acid",
    side: "max",
    value: 1,
    unit: "g/L",
    condition: "wine (final content after any addition of citric acid)",
    applies: () => true,
    citation: { ...PRACTICES, article: "Annex I, Part A, Table 2 (citric acid)" },
    confirmed: TABLE_NOTE,
  },
  {
    id: "eu-sorbic-acid",
    parameter: "sorbic_acid",
    side: "max",
    value: 200,
    unit: "mg/L",
    condition: "wine placed on the market after treatment with potassium sorbate, as sorbic acid",
    applies: () => true,
    citation: { ...PRACTICES, article: "Annex I, Part A, Table 2 (potassium sorbate)" },
    confirmed: TABLE_NOTE,
  },
];
