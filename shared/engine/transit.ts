/**
 * Transit check for bulk wine: the arrival analysis against the pre-shipment one. Each parameter
 * has an allowed drift in the direction transit harms it; a spec can replace any default.
 */
import type { ParameterId } from "./parameters.ts";
import { displayValue } from "./display.ts";
import { parameter } from "./parameters.ts";

export interface DriftAllowance {
  parameter: ParameterId;
  /** "decrease": only a loss counts (free SO2); "increase": only a gain (dissolved oxygen); "either". */
  direction: "increase" | "decrease" | "either";
  /** Largest acceptable change, in the parameter's canonical unit. */
  allowed: number;
  basis: string;
}

const PRACTICE = "Cellarpact default (common practice; no published source)";

/**
 * Defaults, all common practice. The free SO2 allowance reflects that 1 mg/L of oxygen can consume
 * up to 4 mg/L of free SO2 (AWRI, "Gas adjustment"), so a 2.5 mg/L oxygen pick-up costs about 10 mg/L.
 */
export const DEFAULT_DRIFT_ALLOWANCES: readonly DriftAllowance[] = [
  {
    parameter: "free_so2",
    direction: "decrease",
    allowed: 10,
    basis: `${PRACTICE}; about 2.5 mg/L of O2 at up to 4 mg/L SO2 per mg/L O2 (AWRI)`,
  },
  { parameter: "total_so2", direction: "decrease", allowed: 15, basis: PRACTICE },
  { parameter: "dissolved_oxygen", direction: "increase", allowed: 1, basis: PRACTICE },
  { parameter: "volatile_acidity", direction: "increase", allowed: 1.7, basis: `${PRACTICE}; about 0.1 g/L as acetic acid` },
  { parameter: "carbon_dioxide", direction: "either", allowed: 0.3, basis: PRACTICE },
  { parameter: "turbidity", direction: "increase", allowed: 1, basis: PRACTICE },
  { parameter: "alcohol", direction: "either", allowed: 0.1, basis: `${PRACTICE}; alcohol should not change in a sealed container` },
  { parameter: "copper", direction: "increase", allowed: 0.1, basis: PRACTICE },
  { parameter: "iron", direction: "increase", allowed: 1, basis: PRACTICE },
];

export interface TransitFinding {
  parameter: ParameterId;
  name: string;
  before: number;
  after: number;
  change: number;
  allowance: DriftAllowance;
  exceeded: boolean;
  /** |change| against the combined standard uncertainty of the two results, when both are known. */
  significance: number | null;
  message: string;
}

export interface TransitValue {
  value: number;
  /** Standard uncertainty, canonical unit. */
  u?: number;
}

export function compareTransit(
  preShipment: Partial<Record<ParameterId, TransitValue>>,
  arrival: Partial<Record<ParameterId, TransitValue>>,
  overrides: readonly DriftAllowance[] = [],
): TransitFinding[] {
  const allowances = new Map<ParameterId, DriftAllowance>(DEFAULT_DRIFT_ALLOWANCES.map((a) => [a.parameter, a]));
  for (const o of overrides) allowances.set(o.parameter, o);
  const findings: TransitFinding[] = [];
  for (const [id, allowance] of allowances) {
    const a = preShipment[id];
    const b = arrival[id];
    if (!a || !b) continue;
    const change = b.value - a.value;
    const harmful = allowance.direction === "either" ? Math.abs(change) : allowance.direction === "increase" ? change : -change;
    const exceeded = harmful > allowance.allowed + 1e-12;
    const combined = a.u !== undefined && b.u !== undefined ? Math.hypot(a.u, b.u) : null;
    const p = parameter(id);
    findings.push({
      parameter: id,
      name: p.name,
      before: a.value,
      after: b.value,
      change,
      allowance,
      exceeded,
      significance: combined && combined > 0 ? Math.abs(change) / combined : null,
      message: `${p.name} ${change >= 0 ? "rose" : "fell"} by ${displayValue(id, Math.abs(change), p.unit)} ${p.unit} in transit; allowed ${allowance.direction === "either" ? "±" : allowance.direction === "increase" ? "+" : "−"}${displayValue(id, allowance.allowed, p.unit)} ${p.unit}${exceeded ? ": exceeded" : ""}.`,
    });
  }
  return findings;
}
