/**
 * What a guard band costs, before a buyer chooses it: the global consumer's risk (a lot outside the
 * tolerance is accepted) and the global producer's risk (a lot inside it is rejected) for a normal
 * process distribution and a normal measurement, after JCGM 106:2012, clause 9 (9.5, the integrals
 * over the process distribution). Integrated numerically with Simpson's rule over ±8 σ of the process.
 */
import { normalCdf } from "./normal.ts";

export interface RiskInput {
  /** Process distribution of the true values: mean and standard deviation. */
  processMean: number;
  processSd: number;
  /** Standard measurement uncertainty. */
  u: number;
  /** Tolerance limits (at least one). */
  lower?: number;
  upper?: number;
  /** Guard band w: the acceptance interval is [lower + w, upper − w]. */
  guard: number;
}

export interface GlobalRisks {
  consumer: number;
  producer: number;
}

const pdf = (z: number) => Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);

export function globalRisks(input: RiskInput, steps = 4000): GlobalRisks {
  const { processMean: m, processSd: s, u, lower, upper, guard } = input;
  if (!(s > 0) || !(u >= 0)) throw new RangeError("The process standard deviation must be above 0 and the uncertainty not negative.");
  if (lower === undefined && upper === undefined) throw new RangeError("A risk needs at least one tolerance limit.");
  const aLow = lower === undefined ? -Infinity : lower + guard;
  const aHigh = upper === undefined ? Infinity : upper - guard;
  const accepted = (eta: number) => {
    if (aLow > aHigh) return 0;
    if (u === 0) return eta >= aLow && eta <= aHigh ? 1 : 0;
    return (aHigh === Infinity ? 1 : normalCdf((aHigh - eta) / u)) - (aLow === -Infinity ? 0 : normalCdf((aLow - eta) / u));
  };
  if (u === 0) return exactRisks(m, s, lower, upper, aLow, aHigh);
  const inside = (eta: number) => (lower === undefined || eta >= lower) && (upper === undefined || eta <= upper);
  // The integrand jumps at the tolerance limits, so each stretch between them is integrated apart.
  const from = m - 8 * s;
  const to = m + 8 * s;
  const cuts = [from, ...[lower, upper].filter((x): x is number => x !== undefined && x > from && x < to), to].sort((x, y) => x - y);
  const n = steps % 2 === 0 ? steps : steps + 1;
  let consumer = 0;
  let producer = 0;
  for (let k = 0; k + 1 < cuts.length; k++) {
    const [a, b] = [cuts[k]!, cuts[k + 1]!];
    const within = inside((a + b) / 2);
    const h = (b - a) / n;
    for (let i = 0; i <= n; i++) {
      const eta = a + i * h;
      const weight = (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * (h / 3) * (pdf((eta - m) / s) / s);
      const pa = accepted(eta);
      if (within) producer += weight * (1 - pa);
      else consumer += weight * pa;
    }
  }
  return { consumer, producer };
}

/** With an exact measurement the risks are the process's probability between each tolerance limit and its acceptance limit. */
function exactRisks(m: number, s: number, lower: number | undefined, upper: number | undefined, aLow: number, aHigh: number): GlobalRisks {
  const P = (a: number, b: number) => (b <= a ? 0 : normalCdf((b - m) / s) - normalCdf((a - m) / s));
  const tl = lower ?? -Infinity;
  const tu = upper ?? Infinity;
  return {
    consumer: P(aLow, Math.min(tl, aHigh)) + P(Math.max(tu, aLow), aHigh),
    producer: P(tl, Math.min(aLow, tu)) + P(Math.max(aHigh, tl), tu),
  };
}
