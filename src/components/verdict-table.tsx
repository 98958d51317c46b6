/** Verdicts with the bound that governed each one and where that bound comes from. */
import { unconfirmedReason, convert, displayValue, findParameter, unitLabel } from "../../shared/engine/index.ts";
import type { ResultView, StoredBound, StoredVerdict } from "../../shared/lots/views.ts";
import { OutcomeBadge } from "./outcome-badge.tsx";
import { DataTable, Row, Cell } from "./ui/table.tsx";

function Bound({
  label,
  b,
  unit,
  factor,
  show,
}: {
  label: string;
  b: StoredBound | null;
  unit: string;
  factor: number;
  show: (x: number) => string;
}) {
  if (!b) return null;
  return (
    <span className="block">
      {label} {show(b.value * factor)} {unit}{" "}
      <span className="text-ink-500">
        {b.source === "buyer" ? "(buyer's spec)" : `(${b.market}: ${b.citation?.document}, ${b.citation?.article})`}
      </span>
    </span>
  );
}

/** `reported`: the results as the laboratory wrote them, shown beside a value converted to the spec's unit. */
export function VerdictTable({ verdicts, reported = [] }: { verdicts: StoredVerdict[]; reported?: ResultView[] }) {
  return (
    <DataTable headings={["Parameter", "Result", "Verdict", "Governing limits", "Uncertainty and rule"]}>
      {verdicts.map((v) => {
        // Everything is shown in the unit of the spec row, as the buyer wrote it.
        const display = v.displayUnit ?? v.unit;
        const unit = unitLabel(display);
        const factor = convert(1, v.unit, display);
        const show = (x: number) => displayValue(v.parameter, x, display);
        const shown = v.value === null ? v.resultText : show(v.value * factor);
        const asReported = reported.find((r) => r.parameter === v.parameter);
        const differs = asReported && (asReported.unit !== display || asReported.rawText.trim() !== shown);
        return (
          <Row key={v.parameter} aria-label={findParameter(v.parameter)?.name ?? v.parameter}>
            <Cell className="font-semibold">{findParameter(v.parameter)?.name ?? v.parameter}</Cell>
            <Cell className="tabular-nums">
              {shown === null ? "—" : `${shown} ${v.unit === "presence" ? "" : unit}`}
              {differs && (
                <span className="block text-xs text-ink-500">
                  reported: {asReported.rawText} {asReported.unit === "presence" ? "" : unitLabel(asReported.unit)}
                </span>
              )}
            </Cell>
            <Cell>
              <OutcomeBadge outcome={v.outcome} />
              {v.informativeOutcome && <span className="block text-xs text-ink-500">would be {v.informativeOutcome}</span>}
              {v.conformanceProbability !== null && (
                <span className="block text-xs text-ink-500">P(conform) {(v.conformanceProbability * 100).toFixed(1)} %</span>
              )}
            </Cell>
            <Cell className="text-xs">
              <Bound label="min" b={v.lower} unit={unit} factor={factor} show={show} />
              <Bound label="max" b={v.upper} unit={unit} factor={factor} show={show} />
              {!v.lower && !v.upper && <span className="text-ink-500">—</span>}
              {v.legalLimits.map((l) => (
                <span key={`${l.market}-${l.side}`} className="mt-1 block text-ink-500">
                  Law, {l.market}: {l.side} {show(l.value * factor)} {unit} ({l.citation.document}, {l.citation.article})
                  {unconfirmedReason(l.confirmed) && (
                    <span className="block text-ochre-700">Citation not yet confirmed: {unconfirmedReason(l.confirmed)}</span>
                  )}
                </span>
              ))}
            </Cell>
            <Cell className="text-xs text-ink-700">
              {v.uncertainty && v.uncertainty.source !== "none"
                ? `U = ${show(2 * v.uncertainty.u * factor)} ${unit}, k = 2 (${v.uncertainty.source === "laboratory" ? "laboratory" : "default"})`
                : "no uncertainty"}
              <span className="block text-ink-500">{v.explanation}</span>
            </Cell>
          </Row>
        );
      })}
    </DataTable>
  );
}
