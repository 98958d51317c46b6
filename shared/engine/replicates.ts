/**
 * Replicate results of one sample: averaged only when they agree within the method's repeatability.
 * For n results the range may not exceed f(n) × σr, the critical range factors of ISO 5725-6:1994,
 * Table 1 (2.8 for two results, 3.3 for three, 3.6 for four, 3.9 for five; from memory); σr is the
 * method's repeatability standard deviation (e.g. from the OIV method's validation data).
 */
const CRITICAL_RANGE: Record<number, number> = { 2: 2.8, 3: 3.3, 4: 3.6, 5: 3.9, 6: 4.0, 7: 4.2, 8: 4.3 };

export interface ReplicateCheck {
  mean: number;
  range: number;
  /** The largest range the repeatability allows for this many results. */
  limit: number;
  acceptable: boolean;
  message: string;
}

export function checkReplicates(values: readonly number[], repeatabilitySd: number): ReplicateCheck {
  if (values.length < 2) throw new RangeError("Replicates need at least two results.");
  if (values.some((v) => !Number.isFinite(v))) throw new RangeError("Every replicate must be a finite number.");
  if (!(repeatabilitySd > 0)) throw new RangeError(`The repeatability standard deviation must be above 0; ${repeatabilitySd} was given.`);
  const factor = CRITICAL_RANGE[values.length];
  if (factor === undefined) throw new RangeError(`Cellarpact knows the critical range for 2 to 8 replicates, not ${values.length}.`);
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  const range = Math.max(...values) - Math.min(...values);
  const limit = factor * repeatabilitySd;
  const acceptable = range <= limit;
  return {
    mean,
    range,
    limit,
    acceptable,
    message: acceptable
      ? `The ${values.length} results agree within repeatability (range ${range.toPrecision(3)} ≤ ${limit.toPrecision(3)}); their mean stands for the sample.`
      : `The ${values.length} results differ by ${range.toPrecision(3)}, more than the ${limit.toPrecision(3)} the method's repeatability allows; repeat the analysis rather than average them.`,
  };
}
