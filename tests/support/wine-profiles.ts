/** Wine profiles for the engine's tests: a still wine of usual sugar and alcohol, changed where a check needs it. */
import type { WineProfile } from "../../shared/engine/index.ts";

export const still = (colour: WineProfile["colour"], extra: Partial<WineProfile> = {}): WineProfile => ({
  colour,
  category: "still",
  sugarGPerL: 2,
  harvestYear: 2024,
  alcoholPercentVol: 12.5,
  ...extra,
});
