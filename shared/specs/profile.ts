import type { WineProfile } from "../engine/index.ts";

export interface WineFacts {
  colour: WineProfile["colour"];
  category: WineProfile["category"];
  nominalSugarGPerL: number | null;
  nominalAlcoholPercentVol: number | null;
}

/** The wine profile the law needs, for one vintage; the wine's usual sugar and alcohol stand in until a lot is analysed. */
export function wineProfile(wine: WineFacts, vintage: number): WineProfile {
  return {
    colour: wine.colour,
    category: wine.category,
    harvestYear: vintage,
    ...(wine.nominalSugarGPerL !== null ? { sugarGPerL: wine.nominalSugarGPerL } : {}),
    ...(wine.nominalAlcoholPercentVol !== null ? { alcoholPercentVol: wine.nominalAlcoholPercentVol } : {}),
  };
}
