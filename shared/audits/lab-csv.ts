/**
 * Filling the laboratory's results form from its own CSV export: samples read by the shared CSV
 * mapping (shared/lots/csv.ts) are matched to the order's lots by lot code and kept for the ordered
 * parameters only; everything else is reported, never silently dropped.
 */
import { findParameter } from "../engine/index.ts";
import type { ImportSample } from "../lots/csv.ts";

export interface FormCell {
  raw: string;
  unit: string;
  /** Expanded uncertainty U (k = 2) as typed, or "". */
  u: string;
}

export const cellKey = (lotId: number, parameter: string) => `${lotId}:${parameter}`;

export function cellsFromSamples(
  samples: readonly ImportSample[],
  lots: readonly { lotId: number; lotCode: string }[],
  parameters: readonly string[],
) {
  const cells: Record<string, FormCell> = {};
  const skipped: string[] = [];
  const byCode = new Map(lots.map((l) => [l.lotCode.toLowerCase(), l.lotId]));
  for (const s of samples) {
    const lotId = byCode.get(s.lotCode.toLowerCase());
    if (lotId === undefined) {
      skipped.push(`lot ${s.lotCode} is not in this order`);
      continue;
    }
    for (const r of s.results) {
      if (!parameters.includes(r.parameter)) {
        skipped.push(`${findParameter(r.parameter)?.name ?? r.parameter} for ${s.lotCode} was not ordered`);
        continue;
      }
      const u = r.uncertainty ? (r.uncertainty.kind === "expanded" ? r.uncertainty.value : r.uncertainty.value * 2) : null;
      cells[cellKey(lotId, r.parameter)] = { raw: r.raw, unit: r.unit, u: u === null ? "" : String(u) };
    }
  }
  return { cells, skipped };
}
