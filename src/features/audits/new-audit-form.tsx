/**
 * Ordering an independent audit: contract, lots, laboratory and parameters; the price is the
 * laboratory's list price per parameter and lot, quoted live with the same function the server uses.
 */
import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useNavigate } from "react-router-dom";
import { contractsQuery } from "../../lib/contracts.ts";
import { laboratoriesQuery, orderableLotsQuery, useCreateOrder } from "./api/audits.ts";
import { Button } from "../../components/ui/button.tsx";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { errorMessage, ApiError } from "../../lib/api-client.ts";
import { newAuditOrderSchema } from "../../../shared/audits/schemas.ts";
import { quoteAudit } from "../../../shared/audits/pricing.ts";
import { formatMoney } from "../../../shared/audits/vocabulary.ts";
import { ANALYSIS_STAGES, ANALYSIS_STAGE_LABELS, type AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";

export function NewAuditForm({ orgId }: { orgId: number }) {
  const navigate = useNavigate();
  const create = useCreateOrder(orgId);
  const contracts = useQuery(contractsQuery(orgId));
  const labs = useQuery(laboratoriesQuery(orgId));
  const [contractId, setContractId] = useState("");
  const [labId, setLabId] = useState("");
  const [lotIds, setLotIds] = useState<number[]>([]);
  const [parameters, setParameters] = useState<string[]>([]);
  const [stage, setStage] = useState<AnalysisStage>("pre_filling");
  const [note, setNote] = useState("");
  const [key] = useState(() => crypto.randomUUID());
  const [errors, setErrors] = useState<Record<string, string>>({});
  const lots = useQuery({ ...orderableLotsQuery(orgId, Number(contractId)), enabled: !!contractId });
  const lab = labs.data?.find((l) => String(l.id) === labId);
  const quote = lab ? quoteAudit(lab.items, lotIds.length, parameters) : null;
  const toggle = <T,>(list: T[], item: T) => (list.includes(item) ? list.filter((x) => x !== item) : [...list, item]);

  const submit = () => {
    const body = {
      idempotencyKey: key,
      contractId: Number(contractId),
      laboratoryOrgId: Number(labId),
      lotIds,
      parameters,
      stage,
      note: note.trim() || null,
    };
    const parsed = newAuditOrderSchema.safeParse(body);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (o) => navigate(`/audits/${o.id}`),
      onError: (err) => {
        if (err instanceof ApiError && err.errors.length)
          setErrors(Object.fromEntries(err.errors.map((e) => [e.path.split(".")[0]!, e.message])));
      },
    });
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 md:grid-cols-3">
        <SelectField
          label="Contract"
          value={contractId}
          error={errors.contractId}
          onChange={(e) => {
            setContractId(e.target.value);
            setLotIds([]);
          }}
          options={[
            { value: "", label: "Choose a contract" },
            ...(contracts.data ?? []).map((c) => ({ value: String(c.id), label: `${c.wine.name} — ${c.producer.name} (${c.reference})` })),
          ]}
        />
        <SelectField
          label="Laboratory"
          value={labId}
          error={errors.laboratoryOrgId}
          onChange={(e) => setLabId(e.target.value)}
          options={[{ value: "", label: "Choose a laboratory" }, ...(labs.data ?? []).map((l) => ({ value: String(l.id), label: l.name }))]}
        />
        <SelectField
          label="Compare with the producer's results at"
          value={stage}
          onChange={(e) => setStage(e.target.value as AnalysisStage)}
          options={ANALYSIS_STAGES.map((s) => ({ value: s, label: ANALYSIS_STAGE_LABELS[s] }))}
        />
      </div>

      <fieldset className="rounded-md border border-line p-3">
        <legend className="px-1 text-sm font-semibold">Lots</legend>
        {!contractId && <p className="text-sm text-ink-500">Choose a contract first.</p>}
        {lots.data?.length === 0 && <p className="text-sm text-ink-500">No lot is registered under this contract yet.</p>}
        <div className="grid gap-1 md:grid-cols-3">
          {lots.data?.map((l) => (
            <label key={l.id} className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={lotIds.includes(l.id)} onChange={() => setLotIds(toggle(lotIds, l.id))} />
              {l.lotCode} <span className="text-ink-500">({l.vintage})</span>
            </label>
          ))}
        </div>
        {errors.lotIds && (
          <p role="alert" className="mt-1 text-xs font-semibold text-alarm-700">
            {errors.lotIds}
          </p>
        )}
      </fieldset>

      <fieldset className="rounded-md border border-line p-3">
        <legend className="px-1 text-sm font-semibold">Parameters and the laboratory's prices (per lot)</legend>
        {!lab && <p className="text-sm text-ink-500">Choose a laboratory to see what it offers.</p>}
        <div className="grid gap-1 md:grid-cols-3">
          {lab?.items
            .map((i) => ({ ...i, name: findParameter(i.parameter)?.name ?? i.parameter }))
            .sort((a, b) => a.name.localeCompare(b.name))
            .map((i) => (
              <label key={i.parameter} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  checked={parameters.includes(i.parameter)}
                  onChange={() => setParameters(toggle(parameters, i.parameter))}
                />
                {i.name} <span className="tabular-nums text-ink-500">{formatMoney(i.priceCents)}</span>
              </label>
            ))}
        </div>
        {errors.parameters && (
          <p role="alert" className="mt-1 text-xs font-semibold text-alarm-700">
            {errors.parameters}
          </p>
        )}
      </fieldset>

      <TextField label="Note for the laboratory (optional)" value={note} onChange={(e) => setNote(e.target.value)} maxLength={1000} />

      <div className="flex flex-wrap items-center gap-4">
        <p className="text-lg font-semibold tabular-nums" aria-live="polite">
          Total: {formatMoney(quote?.totalCents ?? 0)}
          <span className="ml-2 text-sm font-normal text-ink-500">
            {parameters.length} parameter(s) × {lotIds.length} lot(s)
          </span>
        </p>
        <Button onClick={submit} disabled={create.isPending}>
          Place the order
        </Button>
      </div>
      {create.isError && !(create.error instanceof ApiError && create.error.errors.length) && (
        <Notice tone="error">{errorMessage(create.error)}</Notice>
      )}
    </div>
  );
}
