/** United States federal limits (27 CFR, TTB). */
import { and, needs, type Applicability, type MarketPack, type WineProfile } from "./types.ts";

/** Part 4 "appl[ies] to wine containing not less than 7 percent and not more than 24 percent alcohol by volume" (27 CFR 4.6). */
export const inPart4Scope = (p: WineProfile): Applicability =>
  needs(p, ["alcoholPercentVol"], (q) => q.alcoholPercentVol >= 7 && q.alcoholPercentVol <= 24);
const part4 = (test: (p: WineProfile) => boolean) => (p: WineProfile) => and(inPart4Scope(p), test(p));

export const US_PACK: MarketPack = {
  id: "US",
  name: "United States (federal)",
  version: "2026.3",
  edition:
    "27 CFR as read for Cellarpact (4.21 in the 4-1-19 edition, 4.22 in the 2004 edition, 4.6 as added by T.D. TTB-158, 85 FR 18721, 2 April 2020)",
  rules: [
    {
      id: "us-va-red",
      parameter: "volatile_acidity",
      side: "max",
      value: 0.14,
      unit: "g/100 mL as acetic acid",
      condition: "natural red grape wine, volatile acidity calculated as acetic acid exclusive of sulfur dioxide",
      applies: part4((p) => p.colour === "red" && p.usHighBrixJuice !== true),
      citation: { document: "27 CFR", article: "§ 4.21(a)(1)(iv)", edition: "4-1-19" },
      confirmed: "read in the source (an OCR copy whose word 'red' was unreadable and is inferred from the paragraph's structure)",
    },
    {
      id: "us-va-white",
      parameter: "volatile_acidity",
      side: "max",
      value: 0.12,
      unit: "g/100 mL as acetic acid",
      condition: "other grape wine (white, rosé), exclusive of sulfur dioxide",
      applies: part4((p) => p.colour !== "red" && p.usHighBrixJuice !== true),
      citation: { document: "27 CFR", article: "§ 4.21(a)(1)(iv)", edition: "4-1-19" },
      confirmed: "read in the source",
    },
    {
      id: "us-va-high-brix-red",
      parameter: "volatile_acidity",
      side: "max",
      value: 0.17,
      unit: "g/100 mL as acetic acid",
      condition: "red wine from unameliorated juice of 28 °Brix or more",
      applies: part4((p) => p.colour === "red" && p.usHighBrixJuice === true),
      citation: { document: "27 CFR", article: "§ 4.21(a)(1)(iv)", edition: "4-1-19" },
      confirmed: "read in the source",
    },
    {
      id: "us-va-high-brix-white",
      parameter: "volatile_acidity",
      side: "max",
      value: 0.15,
      unit: "g/100 mL as acetic acid",
      condition: "white wine from unameliorated juice of 28 °Brix or more",
      applies: part4((p) => p.colour !== "red" && p.usHighBrixJuice === true),
      citation: { document: "27 CFR", article: "§ 4.21(a)(1)(iv)", edition: "4-1-19" },
      confirmed: "read in the source",
    },
    {
      id: "us-so2",
      parameter: "total_so2",
      side: "max",
      value: 350,
      unit: "ppm",
      condition: "finished wine of 7 to 24 % vol (27 CFR 4.6)",
      applies: part4(() => true),
      citation: { document: "27 CFR", article: "§ 4.22(b)(1)", edition: "April 1, 2004" },
      confirmed: "read in the source",
    },
    {
      id: "us-co2-still",
      parameter: "carbon_dioxide",
      side: "max",
      // 0.392 g/100 mL plus the 0.009 g/100 mL tolerance for mechanical variation.
      value: 0.401,
      unit: "g/100 mL",
      condition: "still wine (0.392 g/100 mL plus 0.009 g/100 mL tolerance for mechanical variation)",
      applies: (p) => p.category === "still",
      // § 26.222 holds the same words but governs wine from Puerto Rico and the Virgin Islands only; § 24.245 governs wine generally.
      citation: { document: "27 CFR", article: "§ 24.245 (use of carbon dioxide in still wine)", edition: "current" },
      confirmed:
        "citation not yet confirmed: § 24.245's title and its cross-reference from § 24.319 read; the 0.392 + 0.009 g/100 mL values read in the identical § 26.222(a) text",
    },
  ],
};
