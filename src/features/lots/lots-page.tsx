import { useInfiniteQuery, useQuery } from "@tanstack/react-query";
import { Link, useNavigate } from "react-router-dom";
import { useFilterParams } from "../../lib/use-filter-params.ts";
import { useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useState } from "react";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { lotsQuery, useRegisterLot } from "./api/lots.ts";
import { contractsQuery } from "../../lib/contracts.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { FilterField } from "../../components/ui/filter-field.tsx";
import { PagedTable } from "../../components/ui/paged-table.tsx";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import { LotStatusBadge } from "../../components/lot-status-badge.tsx";
import { lotSchema, type LotInput } from "../../../shared/lots/schemas.ts";
import { ANALYSIS_STAGE_LABELS, CONTAINERS, CONTAINER_LABELS } from "../../../shared/lots/vocabulary.ts";
import { MARKET_PACKS } from "../../../shared/engine/index.ts";
import { applyServerErrors } from "../../lib/form-errors.ts";
import { can } from "../../../shared/auth/permissions.ts";
import { Row, Cell } from "../../components/ui/table.tsx";

export function LotsPage() {
  const { orgId, membership } = useOrganisation();
  const [params, set] = useFilterParams();
  const filters = { contract: params.get("contract") ? Number(params.get("contract")) : undefined, q: params.get("q") ?? undefined };
  return (
    <>
      <PageHeader title="Lots" lead="Every lot under your contracts, its latest analysis and verdict." />
      <div className="flex flex-col gap-6">
        {can(membership.role, "lots.submit") && (
          <details className="rounded-card border border-line bg-card p-gutter">
            <summary className="cursor-pointer text-lg font-semibold">Register a lot</summary>
            <div className="mt-4">
              <RegisterLotForm orgId={orgId} />
            </div>
          </details>
        )}
        <Card>
          <LotFilters orgId={orgId} filters={filters} set={set} />
          <LotTable orgId={orgId} filters={filters} />
        </Card>
      </div>
    </>
  );
}

function LotFilters({
  orgId,
  filters,
  set,
}: {
  orgId: number;
  filters: { contract?: number; q?: string };
  set: (k: string, v: string) => void;
}) {
  const contracts = useQuery(contractsQuery(orgId));
  return (
    <div className="mb-4 grid gap-3 md:grid-cols-3">
      <FilterField label="Lot code contains" value={filters.q} onFilter={(q) => set("q", q)} />
      <SelectField
        label="Contract"
        value={filters.contract ?? ""}
        onChange={(e) => set("contract", e.target.value)}
        options={[
          { value: "", label: "All contracts" },
          ...(contracts.data ?? []).map((c) => ({ value: String(c.id), label: `${c.reference} · ${c.wine.name}` })),
        ]}
      />
    </div>
  );
}

function LotTable({ orgId, filters }: { orgId: number; filters: { contract?: number; q?: string } }) {
  const lots = useInfiniteQuery(lotsQuery(orgId, filters));
  return (
    <PagedTable
      query={lots}
      empty="No lot matches."
      noun="lots"
      headings={["Lot", "Wine", "Vintage", "Container", "Planned", "Latest analysis", "Status", "Open deviations"]}
    >
      {(rows) =>
        rows.map((l) => (
          <Row key={l.id}>
            <Cell className="font-semibold">
              <Link to={`/lots/${l.id}`} className="text-must-700 underline">
                {l.lotCode}
              </Link>
            </Cell>
            <Cell>{l.wineName}</Cell>
            <Cell className="tabular-nums">{l.vintage}</Cell>
            <Cell>{CONTAINER_LABELS[l.container]}</Cell>
            <Cell className="tabular-nums">{l.plannedDate ?? "—"}</Cell>
            <Cell>{l.latestStage ? ANALYSIS_STAGE_LABELS[l.latestStage] : "—"}</Cell>
            <Cell>
              <LotStatusBadge status={l.status} />
            </Cell>
            <Cell className="tabular-nums">{l.status.openDeviations || "—"}</Cell>
          </Row>
        ))
      }
    </PagedTable>
  );
}

function RegisterLotForm({ orgId }: { orgId: number }) {
  const navigate = useNavigate();
  const contracts = useQuery(contractsQuery(orgId));
  const register = useRegisterLot(orgId);
  const [error, setError] = useState<string | null>(null);
  const form = useForm<LotInput>({
    resolver: zodResolver(lotSchema),
    defaultValues: { vintage: new Date().getUTCFullYear() - 1, container: "bottles", market: "EU", plannedDate: null },
  });
  const e = form.formState.errors;
  const num = (v: unknown) => (v === "" ? undefined : Number(String(v).replace(",", ".")));
  const contractId = useWatch({ control: form.control, name: "contractId" });
  const chosen = contracts.data?.find((c) => c.id === contractId);
  // The market list follows the contract: keep the choice only while the contract covers it.
  useEffect(() => {
    if (chosen && !chosen.wine.markets.includes(form.getValues("market"))) form.setValue("market", chosen.wine.markets[0]!);
  }, [chosen, form]);
  return (
    <form
      noValidate
      className="grid gap-3 md:grid-cols-4"
      onSubmit={form.handleSubmit((v) =>
        register.mutate(v, {
          onSuccess: ({ id }) => navigate(`/lots/${id}`),
          onError: (err) => setError(applyServerErrors(err, form.setError, ["lotCode", "contractId", "vintage", "market"])),
        }),
      )}
    >
      {error && (
        <div className="md:col-span-4">
          <Notice tone="error">{error}</Notice>
        </div>
      )}
      <SelectField
        label="Contract"
        error={e.contractId?.message}
        options={[
          { value: "", label: "Choose…" },
          ...(contracts.data ?? []).map((c) => ({ value: String(c.id), label: `${c.reference} · ${c.wine.name}` })),
        ]}
        {...form.register("contractId", { setValueAs: num })}
      />
      <TextField label="Lot code" error={e.lotCode?.message} {...form.register("lotCode")} />
      <TextField label="Vintage" inputMode="numeric" error={e.vintage?.message} {...form.register("vintage", { setValueAs: num })} />
      <TextField
        label="Volume (litres)"
        inputMode="decimal"
        error={e.volumeLitres?.message}
        {...form.register("volumeLitres", { setValueAs: num })}
      />
      <SelectField
        label="Container"
        options={CONTAINERS.map((c) => ({ value: c, label: CONTAINER_LABELS[c] }))}
        {...form.register("container")}
      />
      <TextField
        label="Planned filling or shipping"
        type="date"
        {...form.register("plannedDate", { setValueAs: (v) => (v === "" ? null : v) })}
      />
      <SelectField
        label="Destination market"
        error={e.market?.message}
        hint={chosen ? undefined : "Choose the contract first: a lot goes to one of its markets."}
        options={(chosen?.wine.markets ?? []).map((m) => ({ value: m, label: MARKET_PACKS[m].name }))}
        {...form.register("market")}
      />
      <div className="flex items-end">
        <Button type="submit" disabled={register.isPending}>
          Register the lot
        </Button>
      </div>
    </form>
  );
}
