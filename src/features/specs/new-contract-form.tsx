import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useQuery } from "@tanstack/react-query";
import { useNavigate } from "react-router-dom";
import { useState } from "react";
import { newContractSchema, type NewContractInput } from "../../../shared/specs/schemas.ts";
import { COLOURS, COLOUR_LABELS, WINE_CATEGORIES, WINE_CATEGORY_LABELS } from "../../../shared/specs/vocabulary.ts";
import { MARKET_IDS, MARKET_PACKS } from "../../../shared/engine/index.ts";
import { producersQuery, useCreateContract } from "./api/specs.ts";
import { applyServerErrors } from "../../lib/form-errors.ts";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";

const optionalNumber = (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(String(v).replace(",", ".")));

export function NewContractForm({ orgId }: { orgId: number }) {
  const navigate = useNavigate();
  const producers = useQuery(producersQuery(orgId));
  const create = useCreateContract(orgId);
  const [error, setError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError: setFieldError,
    formState,
  } = useForm<NewContractInput>({
    resolver: zodResolver(newContractSchema),
    defaultValues: {
      reference: "",
      startsOn: new Date().toISOString().slice(0, 10),
      endsOn: null,
      wine: {
        name: "",
        colour: "white",
        category: "still",
        region: "",
        markets: ["EU"],
        nominalSugarGPerL: null,
        nominalAlcoholPercentVol: null,
      },
    },
  });
  const e = formState.errors;
  const onSubmit = handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: ({ id }) => navigate(`/contracts/${id}`),
      onError: (err) =>
        setError(
          applyServerErrors(err, setFieldError, [
            "reference",
            "producerOrgId",
            "startsOn",
            "endsOn",
            "wine.name",
            "wine.region",
            "wine.markets",
          ]),
        ),
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4 md:grid-cols-3">
      {error && (
        <div className="md:col-span-3">
          <Notice tone="error">{error}</Notice>
        </div>
      )}
      <TextField label="Contract reference" error={e.reference?.message} {...register("reference")} />
      <SelectField
        label="Producer"
        error={e.producerOrgId?.message}
        options={[
          { value: "", label: producers.isPending ? "Loading…" : "Choose…" },
          ...(producers.data ?? []).map((p) => ({ value: String(p.id), label: `${p.name} (${p.country})` })),
        ]}
        {...register("producerOrgId", { setValueAs: (v) => (v === "" ? undefined : Number(v)) })}
      />
      <TextField label="Wine name" error={e.wine?.name?.message} {...register("wine.name")} />
      <SelectField label="Colour" options={COLOURS.map((c) => ({ value: c, label: COLOUR_LABELS[c] }))} {...register("wine.colour")} />
      <SelectField
        label="Style"
        options={WINE_CATEGORIES.map((c) => ({ value: c, label: WINE_CATEGORY_LABELS[c] }))}
        {...register("wine.category")}
      />
      <TextField label="Region" error={e.wine?.region?.message} {...register("wine.region")} />
      <TextField
        label="Usual sugar (g/L)"
        inputMode="decimal"
        hint="Picks the legal SO2 band."
        error={e.wine?.nominalSugarGPerL?.message}
        {...register("wine.nominalSugarGPerL", { setValueAs: optionalNumber })}
      />
      <TextField
        label="Usual alcohol (% vol)"
        inputMode="decimal"
        error={e.wine?.nominalAlcoholPercentVol?.message}
        {...register("wine.nominalAlcoholPercentVol", { setValueAs: optionalNumber })}
      />
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Starts on" type="date" error={e.startsOn?.message} {...register("startsOn")} />
        <TextField
          label="Ends on"
          type="date"
          error={e.endsOn?.message}
          {...register("endsOn", { setValueAs: (v) => (v === "" ? null : v) })}
        />
      </div>
      <fieldset className="md:col-span-3">
        <legend className="mb-1 text-sm font-semibold">Destination markets</legend>
        <div className="flex flex-wrap gap-4">
          {MARKET_IDS.map((m) => (
            <label key={m} className="flex items-center gap-2 text-sm">
              <input type="checkbox" value={m} {...register("wine.markets")} /> {MARKET_PACKS[m].name}
            </label>
          ))}
        </div>
        {e.wine?.markets?.message && (
          <p role="alert" className="text-xs font-semibold text-alarm-700">
            {e.wine.markets.message}
          </p>
        )}
      </fieldset>
      <div className="md:col-span-3">
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? "Opening…" : "Open the contract"}
        </Button>
      </div>
    </form>
  );
}
