import type { WineProfile } from "../engine/index.ts";
import type { WineLawFacts } from "./law-facts.ts";

export interface WineFacts {
  colour: WineProfile["colour"];
  category: WineProfile["category"];
  nominalSugarGPerL: number | null;
  nominalAlcoholPercentVol: number | null;
  /** What the buyer has stated of the facts the law asks; the rest stay unstated. */
  lawFacts: WineLawFacts | null;
}

/** The wine profile the law needs, for one vintage; the wine's usual sugar and alcohol stand in until a lot is analysed. */
export function wineProfile(wine: WineFacts, vintage: number): WineProfile {
  return {
    ...(wine.lawFacts ?? {}),
    colour: wine.colour,
    category: wine.category,
    harvestYear: vintage,
    ...(wine.nominalSugarGPerL !== null ? { sugarGPerL: wine.nominalSugarGPerL } : {}),
    ...(wine.nominalAlcoholPercentVol !== null ? { alcoholPercentVol: wine.nominalAlcoholPercentVol } : {}),
  };
}

/** Whether a stored verdict was read with other facts than the wine has now (key order does not count). */
export function profileDiffers(stored: WineProfile | null, current: WineProfile): boolean {
  if (!stored) return false;
  const canonical = (p: WineProfile) =>
    JSON.stringify(
      Object.entries(p)
        .filter(([, v]) => v !== undefined)
        .sort(([a], [b]) => a.localeCompare(b)),
    );
  return canonical(stored) !== canonical(current);
}
