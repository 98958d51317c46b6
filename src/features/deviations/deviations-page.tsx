import { useInfiniteQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { useFilterParams } from "../../lib/use-filter-params.ts";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { deviationsQuery } from "./api/deviations.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { QueryStatus } from "../../components/ui/states.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import {
  DEVIATION_KIND_LABELS,
  DEVIATION_STATUSES,
  DEVIATION_OUTCOME_LABELS,
  DEVIATION_STATUS_LABELS,
} from "../../../shared/deviations/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";
import { MoreRows } from "../../components/ui/more-rows.tsx";
import { rowsOf } from "../../lib/paged.ts";

export function DeviationsPage() {
  const { orgId } = useOrganisation();
  const [params, set] = useFilterParams();
  const f = {
    status: params.get("status") ?? undefined,
    overdue: params.get("overdue") ?? undefined,
    contract: params.get("contract") ?? undefined,
  };
  const list = useInfiniteQuery(deviationsQuery(orgId, f));
  return (
    <>
      <PageHeader
        title="Deviations"
        lead="Results outside the agreed specification, transit drift and deviations opened by hand, until the buyer decides."
      />
      <Card>
        <div className="mb-4 grid gap-3 md:grid-cols-3">
          <SelectField
            label="Status"
            value={f.status ?? ""}
            onChange={(e) => set("status", e.target.value)}
            options={[
              { value: "", label: "Any status" },
              ...DEVIATION_STATUSES.map((s) => ({ value: s, label: DEVIATION_STATUS_LABELS[s] })),
            ]}
          />
          <SelectField
            label="Response"
            value={f.overdue ?? ""}
            onChange={(e) => set("overdue", e.target.value)}
            options={[
              { value: "", label: "All" },
              { value: "true", label: "Overdue only" },
              { value: "false", label: "Not overdue" },
            ]}
          />
        </div>
        <QueryStatus query={list} empty="No deviation matches." />
        {rowsOf(list.data).length > 0 && (
          <>
            <DataTable headings={["#", "Lot", "Wine", "Parameters", "Status", "Respond by"]}>
              {rowsOf(list.data).map((d) => (
                <Row key={d.id}>
                  <Cell>
                    <Link to={`/deviations/${d.id}`} className="font-semibold text-must-700 underline">
                      #{d.id}
                    </Link>
                  </Cell>
                  <Cell>
                    {d.lotCode}
                    <span className="block text-xs text-ink-500">{d.vintage}</span>
                  </Cell>
                  <Cell>
                    {d.wineName}
                    <span className="block text-xs text-ink-500">{d.producerName}</span>
                  </Cell>
                  <Cell>
                    {d.parameters.map((p) => findParameter(p)?.name ?? p).join(", ") || "—"}
                    <span className="block text-xs text-ink-500">{DEVIATION_KIND_LABELS[d.kind]}</span>
                  </Cell>
                  <Cell>
                    {DEVIATION_STATUS_LABELS[d.status]}
                    {d.outcome && <span className="block text-xs text-ink-500">{DEVIATION_OUTCOME_LABELS[d.outcome]}</span>}
                  </Cell>
                  <Cell className="tabular-nums">
                    {/* A decided deviation waits for nobody's answer. */}
                    {d.respondBy && !d.outcome ? d.respondBy.slice(0, 10) : "—"}
                    {d.overdue && <span className="ml-2 rounded-full bg-alarm-50 px-2 text-xs font-semibold text-alarm-700">overdue</span>}
                  </Cell>
                </Row>
              ))}
            </DataTable>
            <MoreRows query={list} noun="deviations" />
          </>
        )}
      </Card>
    </>
  );
}
