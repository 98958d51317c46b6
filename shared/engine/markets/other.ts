/** Further schemes with published numbers: the English and Welsh quality wine scheme, China's import checks, Ontario's retailer. */
import { and, needs, type MarketPack, type WineProfile } from "./types.ts";

const UK = { document: "The Wine Regulations 2011 (SI 2011/2936)", article: "Schedule 2, paragraph 3", edition: "2011" };
// The Schedule sets its values for protected-origin wine made in England and Wales, not for wine sold there.
const protectedOrigin = (p: WineProfile) => needs(p, ["protectedOrigin"], (q) => q.protectedOrigin !== "none");

export const UK_QWS_PACK: MarketPack = {
  id: "UK-QWS",
  name: "England and Wales protected-origin wine (Wine Regulations 2011)",
  version: "2026.2",
  edition: "UK SI 2011/2936 Schedule 2, for PDO and PGI wine made in England and Wales",
  rules: [
    {
      id: "uk-free-so2-dry",
      parameter: "free_so2",
      side: "max",
      value: 45,
      unit: "mg/L",
      condition: "protected-origin dry wine (sugar at most 4 g/L)",
      applies: (p) =>
        and(
          protectedOrigin(p),
          needs(p, ["sugarGPerL"], (q) => q.sugarGPerL <= 4),
        ),
      citation: UK,
      confirmed: "read in the source",
    },
    {
      id: "uk-free-so2-other",
      parameter: "free_so2",
      side: "max",
      value: 60,
      unit: "mg/L",
      condition: "protected-origin wine other than dry (sugar above 4 g/L)",
      applies: (p) =>
        and(
          protectedOrigin(p),
          needs(p, ["sugarGPerL"], (q) => q.sugarGPerL > 4),
        ),
      citation: UK,
      confirmed: "read in the source",
    },
    {
      id: "uk-copper",
      parameter: "copper",
      side: "max",
      value: 0.5,
      unit: "mg/L",
      condition: "protected-origin wine made in England and Wales",
      applies: protectedOrigin,
      citation: UK,
      confirmed: "read in the source",
    },
    {
      id: "uk-iron",
      parameter: "iron",
      side: "max",
      value: 8,
      unit: "mg/L",
      condition: "protected-origin wine made in England and Wales",
      applies: protectedOrigin,
      citation: UK,
      confirmed: "read in the source",
    },
    {
      id: "uk-ta",
      parameter: "total_acidity",
      side: "min",
      value: 4,
      unit: "g/L as tartaric acid",
      condition: "protected-origin wine made in England and Wales",
      applies: protectedOrigin,
      citation: UK,
      confirmed: "read in the source",
    },
    {
      id: "uk-alcohol",
      parameter: "alcohol",
      side: "min",
      value: 9,
      unit: "% vol",
      condition: "protected-origin wine: total alcoholic strength (measured here as actual alcohol, a conservative reading)",
      applies: protectedOrigin,
      citation: UK,
      confirmed: "read in the source",
    },
  ],
};

const CN = {
  document: "Wine Australia export advice on China's import checks",
  article: "sugar-free extract",
  edition: "as quoted in 2019",
};

export const CN_PACK: MarketPack = {
  id: "CN",
  name: "China (import checks)",
  version: "2026.2",
  edition: "Import-check values as published in exporters' advice",
  rules: (["white", "rose", "red"] as const).map((colour) => ({
    id: `cn-sfe-${colour}`,
    parameter: "sugar_free_extract" as const,
    side: "min" as const,
    value: { white: 16, rose: 17, red: 18 }[colour],
    unit: "g/L" as const,
    condition: `${colour === "rose" ? "rosé" : colour} wine`,
    applies: (p) => p.colour === colour,
    citation: CN,
    confirmed: "citation not yet confirmed: read in exporters' advice; the national standard it quotes (GB 15037) was not read",
  })),
};

const LCBO = {
  document: "AWRI, 'Pre-bottling wine adjustments and specifications', citing Wine Australia's summary of LCBO requirements",
  article: "turbidity",
  edition: "accessed 2019",
};

export const CA_ON_PACK: MarketPack = {
  id: "CA-ON",
  name: "Ontario (provincial retailer)",
  version: "2026.2",
  edition: "Retailer technical requirements as summarised in 2019",
  rules: (["white", "rose", "red"] as const).map((colour) => ({
    id: `on-turbidity-${colour}`,
    parameter: "turbidity" as const,
    side: "max" as const,
    value: { white: 5, rose: 8, red: 10 }[colour],
    unit: "NTU" as const,
    condition: `${colour === "rose" ? "rosé" : colour} wine, filtered (unfiltered wines are exempt)`,
    applies: (p) => (p.colour === colour ? needs(p, ["filtered"], (q) => q.filtered) : false),
    citation: LCBO,
    confirmed: "read in the source",
  })),
};
