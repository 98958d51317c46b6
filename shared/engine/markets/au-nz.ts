/** Australia and New Zealand: the Food Standards Code's sulphur dioxide limits for wine, sparkling wine and fortified wine. */
import { needs, type MarketPack } from "./types.ts";

const FSC = {
  document: "Australia New Zealand Food Standards Code",
  article: "Standard 4.5.1 (Wine production requirements), as quoted by Wine Australia",
  edition: "compilation as quoted in 2019",
};
const NOTE =
  "citation not yet confirmed: the values and the 35 g/L boundary were read in Wine Australia's 'Know your sulphite limits'; the Code's own clause was not read, nor whether Schedule 15 carries the same numbers for imported wine";

export const AU_NZ_PACK: MarketPack = {
  id: "AU-NZ",
  name: "Australia and New Zealand (Food Standards Code)",
  version: "2026.1",
  edition: "Food Standards Code limits as quoted by Wine Australia",
  rules: [
    {
      id: "au-so2",
      parameter: "total_so2",
      side: "max",
      value: 250,
      unit: "mg/L",
      condition: "wine, sparkling wine and fortified wine with at most 35 g/L residual sugar",
      applies: (p) => needs(p, ["sugarGPerL"], (q) => q.sugarGPerL <= 35),
      citation: FSC,
      confirmed: NOTE,
    },
    {
      id: "au-so2-sweet",
      parameter: "total_so2",
      side: "max",
      value: 300,
      unit: "mg/L",
      condition: "wine, sparkling wine and fortified wine with more than 35 g/L residual sugar",
      applies: (p) => needs(p, ["sugarGPerL"], (q) => q.sugarGPerL > 35),
      citation: FSC,
      confirmed: NOTE,
    },
  ],
};
