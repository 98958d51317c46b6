/** The overview's count of lots due soon, by the same status words the lots list and lot pages use. */
import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { LOT_STATUSES, type LotStatus } from "../../../shared/lots/lot-status.ts";
import { Card } from "../../components/ui/page.tsx";
import { ErrorState, LoadingState } from "../../components/ui/states.tsx";
import { LotStatusBadge } from "../../components/lot-status-badge.tsx";
import { dueLotsQuery } from "./api/due-lots.ts";

export function DueLotsCard({ orgId }: { orgId: number }) {
  const due = useQuery(dueLotsQuery(orgId));
  if (due.isPending)
    return (
      <Card title="Lots due soon">
        <LoadingState />
      </Card>
    );
  if (due.isError)
    return (
      <Card title="Lots due soon">
        <ErrorState error={due.error} onRetry={() => due.refetch()} />
      </Card>
    );
  const { items, total } = due.data;
  const byStatus = new Map<string, { status: LotStatus; count: number }>();
  for (const row of items) byStatus.set(row.status.code, { status: row.status, count: (byStatus.get(row.status.code)?.count ?? 0) + 1 });
  const open = items.reduce((n, r) => n + r.status.openDeviations, 0);
  return (
    <Card title="Lots due soon">
      {items.length === 0 ? (
        <p className="text-sm text-ink-700">No lot is due for filling or shipment in the next four months.</p>
      ) : (
        <ul className="flex flex-col gap-2 text-sm" aria-label="Lots due soon by status">
          {LOT_STATUSES.filter((code) => byStatus.has(code)).map((code) => (
            <li key={code} className="flex items-center gap-2">
              <span className="w-8 text-right font-semibold tabular-nums">{byStatus.get(code)!.count}</span>
              <LotStatusBadge status={byStatus.get(code)!.status} />
            </li>
          ))}
        </ul>
      )}
      {total > items.length && (
        <p className="mt-3 text-sm text-ink-500">
          The {items.length.toLocaleString("en-GB")} soonest of {total.toLocaleString("en-GB")} lots due.
        </p>
      )}
      {open > 0 && (
        <p className="mt-3 text-sm text-alarm-700">
          {open === 1 ? "1 deviation is still open on them." : `${open} deviations are still open on them.`}
        </p>
      )}
      <Link to="/readiness" className="mt-4 inline-block text-sm font-semibold text-must-700 underline">
        The readiness board
      </Link>
    </Card>
  );
}
