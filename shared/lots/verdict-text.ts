/** A stored verdict as short text in its spec row's unit: the result with U (k = 2) and the governing limits, rounded to the parameter's precision. */
import { convert, displayValue, unitLabel, type UnitId } from "../engine/index.ts";
import type { StoredBound, StoredVerdict } from "./views.ts";

function boundText(parameter: string, b: StoredBound, factor: number, display: string): string {
  const source = b.source === "buyer" ? "buyer" : `law${b.market ? `, ${b.market}` : ""}`;
  return `${displayValue(parameter, b.value * factor, display)} ${unitLabel(display)} (${source})`;
}

export function verdictText(v: StoredVerdict): { result: string; limits: string; uncertainty: string } {
  const display = v.displayUnit as UnitId;
  const factor = convert(1, v.unit as UnitId, display);
  const unit = unitLabel(display);
  const shown = (x: number) => displayValue(v.parameter, x, display);
  const limits = [v.lower && `min ${boundText(v.parameter, v.lower, factor, display)}`, v.upper && `max ${boundText(v.parameter, v.upper, factor, display)}`].filter(Boolean).join("; ") || "—";
  const u = v.uncertainty && v.uncertainty.source !== "none" ? v.uncertainty : null;
  const value = v.value === null ? v.resultText : shown(v.value * factor);
  return {
    result: value === null ? "not reported" : `${value}${u ? ` ± ${shown(2 * u.u * factor)}` : ""} ${unit}`,
    limits,
    uncertainty: u ? `U = ${shown(2 * u.u * factor)} ${unit}, k = 2 (${u.source === "laboratory" ? "laboratory" : "Cellarpact default"})` : "none stated",
  };
}
