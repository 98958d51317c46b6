import { useQuery } from "@tanstack/react-query";
import { Link, useNavigate, useParams } from "react-router-dom";
import { useState } from "react";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { useCreateVersion } from "./api/specs.ts";
import { contractQuery } from "../../lib/contracts.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, ErrorState, LoadingState, Notice } from "../../components/ui/states.tsx";
import { Button } from "../../components/ui/button.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import { StatusBadge } from "./status-badge.tsx";
import { LawFactsCard } from "./law-facts-card.tsx";
import { ContractAcceptance } from "./contract-acceptance.tsx";
import { SPEC_TEMPLATES } from "../../../shared/specs/templates.ts";
import { COLOUR_LABELS, STAGE_LABELS, WINE_CATEGORY_LABELS } from "../../../shared/specs/vocabulary.ts";
import { MARKET_PACKS } from "../../../shared/engine/index.ts";
import { errorMessage } from "../../lib/api-client.ts";
import type { ContractDetail } from "../../../shared/specs/views.ts";

export function ContractPage() {
  const { orgId } = useOrganisation();
  const { contractId } = useParams();
  const contract = useQuery({ ...contractQuery(orgId, Number(contractId)) });
  if (contract.isPending) return <LoadingState />;
  if (contract.isError) return <ErrorState error={contract.error} onRetry={() => contract.refetch()} />;
  const c = contract.data;
  return (
    <>
      <PageHeader
        title={c.wine.name}
        lead={`Contract ${c.reference} between ${c.retailer.name} and ${c.producer.name}.`}
        actions={
          <div className="flex flex-wrap gap-2">
            <Link
              to={`/lots?contract=${c.id}`}
              className="rounded-md border border-line bg-card px-3 py-1.5 text-sm font-semibold hover:bg-must-50"
            >
              Lots
            </Link>
            <Link
              to={`/contracts/${c.id}/trends`}
              className="rounded-md border border-line bg-card px-3 py-1.5 text-sm font-semibold hover:bg-must-50"
            >
              Trends
            </Link>
            {c.side === "producer" && (
              <Link
                to={`/contracts/${c.id}/import`}
                className="rounded-md bg-must-700 px-3 py-1.5 text-sm font-semibold text-white hover:bg-must-800"
              >
                Import results (CSV)
              </Link>
            )}
          </div>
        }
      />
      <div className="mb-6 empty:hidden">
        <ContractAcceptance orgId={orgId} contract={c} />
      </div>
      <div className="grid gap-6 lg:grid-cols-3">
        <div className="flex flex-col gap-6 lg:col-span-1">
          <Card title="The wine">
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
              <dt className="text-ink-500">Colour and style</dt>
              <dd>
                {COLOUR_LABELS[c.wine.colour]}, {WINE_CATEGORY_LABELS[c.wine.category].toLowerCase()}
              </dd>
              <dt className="text-ink-500">Region</dt>
              <dd>{c.wine.region}</dd>
              <dt className="text-ink-500">Destination markets</dt>
              <dd>{c.wine.markets.map((m) => MARKET_PACKS[m].name).join("; ")}</dd>
              <dt className="text-ink-500">Usual sugar</dt>
              <dd>{c.wine.nominalSugarGPerL ?? "—"} g/L</dd>
              <dt className="text-ink-500">Usual alcohol</dt>
              <dd>{c.wine.nominalAlcoholPercentVol ?? "—"} % vol</dd>
              <dt className="text-ink-500">Contract runs</dt>
              <dd>
                {c.startsOn} to {c.endsOn ?? "open"}
              </dd>
            </dl>
          </Card>
          <LawFactsCard orgId={orgId} contract={c} />
        </div>
        <Card title="Spec versions" className="lg:col-span-2">
          {c.versions.length === 0 ? (
            <EmptyState title="No spec version yet.">
              {c.canCreateVersion ? "Start one below." : "The buyer has not sent one yet."}
            </EmptyState>
          ) : (
            <ul className="divide-y divide-line/60">
              {c.versions.map((v) => (
                <li key={v.id} className="flex flex-wrap items-center gap-3 py-2 text-sm">
                  <Link to={`/specs/${v.id}`} className="font-semibold text-must-700 underline">
                    Version {v.number}
                  </Link>
                  <StatusBadge status={v.status} />
                  <span className="text-ink-500">
                    vintages {v.vintageFrom}
                    {v.vintageTo ? `–${v.vintageTo}` : " onwards"} · {v.stages.map((s) => STAGE_LABELS[s]).join(", ")}
                  </span>
                </li>
              ))}
            </ul>
          )}
          {c.canCreateVersion && <NewVersionForm orgId={orgId} contract={c} />}
        </Card>
      </div>
    </>
  );
}

function NewVersionForm({ orgId, contract }: { orgId: number; contract: ContractDetail }) {
  const navigate = useNavigate();
  const create = useCreateVersion(orgId, contract.id);
  const [from, setFrom] = useState<"blank" | "template" | "version">(contract.versions.length ? "version" : "template");
  const [templateId, setTemplateId] = useState(
    SPEC_TEMPLATES.find((t) => t.id.includes(contract.wine.colour === "red" ? "red" : "white"))?.id ?? SPEC_TEMPLATES[0]!.id,
  );
  const [versionId, setVersionId] = useState(contract.versions[0]?.id ?? 0);
  const submit = () =>
    create.mutate(from === "blank" ? { from } : from === "template" ? { from, templateId } : { from, versionId }, {
      onSuccess: ({ id }) => navigate(`/specs/${id}`),
    });
  return (
    <div className="mt-6 border-t border-line pt-4">
      <h3 className="mb-3 font-semibold">Start a new version</h3>
      {create.isError && <Notice tone="error">{errorMessage(create.error)}</Notice>}
      <div className="grid gap-3 md:grid-cols-[1fr_1fr_auto] md:items-end">
        <SelectField
          label="Start from"
          value={from}
          onChange={(e) => setFrom(e.target.value as typeof from)}
          options={[
            { value: "template", label: "A template of typical parameters" },
            ...(contract.versions.length ? [{ value: "version", label: "An earlier version" }] : []),
            { value: "blank", label: "A blank sheet" },
          ]}
        />
        {from === "template" && (
          <SelectField
            label="Template"
            value={templateId}
            onChange={(e) => setTemplateId(e.target.value)}
            options={SPEC_TEMPLATES.map((t) => ({ value: t.id, label: t.name }))}
          />
        )}
        {from === "version" && (
          <SelectField
            label="Version"
            value={versionId}
            onChange={(e) => setVersionId(Number(e.target.value))}
            options={contract.versions.map((v) => ({ value: String(v.id), label: `Version ${v.number}` }))}
          />
        )}
        {from === "blank" && <span />}
        <Button onClick={submit} disabled={create.isPending}>
          {create.isPending ? "Creating…" : "Create draft"}
        </Button>
      </div>
    </div>
  );
}
