/** A whole number read from a query string (page sizes, windows, horizons), within bounds, with a default. */
import { z } from "zod";

export function countQuery(p: { fallback: number; min: number; max: number; notWhole: string; tooFew: string; tooMany: string }) {
  return z.coerce
    .number({ error: p.notWhole })
    .int({ error: p.notWhole })
    .min(p.min, { error: p.tooFew })
    .max(p.max, { error: p.tooMany })
    .default(p.fallback);
}
