/** The finance view of audits: totals, spend per producer and per month, what is still unpaid. */
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { dashboardQuery } from "./api/audits.ts";
import { Card } from "../../components/ui/page.tsx";
import { ErrorState, LoadingState } from "../../components/ui/states.tsx";
import { formatMoney } from "../../../shared/audits/vocabulary.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

function Figure({ label, cents, currency }: { label: string; cents: number; currency: string }) {
  return (
    <div className="rounded-md border border-line bg-white p-3">
      <p className="text-sm text-ink-500">{label}</p>
      <p className="text-2xl font-semibold tabular-nums">{formatMoney(cents, currency)}</p>
    </div>
  );
}

function SpendTable({
  caption,
  head,
  rows,
  currency,
}: {
  caption: string;
  head: string;
  rows: { key: string; paidOrders: number; paidCents: number; refundedCents: number }[];
  currency: string;
}) {
  return (
    <DataTable headings={[head, "Paid orders", "Paid", "Refunded", "Net"]} dense caption={caption}>
      {rows.length === 0 && (
        <tr>
          <Cell colSpan={5} className="text-ink-500">
            No paid order in this period.
          </Cell>
        </tr>
      )}
      {rows.map((r) => (
        <Row key={r.key}>
          <th scope="row" className="py-1 pr-3 font-normal">
            {r.key}
          </th>
          <Cell dense className="tabular-nums">
            {r.paidOrders}
          </Cell>
          <Cell dense className="tabular-nums">
            {formatMoney(r.paidCents, currency)}
          </Cell>
          <Cell dense className="tabular-nums">
            {formatMoney(r.refundedCents, currency)}
          </Cell>
          <Cell dense className="tabular-nums">
            {formatMoney(r.paidCents - r.refundedCents, currency)}
          </Cell>
        </Row>
      ))}
    </DataTable>
  );
}

export function FinanceSummary({ orgId, from, to }: { orgId: number; from?: string; to?: string }) {
  const d = useQuery(dashboardQuery(orgId, { from, to }));
  if (d.isPending) return <LoadingState />;
  if (d.isError) return <ErrorState error={d.error} onRetry={() => d.refetch()} />;
  const { totals, currency } = d.data;
  return (
    <Card title="Spend on audits">
      <div className="grid gap-3 md:grid-cols-4">
        <Figure
          label={`Paid (${totals.paidOrders} order${totals.paidOrders === 1 ? "" : "s"})`}
          cents={totals.paidCents}
          currency={currency}
        />
        <Figure label={`Outstanding (${d.data.outstanding.length} unpaid)`} cents={totals.outstandingCents} currency={currency} />
        <Figure label="Refunded" cents={totals.refundedCents} currency={currency} />
        <Figure label="Net spend" cents={totals.paidCents - totals.refundedCents} currency={currency} />
      </div>
      <div className="mt-4 grid gap-6 md:grid-cols-2">
        <SpendTable
          caption="Per producer"
          head="Producer"
          currency={currency}
          rows={d.data.byProducer.map((p) => ({ key: p.producerName, ...p }))}
        />
        <SpendTable
          caption="Per month (month paid)"
          head="Month"
          currency={currency}
          rows={d.data.byMonth.map((m) => ({ key: m.month, ...m }))}
        />
      </div>
      {d.data.outstanding.length > 0 && (
        <p className="mt-4 text-sm">
          Unpaid:{" "}
          {d.data.outstanding.map((o, i) => (
            <span key={o.id}>
              {i > 0 && ", "}
              <Link to={`/audits/${o.id}`} className="font-semibold text-must-700 underline">
                {o.reference}
              </Link>{" "}
              ({formatMoney(o.amountCents, o.currency)})
            </span>
          ))}
        </p>
      )}
    </Card>
  );
}
