/** The label check on the lot page: what the engine derives from the latest results, per market, each with its citation. */
import type { LotDetail } from "../../../shared/lots/views.ts";
import { labelCheck, type LabelCheckLine } from "../../../shared/lots/label-check.ts";
import { judgedMarkets } from "../../../shared/lots/judge.ts";
import { Card } from "../../components/ui/page.tsx";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const TONE: Record<LabelCheckLine["status"], string> = {
  ok: "text-verjus-700",
  problem: "text-alarm-700",
  info: "text-ink-900",
  undetermined: "text-ochre-700",
};
const WORD: Record<LabelCheckLine["status"], string> = {
  ok: "Within tolerance",
  problem: "Problem",
  info: "",
  undetermined: "Undetermined",
};

export function LabelCheckCard({ lot }: { lot: LotDetail }) {
  const results = lot.analyses.filter((a) => a.auditOrderId === null).flatMap((a) => a.results);
  if (!results.length) return null;
  const lines = labelCheck({
    category: lot.contract.wine.category,
    markets: judgedMarkets(lot.market, lot.contract.wine.markets),
    labelledAlcoholPercentVol: lot.labelledAlcoholPercentVol,
    results,
  });
  return (
    <Card title="Label check">
      <p className="mb-3 text-sm text-ink-700">
        From the latest declared results. The sulphite allergen statement and the label's wording follow the law of the market of sale:
        confirm them with the competent authority, and borderline results with an accredited laboratory, before the label is printed.
      </p>
      <DataTable headings={["Check", "Market", "Finding", "Source"]}>
        {lines.map((l, i) => (
          <Row key={i}>
            <th scope="row" className="py-2 pr-3 font-semibold">
              {l.topic}
            </th>
            <Cell>{l.market ?? "—"}</Cell>
            <Cell className={`${TONE[l.status]}`}>
              {WORD[l.status] && <strong>{WORD[l.status]}: </strong>}
              {l.text}
            </Cell>
            <Cell className="text-xs text-ink-500">
              {l.citation ? `${l.citation.document}, ${l.citation.article} (${l.citation.edition})` : "—"}
            </Cell>
          </Row>
        ))}
      </DataTable>
    </Card>
  );
}
