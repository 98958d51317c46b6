/** The label check on the lot page: what the engine derives from the latest results, per market, each with its citation. */
import type { LotDetail } from "../../../shared/lots/views.ts";
import { labelCheck, type LabelCheckLine } from "../../../shared/lots/label-check.ts";
import { judgedMarkets } from "../../../shared/lots/judge.ts";
import { Card } from "../../components/ui/page.tsx";

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
      <table className="w-full text-left text-sm">
        <thead className="border-b border-line text-ink-500">
          <tr>
            {["Check", "Market", "Finding", "Source"].map((h) => (
              <th key={h} scope="col" className="py-2 pr-3 font-semibold">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {lines.map((l, i) => (
            <tr key={i} className="border-b border-line/60 align-top">
              <th scope="row" className="py-2 pr-3 font-semibold">
                {l.topic}
              </th>
              <td className="py-2 pr-3">{l.market ?? "—"}</td>
              <td className={`py-2 pr-3 ${TONE[l.status]}`}>
                {WORD[l.status] && <strong>{WORD[l.status]}: </strong>}
                {l.text}
              </td>
              <td className="py-2 pr-3 text-xs text-ink-500">
                {l.citation ? `${l.citation.document}, ${l.citation.article} (${l.citation.edition})` : "—"}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
