/** A stored verdict as short text in its spec row's unit: the result with U (k = 2) and the governing limits. */
import { convert, UNITS, type UnitId } from "../engine/index.ts";
import type { StoredBound, StoredVerdict } from "./views.ts";

const n = (x: number) => String(Number(x.toPrecision(4)));

function boundText(b: StoredBound, factor: number, unit: string): string {
  const source = b.source === "buyer" ? "buyer" : `law${b.market ? `, ${b.market}` : ""}`;
  return `${n(b.value * factor)} ${unit} (${source})`;
}

export function verdictText(v: StoredVerdict): { result: string; limits: string; uncertainty: string } {
  const display = v.displayUnit as UnitId;
  const factor = convert(1, v.unit as UnitId, display);
  const unit = UNITS[display]?.label ?? display;
  const limits = [v.lower && `min ${boundText(v.lower, factor, unit)}`, v.upper && `max ${boundText(v.upper, factor, unit)}`].filter(Boolean).join("; ") || "—";
  const u = v.uncertainty && v.uncertainty.source !== "none" ? v.uncertainty : null;
  return {
    result: v.resultText === null ? "not reported" : `${v.resultText}${u ? ` ± ${n(2 * u.u * factor)}` : ""} ${unit}`,
    limits,
    uncertainty: u ? `U = ${n(2 * u.u * factor)} ${unit}, k = 2 (${u.source === "laboratory" ? "laboratory" : "Cellarpact default"})` : "none stated",
  };
}
