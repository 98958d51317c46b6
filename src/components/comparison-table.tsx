/** Declared against independent results, parameter by parameter, with the scores and what they mean. */
import { convert, findParameter, UNITS, type ComparisonOutcome, type ResultComparison } from "../../shared/engine/index.ts";
import { DataTable, Row, Cell } from "./ui/table.tsx";

const TONE: Record<ComparisonOutcome, string> = {
  agrees: "bg-verjus-50 text-verjus-700",
  questionable: "bg-ochre-50 text-ochre-700",
  discrepant: "bg-alarm-50 text-alarm-700",
  "not comparable": "bg-line/50 text-ink-700",
};
const n = (x: number | null, digits = 3) => (x === null ? "—" : String(Number(x.toPrecision(digits))));

export function ComparisonTable({ comparisons, caption }: { comparisons: ResultComparison[]; caption: string }) {
  return (
    <DataTable headings={["Parameter", "Declared ± U", "Independent ± U", "En", "z", "Reading"]} caption={caption}>
      {comparisons.map((c) => {
        // Stored in the canonical unit; shown in the unit the laboratory reported in.
        const shown = c.displayUnit ?? c.unit;
        const f = convert(1, c.unit, shown);
        const unit = UNITS[shown]?.label ?? shown;
        const v = (x: number | null, digits?: number) => n(x === null ? null : x * f, digits);
        return (
          <Row key={c.parameter}>
            <th scope="row" className="py-2 pr-3 font-normal">
              {findParameter(c.parameter)?.name ?? c.parameter}
            </th>
            <Cell className="tabular-nums">{c.declared === null ? "—" : `${v(c.declared)} ± ${v(c.declaredU, 2)} ${unit}`}</Cell>
            <Cell className="tabular-nums">{c.independent === null ? "—" : `${v(c.independent)} ± ${v(c.independentU, 2)} ${unit}`}</Cell>
            <Cell className="tabular-nums">{n(c.en)}</Cell>
            <Cell className="tabular-nums">{n(c.z)}</Cell>
            <Cell>
              <span className={`inline-block whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-semibold ${TONE[c.outcome]}`}>
                {c.outcome}
              </span>
              <span className="mt-1 block max-w-md text-xs text-ink-500">{c.explanation}</span>
            </Cell>
          </Row>
        );
      })}
    </DataTable>
  );
}
