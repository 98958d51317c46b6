/** Runs the engine's backtest in small steps so the page stays responsive and can show progress. */
import {
  backtestSteps,
  type BacktestSummary,
  type BuyerRequirement,
  type MarketId,
  type PastResult,
} from "../../../shared/engine/index.ts";
import { wineProfile, type WineFacts } from "../../../shared/specs/profile.ts";
import type { PastResultRow } from "../../../shared/specs/views.ts";

export function toPastResults(rows: PastResultRow[], wine: WineFacts): PastResult[] {
  return rows.map((r) => ({
    lotId: r.lotId,
    lotCode: r.lotCode,
    vintage: r.vintage,
    parameter: r.parameter,
    input: { reading: r.reading, unit: r.unit, uncertainty: r.uncertainty },
    profile: wineProfile(wine, r.vintage),
  }));
}

export async function runBacktest(
  results: PastResult[],
  current: BuyerRequirement[],
  draft: BuyerRequirement[],
  markets: MarketId[],
  onProgress: (done: number, total: number) => void,
): Promise<BacktestSummary> {
  const steps = backtestSteps(results, current, draft, markets, 200);
  for (;;) {
    const step = steps.next();
    if (step.done) {
      onProgress(results.length, results.length);
      return step.value;
    }
    onProgress(step.value.done, step.value.total);
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
}
