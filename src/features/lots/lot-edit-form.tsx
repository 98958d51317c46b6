import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { lotUpdateSchema, type LotUpdate } from "../../../shared/lots/schemas.ts";
import { CONTAINERS, CONTAINER_LABELS } from "../../../shared/lots/vocabulary.ts";
import { MARKET_PACKS } from "../../../shared/engine/index.ts";
import type { LotDetail } from "../../../shared/lots/views.ts";
import { api, errorMessage } from "../../lib/api-client.ts";
import { lotKeys } from "./api/lots.ts";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";

/** Correcting a lot's volume, container, planned date or market (lots created by a CSV import start with volume 0). */
export function LotEditForm({ orgId, lot }: { orgId: number; lot: LotDetail }) {
  const qc = useQueryClient();
  const save = useMutation({
    mutationFn: (v: LotUpdate) => api<void>(`/api/orgs/${orgId}/lots/${lot.id}`, { method: "PATCH", body: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: lotKeys.all(orgId) }),
  });
  const form = useForm<LotUpdate>({
    resolver: zodResolver(lotUpdateSchema),
    defaultValues: {
      volumeLitres: lot.volumeLitres,
      container: lot.container,
      plannedDate: lot.plannedDate,
      market: lot.market,
      labelledAlcoholPercentVol: lot.labelledAlcoholPercentVol,
    },
  });
  const e = form.formState.errors;
  return (
    <form noValidate className="grid gap-3 md:grid-cols-3 md:items-end" onSubmit={form.handleSubmit((v) => save.mutate(v))}>
      {save.isError && (
        <div className="md:col-span-3">
          <Notice tone="error">{errorMessage(save.error)}</Notice>
        </div>
      )}
      {save.isSuccess && (
        <div className="md:col-span-3">
          <Notice tone="success">Saved.</Notice>
        </div>
      )}
      <TextField
        label="Volume (litres)"
        inputMode="decimal"
        error={e.volumeLitres?.message}
        {...form.register("volumeLitres", { setValueAs: (v) => (v === "" ? undefined : Number(String(v).replace(",", "."))) })}
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
        options={lot.contract.wine.markets.map((m) => ({ value: m, label: MARKET_PACKS[m].name }))}
        {...form.register("market")}
      />
      <TextField
        label="Labelled alcohol (% vol)"
        inputMode="decimal"
        hint="As the label states it; the label check compares it with the analysis."
        error={e.labelledAlcoholPercentVol?.message}
        {...form.register("labelledAlcoholPercentVol", {
          setValueAs: (v) => (v === "" || v === null ? null : Number(String(v).replace(",", "."))),
        })}
      />
      <Button type="submit" disabled={save.isPending}>
        Save the lot
      </Button>
    </form>
  );
}
