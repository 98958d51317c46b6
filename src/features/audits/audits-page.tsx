import { useState } from "react";
import { useInfiniteQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { useFilterParams } from "../../lib/use-filter-params.ts";
import { ordersQuery } from "./api/audits.ts";
import { FinanceSummary } from "./finance-summary.tsx";
import { NewAuditForm } from "./new-audit-form.tsx";
import { OrderStatusBadge } from "./order-status-badge.tsx";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { Button } from "../../components/ui/button.tsx";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { QueryStatus } from "../../components/ui/states.tsx";
import { formatMoney, ORDER_STATUSES, ORDER_STATUS_LABELS } from "../../../shared/audits/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import { can } from "../../../shared/auth/permissions.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";
import { MoreRows } from "../../components/ui/more-rows.tsx";
import { rowsOf } from "../../lib/paged.ts";

const LEADS = {
  buyer_finance: "Independent compliance audits: order them from a laboratory's price list, pay them, and follow what they cost.",
  lab_analyst: "Paid orders from buyers. Analyse the lots and send your results; the producer's declared values stay hidden until you do.",
  other: "Independent audits of lots, and how the laboratory's results compare with the declared ones.",
};

export function AuditsPage() {
  const { orgId, membership } = useOrganisation();
  const role = membership.role;
  const [params, set] = useFilterParams();
  const f = { status: params.get("status") ?? undefined, from: params.get("from") ?? undefined, to: params.get("to") ?? undefined };
  const [ordering, setOrdering] = useState(false);
  const list = useInfiniteQuery(ordersQuery(orgId, f));
  const finance = can(role, "audits.order");
  const lab = can(role, "audits.report");
  return (
    <>
      <PageHeader
        title="Audits"
        lead={finance ? LEADS.buyer_finance : lab ? LEADS.lab_analyst : LEADS.other}
        actions={finance && !ordering ? <Button onClick={() => setOrdering(true)}>Order an audit</Button> : undefined}
      />
      <div className="flex flex-col gap-6">
        {finance && ordering && (
          <Card title="Order an independent audit">
            <NewAuditForm orgId={orgId} />
            <Button variant="quiet" className="mt-2" onClick={() => setOrdering(false)}>
              Cancel
            </Button>
          </Card>
        )}
        {finance && <FinanceSummary orgId={orgId} from={f.from} to={f.to} />}
        <Card title="Orders">
          <div className="mb-4 grid gap-3 md:grid-cols-3">
            <SelectField
              label="Status"
              value={f.status ?? ""}
              onChange={(e) => set("status", e.target.value)}
              options={[{ value: "", label: "Any status" }, ...ORDER_STATUSES.map((s) => ({ value: s, label: ORDER_STATUS_LABELS[s] }))]}
            />
            <TextField label="Ordered from" type="date" value={f.from ?? ""} onChange={(e) => set("from", e.target.value)} />
            <TextField label="Ordered until" type="date" value={f.to ?? ""} onChange={(e) => set("to", e.target.value)} />
          </div>
          <QueryStatus query={list} empty="No audit order matches." />
          {rowsOf(list.data).length > 0 && (
            <>
              <DataTable headings={["Order", "Wine and lots", "Parameters", "Laboratory", finance ? "Amount" : "Ordered", "Status"]}>
                {rowsOf(list.data).map((o) => (
                  <Row key={o.id}>
                    <Cell>
                      <Link to={`/audits/${o.id}`} className="font-semibold text-must-700 underline">
                        {o.reference}
                      </Link>
                      <span className="block text-xs text-ink-500">{o.createdAt.slice(0, 10)}</span>
                    </Cell>
                    <Cell>
                      {o.wineName}
                      <span className="block text-xs text-ink-500">
                        {o.producerName} · {o.lotCodes.join(", ")}
                      </span>
                    </Cell>
                    <Cell>{o.parameters.map((p) => findParameter(p)?.name ?? p).join(", ")}</Cell>
                    <Cell>{o.laboratoryName}</Cell>
                    <Cell className="tabular-nums">{finance ? formatMoney(o.amountCents, o.currency) : o.createdAt.slice(0, 10)}</Cell>
                    <Cell>
                      <OrderStatusBadge status={o.status} />
                    </Cell>
                  </Row>
                ))}
              </DataTable>
              <MoreRows query={list} noun="orders" />
            </>
          )}
        </Card>
      </div>
    </>
  );
}
