/**
 * Numbers as people read them: every displayed value is rounded to its parameter's precision,
 * shifted by the size of the unit (a parameter kept to 0.01 g/L shows whole mg/L), so no float
 * noise such as 0.465314 or "± 0.2146" reaches a screen, a PDF or a CSV export.
 */
import { findParameter } from "./parameters.ts";
import { convert, UNITS, type UnitId } from "./units.ts";

/** Decimal places for a parameter shown in `unit`. */
export function displayDigits(parameterId: string, unit: string): number {
  const p = findParameter(parameterId);
  if (!p) return 2;
  if (unit === p.unit || !(unit in UNITS)) return p.digits;
  let factor: number;
  try {
    factor = Math.abs(convert(1, p.unit, unit as UnitId));
  } catch {
    return p.digits;
  }
  return Math.max(0, Math.min(6, p.digits - Math.round(Math.log10(factor))));
}

/** A value of the parameter in `unit`, rounded for display; "—" for none. */
export function displayValue(parameterId: string, value: number | null | undefined, unit: string): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  const fixed = value.toFixed(displayDigits(parameterId, unit));
  // "-0.00" reads as a sign that is not there.
  return Number(fixed) === 0 ? fixed.replace(/^-/, "") : fixed;
}

/** A unit's label as printed ("g/L as acetic acid"). */
export const unitLabel = (unit: string) => UNITS[unit as UnitId]?.label ?? unit;
