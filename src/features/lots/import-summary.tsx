/** After an import: exactly what was stored, counted by outcome over every sample and then sample by sample. */
import { findParameter, type Outcome } from "../../../shared/engine/index.ts";
import { countsText, OUTCOME_RANK, type OutcomeCounts } from "../../../shared/lots/judge.ts";
import type { ImportResult } from "../../../shared/lots/views.ts";
import { Notice } from "../../components/ui/states.tsx";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const names = (ps: string[]) => ps.map((p) => findParameter(p)?.name ?? p).join(", ");

export function ImportSummary({
  outcome,
}: {
  outcome: { analyses: number; lotsCreated: number; samples: ImportResult["samples"]; failing: ImportResult["failing"] };
}) {
  const total: OutcomeCounts = {};
  for (const s of outcome.samples)
    for (const o of OUTCOME_RANK) if (s.counts[o]) total[o as Outcome] = (total[o as Outcome] ?? 0) + s.counts[o]!;
  const clean = outcome.samples.filter((s) => Object.keys(s.counts).every((o) => o === "pass")).length;
  const failingBy = new Map(outcome.failing.map((f) => [f.analysisId, f.parameters]));
  return (
    <>
      <Notice tone={outcome.failing.length ? "error" : clean === outcome.samples.length ? "success" : "info"}>
        {outcome.analyses} analyses stored{outcome.lotsCreated ? `, ${outcome.lotsCreated} new lots registered` : ""}. Results:{" "}
        {countsText(total)}. {clean} of {outcome.samples.length} samples pass on every required parameter
        {outcome.failing.length
          ? `; ${outcome.failing.length} ${outcome.failing.length === 1 ? "falls" : "fall"} outside the specification and deviations were opened.`
          : "."}
      </Notice>
      <DataTable headings={["Lot", "Results stored", "Failing"]} dense caption="What was stored for each sample" captionHidden>
        {outcome.samples.slice(0, 100).map((s) => (
          <Row key={s.analysisId}>
            <Cell dense className="font-semibold">
              {s.lotCode}
            </Cell>
            <Cell dense>{countsText(s.counts)}</Cell>
            <Cell dense className="text-alarm-700">
              {failingBy.has(s.analysisId) ? names(failingBy.get(s.analysisId)!) : "—"}
            </Cell>
          </Row>
        ))}
      </DataTable>
      {outcome.samples.length > 100 && (
        <p className="text-xs text-ink-500">First 100 samples of {outcome.samples.length} shown; every lot's page has its own.</p>
      )}
    </>
  );
}
