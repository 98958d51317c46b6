import { useInfiniteQuery, useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { useFilterParams } from "../../lib/use-filter-params.ts";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { specListQuery, type SpecFilters } from "./api/specs.ts";
import { contractsQuery } from "../../lib/contracts.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { QueryStatus } from "../../components/ui/states.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import { StatusBadge } from "./status-badge.tsx";
import { LegalCaution } from "../../components/legal-caution.tsx";
import { NewContractForm } from "./new-contract-form.tsx";
import { MARKET_IDS, MARKET_PACKS } from "../../../shared/engine/index.ts";
import { SPEC_STATUSES, SPEC_STATUS_LABELS } from "../../../shared/specs/vocabulary.ts";
import { can } from "../../../shared/auth/permissions.ts";
import { Row, Cell } from "../../components/ui/table.tsx";
import { FilterField } from "../../components/ui/filter-field.tsx";
import { PagedTable } from "../../components/ui/paged-table.tsx";

const vintages = (from: number, to: number | null) => (to ? `${from}–${to}` : `${from} →`);

export function SpecsListPage() {
  const { orgId, membership } = useOrganisation();
  const [params, set] = useFilterParams();
  const filters: SpecFilters = {
    wine: params.get("wine") ? Number(params.get("wine")) : undefined,
    producer: params.get("producer") ? Number(params.get("producer")) : undefined,
    market: params.get("market") ?? undefined,
    status: params.get("status") ?? undefined,
    q: params.get("q") ?? undefined,
  };
  return (
    <>
      <PageHeader title="Specifications" lead="Technical specifications per wine and destination market, version by version." />
      <div className="flex flex-col gap-6">
        <LegalCaution />
        <ContractsCard orgId={orgId} />
        {can(membership.role, "specs.draft") && (
          <details className="rounded-card border border-line bg-card p-gutter">
            <summary className="cursor-pointer text-lg font-semibold">Open a new contract</summary>
            <div className="mt-4">
              <NewContractForm orgId={orgId} />
            </div>
          </details>
        )}
        <Card title="Versions">
          <SpecFiltersBar orgId={orgId} filters={filters} set={set} />
          <SpecTable orgId={orgId} filters={filters} />
        </Card>
      </div>
    </>
  );
}

function ContractsCard({ orgId }: { orgId: number }) {
  const contracts = useQuery(contractsQuery(orgId));
  return (
    <Card title="Contracts">
      <QueryStatus query={contracts} empty="No contracts yet." />
      {contracts.data && contracts.data.length > 0 && (
        <ul className="grid gap-3 md:grid-cols-2">
          {contracts.data.map((c) => {
            const agreed = c.versions.find((v) => v.status === "agreed");
            return (
              <li key={c.id} className="rounded-md border border-line p-3">
                <Link to={`/contracts/${c.id}`} className="font-semibold text-must-700 underline">
                  {c.wine.name}
                </Link>
                <p className="text-sm text-ink-500">
                  {c.reference} · {c.producer.name} · {c.wine.markets.join(", ")}
                </p>
                <p className="mt-1 text-sm">
                  {agreed ? (
                    <>Version {agreed.number} agreed</>
                  ) : c.versions.length ? (
                    `${c.versions.length} version(s), none agreed`
                  ) : (
                    "No spec yet"
                  )}
                </p>
              </li>
            );
          })}
        </ul>
      )}
    </Card>
  );
}

function SpecFiltersBar({ orgId, filters, set }: { orgId: number; filters: SpecFilters; set: (k: string, v: string) => void }) {
  const contracts = useQuery(contractsQuery(orgId));
  const wines = [...new Map((contracts.data ?? []).map((c) => [c.wine.id, c.wine.name])).entries()];
  const producers = [...new Map((contracts.data ?? []).map((c) => [c.producer.id, c.producer.name])).entries()];
  return (
    <div className="mb-4 grid gap-3 md:grid-cols-5">
      <FilterField label="Search" placeholder="Wine, contract, region" value={filters.q} onFilter={(q) => set("q", q)} />
      <SelectField
        label="Wine"
        value={filters.wine ?? ""}
        onChange={(e) => set("wine", e.target.value)}
        options={[{ value: "", label: "All wines" }, ...wines.map(([id, name]) => ({ value: String(id), label: name }))]}
      />
      <SelectField
        label="Producer"
        value={filters.producer ?? ""}
        onChange={(e) => set("producer", e.target.value)}
        options={[{ value: "", label: "All producers" }, ...producers.map(([id, name]) => ({ value: String(id), label: name }))]}
      />
      <SelectField
        label="Market"
        value={filters.market ?? ""}
        onChange={(e) => set("market", e.target.value)}
        options={[{ value: "", label: "All markets" }, ...MARKET_IDS.map((m) => ({ value: m, label: MARKET_PACKS[m].name }))]}
      />
      <SelectField
        label="Status"
        value={filters.status ?? ""}
        onChange={(e) => set("status", e.target.value)}
        options={[{ value: "", label: "Any status" }, ...SPEC_STATUSES.map((s) => ({ value: s, label: SPEC_STATUS_LABELS[s] }))]}
      />
    </div>
  );
}

function SpecTable({ orgId, filters }: { orgId: number; filters: SpecFilters }) {
  const list = useInfiniteQuery(specListQuery(orgId, filters));
  return (
    <PagedTable
      query={list}
      empty="No version matches these filters."
      noun="versions"
      headings={["Wine", "Contract", "Producer", "Version", "Status", "Vintages", "Rows", "Updated"]}
    >
      {(rows) =>
        rows.map((v) => (
          <Row key={v.id}>
            <Cell className="font-semibold">
              <Link to={`/specs/${v.id}`} className="text-must-700 underline">
                {v.contract.wine.name}
              </Link>
            </Cell>
            <Cell>{v.contract.reference}</Cell>
            <Cell>{v.contract.producer.name}</Cell>
            <Cell className="tabular-nums">v{v.number}</Cell>
            <Cell>
              <StatusBadge status={v.status} />
            </Cell>
            <Cell className="tabular-nums">{vintages(v.vintageFrom, v.vintageTo)}</Cell>
            <Cell className="tabular-nums">{v.requirementCount}</Cell>
            <Cell className="tabular-nums">{v.updatedAt.slice(0, 10)}</Cell>
          </Row>
        ))
      }
    </PagedTable>
  );
}
