/**
 * Ranges outside which a wine result almost certainly means a wrong unit or a typing slip
 * (a volatile acidity of 0.36 meq/L, an alcohol of 125 % vol). They are wide on purpose: they
 * catch units, not bad wine. All are common practice, in each parameter's canonical unit.
 */
import { findParameter } from "./parameters.ts";
import type { Reading } from "./parse.ts";
import { convert, UnitError, type UnitId } from "./units.ts";

export const PLAUSIBLE_RANGES: Readonly<Record<string, { min?: number; max?: number }>> = {
  free_so2: { max: 250 },
  total_so2: { max: 600 },
  // 1–40 meq/L is 0.06–2.4 g/L as acetic acid.
  volatile_acidity: { min: 1, max: 40 },
  // 25–270 meq/L is 1.9–20 g/L as tartaric acid.
  total_acidity: { min: 25, max: 270 },
  fixed_acidity: { min: 20, max: 270 },
  ph: { min: 2.4, max: 4.6 },
  malic_acid: { max: 15 },
  lactic_acid: { max: 10 },
  citric_acid: { max: 5 },
  sorbic_acid: { max: 1000 },
  alcohol: { min: 0, max: 25 },
  residual_sugar: { max: 600 },
  density: { min: 0.95, max: 1.25 },
  total_dry_extract: { max: 700 },
  heat_test_haze: { max: 300 },
  turbidity: { max: 2000 },
  iron: { max: 60 },
  copper: { max: 30 },
  lead: { max: 2 },
  dissolved_oxygen: { max: 15 },
  carbon_dioxide: { max: 15 },
  methanol: { max: 1500 },
  tca: { max: 2000 },
};

/**
 * null when the reading is plausible; otherwise why not, in the unit it was reported in.
 * Censored readings are checked at their reporting limit.
 */
export function implausibility(parameterId: string, reading: Reading, unit: UnitId): string | null {
  const range = PLAUSIBLE_RANGES[parameterId];
  const p = findParameter(parameterId);
  if (!range || !p || reading.kind === "presence") return null;
  const x = reading.kind === "value" ? reading.value : reading.limit;
  if (x === null) return null;
  let canonical: number;
  try {
    canonical = convert(x, unit, p.unit);
  } catch (e) {
    if (e instanceof UnitError) return null;
    throw e;
  }
  const tooLow = range.min !== undefined && canonical < range.min && reading.kind !== "below";
  const tooHigh = range.max !== undefined && canonical > range.max && reading.kind !== "above";
  if (!tooLow && !tooHigh) return null;
  const bound = tooLow ? range.min! : range.max!;
  const shown = Number(convert(bound, p.unit, unit).toPrecision(3));
  return `Implausible: check the unit. ${p.name} of ${x} ${unit} is ${tooLow ? "below" : "above"} ${shown} ${unit}, where wine almost never lies.`;
}
