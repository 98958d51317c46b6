/** OIV maximum acceptable limits (Compendium of International Methods, Annex C, OIV-MA-C1-01, 2019 issue). */
import { needs, type LegalLimitRule, type MarketPack, type WineProfile } from "./types.ts";

const C1 = (what: string) => ({
  document: "OIV Compendium of International Methods of Analysis, Annex C",
  article: `OIV-MA-C1-01, ${what}`,
  edition: "2019 issue",
});
const simple = (
  id: string,
  parameter: LegalLimitRule["parameter"],
  value: number,
  unit: LegalLimitRule["unit"],
  what: string,
  condition = "all wines",
): LegalLimitRule => ({
  id,
  parameter,
  side: "max",
  value,
  unit,
  condition,
  applies: () => true,
  citation: C1(what),
  confirmed: "read in the source",
});

/** 1 g/L as potassium sulphate, raised for the cases the text lists; which case a wine is in is a fact of its making. */
const SULPHATES: LegalLimitRule[] = (
  [
    ["none", 1, "wines in none of the raised cases", "read in the source"],
    [
      "cask-sweetened-or-fortified",
      1.5,
      "wines matured in cask for at least 2 years, sweetened wines, and wines with alcohol or spirit added to the must or wine",
      "read in the source",
    ],
    [
      "concentrated-must-or-naturally-sweet",
      2,
      "wines with added concentrated must, and naturally sweet wines",
      "citation not yet confirmed: the cases were read in the source, the 2 g/L value beside them was cut off in the copy read",
    ],
  ] as const
).map(([when, value, condition, confirmed]) => ({
  ...simple(`oiv-sulphates-${when}`, "sulphates", value, "g/L", "sulphates (expressed as potassium sulphate)", condition),
  applies: (p: WineProfile) => needs(p, ["oivSulphateCase"], (q) => q.oivSulphateCase === when),
  confirmed,
}));

export const OIV_PACK: MarketPack = {
  id: "OIV",
  name: "OIV maximum acceptable limits",
  version: "2026.4",
  edition: "OIV-MA-C1-01, 2019 issue",
  rules: [
    simple("oiv-va", "volatile_acidity", 20, "meq/L", "volatile acidity"),
    simple("oiv-citric", "citric_acid", 1, "g/L", "citric acid"),
    simple("oiv-arsenic", "arsenic", 0.2, "mg/L", "arsenic"),
    simple("oiv-boron", "boron", 80, "mg/L", "boron (expressed as boric acid)"),
    simple(
      "oiv-bromine",
      "bromine",
      1,
      "mg/L",
      "bromine",
      "all wines; the text allows it to be exceeded, by way of exception, in wines from certain vineyards with a brackish subsoil",
    ),
    simple("oiv-cadmium", "cadmium", 0.01, "mg/L", "cadmium"),
    simple("oiv-excess-sodium", "excess_sodium", 80, "mg/L", "excess sodium (OENO 09/2007)"),
    {
      ...simple(
        "oiv-copper",
        "copper",
        1,
        "mg/L",
        "copper (OIV-OENO 434-2011)",
        "wines other than liqueur wines from unfermented or slightly fermented must",
      ),
      // The 2 mg/L limit is for one kind of liqueur wine only; every other wine, liqueur wines included, keeps 1 mg/L.
      applies: (p) => (p.category !== "liqueur" ? true : needs(p, ["liqueurFromUnfermentedMust"], (q) => !q.liqueurFromUnfermentedMust)),
    },
    {
      ...simple(
        "oiv-copper-liqueur",
        "copper",
        2,
        "mg/L",
        "copper (OIV-OENO 434-2011)",
        "liqueur wines from unfermented or slightly fermented must",
      ),
      applies: (p) => (p.category === "liqueur" ? needs(p, ["liqueurFromUnfermentedMust"], (q) => q.liqueurFromUnfermentedMust) : false),
    },
    {
      ...simple("oiv-lead", "lead", 0.1, "mg/L", "lead (OIV-OENO 638-2019)", "wine from the 2019 harvest on"),
      applies: (p) => (p.category === "liqueur" ? false : needs(p, ["harvestYear"], (q) => q.harvestYear >= 2019)),
    },
    {
      ...simple("oiv-lead-old", "lead", 0.15, "mg/L", "lead", "wine from the 2006–2018 harvests"),
      applies: (p) => (p.category === "liqueur" ? false : needs(p, ["harvestYear"], (q) => q.harvestYear >= 2006 && q.harvestYear <= 2018)),
    },
    {
      ...simple("oiv-lead-liqueur", "lead", 0.15, "mg/L", "lead (OIV-OENO 638-2019)", "liqueur wine from the 2019 harvest on"),
      applies: (p) => (p.category === "liqueur" ? needs(p, ["harvestYear"], (q) => q.harvestYear >= 2019) : false),
    },
    {
      ...simple("oiv-ota", "ochratoxin_a", 2, "µg/L", "ochratoxin A (CST 1/2002)", "wine from the 2005 harvest on"),
      applies: (p) => needs(p, ["harvestYear"], (q) => q.harvestYear >= 2005),
    },
    { ...simple("oiv-methanol-red", "methanol", 400, "mg/L", "methanol (OENO 19/2004)", "red wine"), applies: (p) => p.colour === "red" },
    {
      ...simple("oiv-methanol-white", "methanol", 250, "mg/L", "methanol (OENO 19/2004)", "white and rosé wine"),
      applies: (p) => p.colour !== "red",
    },
    {
      ...simple("oiv-so2-red", "total_so2", 150, "mg/L", "sulphur dioxide", "red wine with at most 4 g/L reducing substances"),
      applies: (p) => (p.colour === "red" ? needs(p, ["sugarGPerL"], (q) => q.sugarGPerL <= 4) : false),
    },
    {
      ...simple("oiv-so2-white", "total_so2", 200, "mg/L", "sulphur dioxide", "white and rosé wine with at most 4 g/L reducing substances"),
      applies: (p) => (p.colour !== "red" ? needs(p, ["sugarGPerL"], (q) => q.sugarGPerL <= 4) : false),
    },
    {
      ...simple(
        "oiv-so2-sweet",
        "total_so2",
        300,
        "mg/L",
        "sulphur dioxide",
        "wine with more than 4 g/L reducing substances (glucose + fructose used as the estimate), other than a sweet white wine admitted to the exception",
      ),
      applies: (p) => (p.colour === "white" && p.oivSweetWhiteSo2Exception ? false : needs(p, ["sugarGPerL"], (q) => q.sugarGPerL > 4)),
    },
    {
      ...simple(
        "oiv-so2-sweet-white-exception",
        "total_so2",
        400,
        "mg/L",
        "sulphur dioxide",
        "in exceptional cases, some sweet white wines (more than 4 g/L reducing substances)",
      ),
      applies: (p) => (p.colour === "white" && p.oivSweetWhiteSo2Exception ? needs(p, ["sugarGPerL"], (q) => q.sugarGPerL > 4) : false),
    },
    ...SULPHATES,
    {
      ...simple("oiv-fluoride", "fluoride", 1, "mg/L", "fluoride (OENO 8/91)", "wines other than from vineyards treated with cryolite"),
      applies: (p) => needs(p, ["cryoliteTreatedVineyard"], (q) => !q.cryoliteTreatedVineyard),
    },
    {
      ...simple(
        "oiv-fluoride-cryolite",
        "fluoride",
        3,
        "mg/L",
        "fluoride (OENO 8/91)",
        "wines from vineyards treated with cryolite in conformity with national law",
      ),
      applies: (p) => needs(p, ["cryoliteTreatedVineyard"], (q) => q.cryoliteTreatedVineyard),
    },
    simple("oiv-silver", "silver", 0.1, "mg/L", "silver", "all wines (the text writes < 0.1 mg/L)"),
    simple(
      "oiv-diethylene-glycol",
      "diethylene_glycol",
      10,
      "mg/L",
      "diethylene glycol",
      "all wines (10 mg/L, to the quantification limit)",
    ),
    simple("oiv-ethylene-glycol", "ethylene_glycol", 10, "mg/L", "ethanediol / ethylene glycol"),
    simple(
      "oiv-malvidin-diglucoside",
      "malvidin_diglucoside",
      15,
      "mg/L",
      "malvidol diglucoside (by the Compendium's quantitative method)",
    ),
    {
      ...simple(
        "oiv-propylene-glycol-still",
        "propylene_glycol",
        150,
        "mg/L",
        "propan-1,2-diol / propylene glycol (OENO 20/2003)",
        "still wines",
      ),
      applies: (p) => p.category === "still",
    },
    {
      ...simple(
        "oiv-propylene-glycol-sparkling",
        "propylene_glycol",
        300,
        "mg/L",
        "propan-1,2-diol / propylene glycol (OENO 20/2003)",
        "sparkling wines",
      ),
      applies: (p) => p.category === "sparkling" || p.category === "quality-sparkling",
    },
    {
      id: "oiv-sorbic",
      parameter: "sorbic_acid",
      side: "max",
      value: 200,
      unit: "mg/L",
      condition: "wine treated with potassium sorbate, expressed as sorbic acid",
      applies: () => true,
      citation: { document: "OIV International Oenological Codex", article: "COEI-1-POTSOR", edition: "2000" },
      confirmed: "read in the source",
    },
  ],
};
