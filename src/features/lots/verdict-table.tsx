/** Verdicts with the bound that governed each one and where that bound comes from. */
import { convert, findParameter, UNITS, type UnitId } from "../../../shared/engine/index.ts";
import type { StoredBound, StoredVerdict } from "../../../shared/lots/views.ts";
import { OutcomeBadge } from "./outcome-badge.tsx";

const n = (x: number) => String(Number(x.toPrecision(5)));

function Bound({ label, b, unit, factor }: { label: string; b: StoredBound | null; unit: string; factor: number }) {
  if (!b) return null;
  return (
    <span className="block">
      {label} {n(b.value * factor)} {unit}{" "}
      <span className="text-ink-500">
        {b.source === "buyer" ? "(buyer's spec)" : `(${b.market}: ${b.citation?.document}, ${b.citation?.article})`}
      </span>
    </span>
  );
}

export function VerdictTable({ verdicts }: { verdicts: StoredVerdict[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <thead className="border-b border-line text-ink-500">
          <tr>
            {["Parameter", "Result", "Verdict", "Governing limits", "Uncertainty and rule"].map((h) => (
              <th key={h} scope="col" className="py-2 pr-3 font-semibold">{h}</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {verdicts.map((v) => {
            // Everything is shown in the unit of the spec row, as the buyer wrote it.
            const display = (v.displayUnit ?? v.unit) as UnitId;
            const unit = UNITS[display]?.label ?? display;
            const factor = convert(1, v.unit as UnitId, display);
            return (
              <tr key={v.parameter} className="border-b border-line/60 align-top" aria-label={findParameter(v.parameter)?.name ?? v.parameter}>
                <td className="py-2 pr-3 font-semibold">{findParameter(v.parameter)?.name ?? v.parameter}</td>
                <td className="py-2 pr-3 tabular-nums">{v.resultText === null ? "—" : `${v.resultText} ${v.unit === "presence" ? "" : unit}`}</td>
                <td className="py-2 pr-3">
                  <OutcomeBadge outcome={v.outcome} />
                  {v.informativeOutcome && <span className="block text-xs text-ink-500">would be {v.informativeOutcome}</span>}
                  {v.conformanceProbability !== null && <span className="block text-xs text-ink-500">P(conform) {(v.conformanceProbability * 100).toFixed(1)} %</span>}
                </td>
                <td className="py-2 pr-3 text-xs">
                  <Bound label="min" b={v.lower} unit={unit} factor={factor} />
                  <Bound label="max" b={v.upper} unit={unit} factor={factor} />
                  {!v.lower && !v.upper && <span className="text-ink-500">—</span>}
                  {v.legalLimits.map((l) => (
                    <span key={`${l.market}-${l.side}`} className="mt-1 block text-ink-500">
                      Law, {l.market}: {l.side} {n(l.value * factor)} {unit} ({l.citation.document}, {l.citation.article})
                    </span>
                  ))}
                </td>
                <td className="py-2 pr-3 text-xs text-ink-700">
                  {v.uncertainty && v.uncertainty.source !== "none" ? `u = ${n(v.uncertainty.u * factor)} ${unit} (${v.uncertainty.source === "laboratory" ? "laboratory" : "default"})` : "no uncertainty"}
                  <span className="block text-ink-500">{v.explanation}</span>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
