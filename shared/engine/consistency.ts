/**
 * Consistency over lots and vintages: individuals and moving-range chart, EWMA chart, the Western
 * Electric run rules, capability indices and an early warning for drift toward a limit.
 */

/** Control chart constants for subgroups of 2 (moving ranges of 2): E2 = 3/d2 = 2.660, D4 = 3.268, d2 = 1.128. */
export const D2 = 1.128;
export const E2 = 2.66;
export const D4 = 3.268;

export interface IndividualsChart {
  centre: number;
  averageMovingRange: number;
  ucl: number;
  lcl: number;
  movingRangeUcl: number;
  /** Within-process standard deviation estimated as MR̄ / d2. */
  sigma: number;
}

export function individualsChart(values: readonly number[]): IndividualsChart {
  if (values.length < 2) throw new RangeError("an individuals chart needs at least 2 results");
  const centre = mean(values);
  const ranges = values.slice(1).map((v, i) => Math.abs(v - values[i]!));
  const mr = mean(ranges);
  return { centre, averageMovingRange: mr, ucl: centre + E2 * mr, lcl: centre - E2 * mr, movingRangeUcl: D4 * mr, sigma: mr / D2 };
}

export interface EwmaPoint {
  value: number;
  ewma: number;
  ucl: number;
  lcl: number;
  outOfControl: boolean;
}

/**
 * EWMA_t = λ·x_t + (1 − λ)·EWMA_{t−1}, EWMA_0 = target; limits target ± k·s·√(λ/(2 − λ))
 * (NIST/SEMATECH e-Handbook of Statistical Methods, 6.3.2.4). exact = true uses the time-varying
 * factor √(λ/(2 − λ)·(1 − (1 − λ)^(2t))) instead of the asymptotic one.
 */
export function ewmaChart(
  values: readonly number[],
  opts: { lambda?: number; target: number; sigma: number; k?: number; exact?: boolean },
): EwmaPoint[] {
  const lambda = opts.lambda ?? 0.3;
  const k = opts.k ?? 3;
  if (!(lambda > 0 && lambda <= 1)) throw new RangeError("λ must be in (0, 1]");
  let ewma = opts.target;
  return values.map((x, i) => {
    ewma = lambda * x + (1 - lambda) * ewma;
    const factor = opts.exact ? (lambda / (2 - lambda)) * (1 - (1 - lambda) ** (2 * (i + 1))) : lambda / (2 - lambda);
    const half = k * opts.sigma * Math.sqrt(factor);
    const ucl = opts.target + half;
    const lcl = opts.target - half;
    return { value: x, ewma, ucl, lcl, outOfControl: ewma > ucl || ewma < lcl };
  });
}

export interface RuleSignal {
  /** Western Electric rule 1–4. */
  rule: 1 | 2 | 3 | 4;
  /** Index of the point that completes the pattern. */
  index: number;
  side: "above" | "below";
  description: string;
}

/**
 * Western Electric run rules (Statistical Quality Control Handbook, 1956): 1 point beyond 3σ;
 * 2 of 3 beyond 2σ on one side; 4 of 5 beyond 1σ on one side; 8 in a row on one side.
 */
export function westernElectricSignals(values: readonly number[], centre: number, sigma: number): RuleSignal[] {
  const z = values.map((v) => (v - centre) / sigma);
  const signals: RuleSignal[] = [];
  const window = (i: number, n: number) => z.slice(Math.max(0, i - n + 1), i + 1);
  z.forEach((zi, i) => {
    for (const side of ["above", "below"] as const) {
      const s = side === "above" ? 1 : -1;
      if (s * zi > 3) signals.push({ rule: 1, index: i, side, description: "one point beyond 3σ" });
      const w3 = window(i, 3);
      if (w3.length === 3 && w3.filter((v) => s * v > 2).length >= 2 && s * zi > 2)
        signals.push({ rule: 2, index: i, side, description: "2 of 3 points beyond 2σ on one side" });
      const w5 = window(i, 5);
      if (w5.length === 5 && w5.filter((v) => s * v > 1).length >= 4 && s * zi > 1)
        signals.push({ rule: 3, index: i, side, description: "4 of 5 points beyond 1σ on one side" });
      const w8 = window(i, 8);
      if (w8.length === 8 && w8.every((v) => s * v > 0))
        signals.push({ rule: 4, index: i, side, description: "8 points in a row on one side of the centre line" });
    }
  });
  return signals;
}

export interface Capability {
  cp: number | null;
  cpk: number;
  cpu: number | null;
  cpl: number | null;
  mean: number;
  sigma: number;
}

/** Cp = (USL − LSL)/6σ and Cpk = min(USL − μ, μ − LSL)/3σ; one-sided specs give Cpu or Cpl only. */
export function capability(values: readonly number[], spec: { lower?: number; upper?: number }, sigma?: number): Capability {
  if (spec.lower === undefined && spec.upper === undefined) throw new RangeError("capability needs at least one spec limit");
  const mu = mean(values);
  const s = sigma ?? individualsChart(values).sigma;
  const cpu = spec.upper === undefined ? null : (spec.upper - mu) / (3 * s);
  const cpl = spec.lower === undefined ? null : (mu - spec.lower) / (3 * s);
  const cp = spec.upper !== undefined && spec.lower !== undefined ? (spec.upper - spec.lower) / (6 * s) : null;
  return { cp, cpk: Math.min(cpu ?? Infinity, cpl ?? Infinity), cpu, cpl, mean: mu, sigma: s };
}

export interface DriftWarning {
  towards: "upper" | "lower";
  /** Share of the distance from the centre to the limit that the EWMA has covered, 0–1+. */
  progress: number;
  message: string;
}

/**
 * Early warning (common practice): the EWMA has covered more than half the way from the centre
 * line to a spec limit, or the last 6 results move steadily toward it.
 */
export function driftWarning(
  values: readonly number[],
  spec: { lower?: number; upper?: number },
  opts: { lambda?: number } = {},
): DriftWarning | null {
  if (values.length < 3) return null;
  const lambda = opts.lambda ?? 0.3;
  const centre = mean(values.slice(0, Math.max(2, Math.floor(values.length / 2))));
  let ewma = centre;
  for (const v of values) ewma = lambda * v + (1 - lambda) * ewma;
  const last6 = values.slice(-6);
  const rising = last6.length === 6 && last6.every((v, i) => i === 0 || v > last6[i - 1]!);
  const falling = last6.length === 6 && last6.every((v, i) => i === 0 || v < last6[i - 1]!);
  const check = (towards: "upper" | "lower", limit: number | undefined, trend: boolean): DriftWarning | null => {
    if (limit === undefined) return null;
    const span = Math.abs(limit - centre);
    if (span === 0) return null;
    const progress = (towards === "upper" ? ewma - centre : centre - ewma) / span;
    if (progress > 0.5 || trend) {
      return {
        towards,
        progress,
        message: `Results are drifting toward the ${towards} limit (${Math.round(progress * 100)} % of the way from the usual level${trend ? "; 6 results in a row moved that way" : ""}).`,
      };
    }
    return null;
  };
  return check("upper", spec.upper, rising) ?? check("lower", spec.lower, falling);
}

function mean(xs: readonly number[]): number {
  return xs.reduce((a, b) => a + b, 0) / xs.length;
}
