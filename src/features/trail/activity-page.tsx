import { useInfiniteQuery } from "@tanstack/react-query";
import { pagedQuery, rowsOf } from "../../lib/paged.ts";
import { FilterField } from "../../components/ui/filter-field.tsx";
import { MoreRows } from "../../components/ui/more-rows.tsx";
import { useMutation } from "@tanstack/react-query";
import { useFilterParams } from "../../lib/use-filter-params.ts";
import { verifyChain } from "../../lib/trail.ts";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import type { TrailEntryView } from "../../../shared/trail/views.ts";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, QueryStatus } from "../../components/ui/states.tsx";
import { actionLabel, detailsText } from "../../../shared/trail/vocabulary.ts";
import { can } from "../../../shared/auth/permissions.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";
import { TreeHeadPanel } from "./tree-head-panel.tsx";

export function ActivityPage() {
  const { orgId, membership } = useOrganisation();
  const [params, set] = useFilterParams();
  const filters = Object.fromEntries(["action", "entityType", "from", "to"].map((k) => [k, params.get(k) ?? ""]).filter(([, v]) => v));
  const qs = new URLSearchParams(filters);
  const entries = useInfiniteQuery({
    ...pagedQuery<TrailEntryView>(["orgs", orgId, "trail", filters], `/api/orgs/${orgId}/trail`, filters),
    enabled: can(membership.role, "trail.organisation"),
  });
  const verify = useMutation({ mutationFn: () => verifyChain(orgId) });
  if (!can(membership.role, "trail.organisation")) return <EmptyState title="Only an organisation admin sees the organisation's trail." />;
  return (
    <>
      <PageHeader
        title="Trail"
        lead="What was done in your organisation, as recorded. Each entry is chained to the previous one by its SHA-256 hash, so later changes show."
      />
      <Card>
        <div className="mb-4 grid gap-3 md:grid-cols-4">
          <FilterField label="Action starts with" placeholder="deviation." value={filters.action} onFilter={(v) => set("action", v)} />
          <SelectField
            label="Entity"
            value={filters.entityType ?? ""}
            onChange={(e) => set("entityType", e.target.value)}
            options={[
              { value: "", label: "Any" },
              ...[
                "user",
                "membership",
                "invitation",
                "organisation",
                "contract",
                "spec_version",
                "lot",
                "analysis",
                "certificate",
                "deviation",
              ].map((v) => ({ value: v, label: v.replace("_", " ") })),
            ]}
          />
          <TextField label="From" type="date" value={filters.from ?? ""} onChange={(e) => set("from", e.target.value)} />
          <TextField label="To" type="date" value={filters.to ?? ""} onChange={(e) => set("to", e.target.value)} />
        </div>
        <div className="mb-4 flex flex-wrap items-center gap-3">
          <a
            className="rounded-md border border-line px-3 py-1.5 text-sm font-semibold hover:bg-must-50"
            href={`/api/orgs/${orgId}/trail?${qs}&format=csv`}
          >
            Export CSV
          </a>
          <a
            className="rounded-md border border-line px-3 py-1.5 text-sm font-semibold hover:bg-must-50"
            href={`/api/orgs/${orgId}/trail?${qs}&format=json`}
          >
            Export JSON
          </a>
          <Button variant="secondary" onClick={() => verify.mutate()} disabled={verify.isPending}>
            Verify the hash chain
          </Button>
          {verify.data?.ok && (
            <span className="text-sm font-semibold text-verjus-700" role="status">
              Intact: {verify.data.checked} entries checked.
            </span>
          )}
          {verify.data && !verify.data.ok && (
            <span className="text-sm font-semibold text-alarm-700" role="status">
              Broken at entry {verify.data.firstBroken?.seq}: {verify.data.firstBroken?.reason}.
            </span>
          )}
        </div>
        <QueryStatus query={entries} empty="Nothing recorded yet." />
        {rowsOf(entries.data).length > 0 && (
          <>
            <DataTable headings={["#", "When (UTC)", "Who", "What", "Details", "Hash"]}>
              {rowsOf(entries.data).map((e) => (
                <Row key={e.seq}>
                  <Cell className="tabular-nums">{e.seq}</Cell>
                  <Cell className="tabular-nums">{e.occurredAt.replace("T", " ").slice(0, 19)}</Cell>
                  <Cell>{e.actorName ?? "system"}</Cell>
                  <Cell>
                    {actionLabel(e.action)}
                    <span className="block font-mono text-xs text-ink-500">{e.action}</span>
                  </Cell>
                  <Cell className="text-ink-700">{detailsText(e.details) || "—"}</Cell>
                  <Cell className="font-mono text-xs text-ink-500">{e.hash.slice(0, 12)}…</Cell>
                </Row>
              ))}
            </DataTable>
            <MoreRows query={entries} noun="entries" />
          </>
        )}
        <TreeHeadPanel orgId={orgId} />
      </Card>
    </>
  );
}
