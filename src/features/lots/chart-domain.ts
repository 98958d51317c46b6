/** The drawn range always holds the spec limits and every result, with a little room around them. */
export function chartDomain(values: readonly number[], lower: number | null, upper: number | null): [number, number] {
  const all = [...values, ...(lower !== null ? [lower] : []), ...(upper !== null ? [upper] : [])];
  if (!all.length) return [0, 1];
  const lo = Math.min(...all);
  const hi = Math.max(...all);
  const pad = (hi - lo || Math.abs(hi) || 1) * 0.08;
  return [lo - pad, hi + pad];
}
