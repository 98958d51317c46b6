/**
 * The buyer's editor for a draft. Every change is checked live by the engine and saved
 * automatically; a save that lost a race gets a clear conflict message and overwrites nothing.
 */
import { FormProvider, useFieldArray, useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useRef, useState } from "react";

import { specDraftSchema, type SpecDraftInput, type SpecRowInput } from "../../../shared/specs/schemas.ts";
import { STAGES, STAGE_LABELS } from "../../../shared/specs/vocabulary.ts";
import { wineProfile } from "../../../shared/specs/profile.ts";
import { DEFAULT_DECISION_RULE, PARAMETERS, findParameter } from "../../../shared/engine/index.ts";
import { ApiError, errorMessage } from "../../lib/api-client.ts";
import { useInvalidateSpecs, useSaveDraft } from "./api/specs.ts";
import type { SpecVersionDetail } from "../../../shared/specs/views.ts";
import { RequirementRow } from "./requirement-row.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { TextField } from "../../components/ui/field.tsx";
import { DataTable } from "../../components/ui/table.tsx";

const AUTOSAVE_MS = 900;

type SaveState =
  | { kind: "idle" }
  | { kind: "saving" }
  | { kind: "saved"; at: string }
  | { kind: "invalid" }
  | { kind: "conflict"; message: string }
  | { kind: "error"; message: string };

function toDraft(v: SpecVersionDetail): SpecDraftInput {
  return {
    lockVersion: v.lockVersion,
    title: v.title,
    vintageFrom: v.vintageFrom,
    vintageTo: v.vintageTo,
    stages: v.stages,
    rows: v.requirements.map(({ id: _id, ...r }) => r as SpecRowInput),
  };
}

export function SpecEditor({
  orgId,
  version,
  onSavedChange,
}: {
  orgId: number;
  version: SpecVersionDetail;
  onSavedChange: (clean: boolean) => void;
}) {
  const invalidate = useInvalidateSpecs(orgId);
  const save = useSaveDraft(orgId, version.id);
  const form = useForm<SpecDraftInput>({ resolver: zodResolver(specDraftSchema), defaultValues: toDraft(version), mode: "onChange" });
  const rows = useFieldArray({ control: form.control, name: "rows" });
  const values = useWatch({ control: form.control });
  const [state, setState] = useState<SaveState>({ kind: "idle" });
  const lock = useRef(version.lockVersion);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const [adding, setAdding] = useState("");
  const stages = values.stages ?? version.stages;
  const profile = wineProfile(version.contract.wine, values.vintageFrom ?? version.vintageFrom);

  const saveNow = async () => {
    clearTimeout(timer.current);
    const ok = await form.trigger();
    if (!ok) {
      setState({ kind: "invalid" });
      onSavedChange(false);
      return;
    }
    setState({ kind: "saving" });
    save.mutate(
      { ...form.getValues(), lockVersion: lock.current },
      {
        onSuccess: (r) => {
          lock.current = r.lockVersion;
          setState({ kind: "saved", at: new Date(r.updatedAt).toLocaleTimeString("en-GB") });
          form.reset(form.getValues(), { keepValues: true });
          onSavedChange(true);
          void invalidate();
        },
        onError: (err) => {
          onSavedChange(false);
          if (err instanceof ApiError && err.status === 409) setState({ kind: "conflict", message: err.detail });
          else if (err instanceof ApiError && err.errors.length) {
            for (const e of err.errors) form.setError(e.path as never, { message: e.message });
            setState({ kind: "invalid" });
          } else setState({ kind: "error", message: errorMessage(err) });
        },
      },
    );
  };

  // Autosave a moment after the last change; a conflict stops autosaving until the page is reloaded.
  const conflicted = state.kind === "conflict";
  useEffect(() => {
    if (conflicted) return;
    // eslint-disable-next-line react-hooks/incompatible-library -- a subscription, not a value read during render
    const subscription = form.watch(() => {
      onSavedChange(false);
      clearTimeout(timer.current);
      timer.current = setTimeout(() => void saveNow(), AUTOSAVE_MS);
    });
    return () => {
      subscription.unsubscribe();
      clearTimeout(timer.current);
    };
    // saveNow reads everything through refs and the form; re-subscribing on each render would reset the timer.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [conflicted]);

  const used = new Set((values.rows ?? []).map((r) => r?.parameter));
  const addRow = () => {
    const p = findParameter(adding);
    if (!p) return;
    rows.append({
      parameter: p.id,
      unit: p.unit as SpecRowInput["unit"],
      lower: null,
      upper: null,
      target: null,
      method: p.method?.ref ?? null,
      rule: DEFAULT_DECISION_RULE,
      severity: "major",
      stages: [...stages],
    });
    setAdding("");
  };

  return (
    <FormProvider {...form}>
      <form
        onSubmit={(e) => {
          e.preventDefault();
          void saveNow();
        }}
        noValidate
        className="flex flex-col gap-4"
      >
        <SaveStatus state={state} />
        <div className="grid gap-4 md:grid-cols-[2fr_1fr_1fr]">
          <TextField label="Title" error={form.formState.errors.title?.message} {...form.register("title")} />
          <TextField
            label="First vintage"
            inputMode="numeric"
            error={form.formState.errors.vintageFrom?.message}
            {...form.register("vintageFrom", { setValueAs: (v) => (v === "" ? Number.NaN : Number(v)) })}
          />
          <TextField
            label="Last vintage (empty = open)"
            inputMode="numeric"
            error={form.formState.errors.vintageTo?.message}
            {...form.register("vintageTo", { setValueAs: (v) => (v === "" || v === null ? null : Number(v)) })}
          />
        </div>
        <fieldset className="flex flex-wrap gap-4">
          <legend className="mb-1 text-sm font-semibold">Stages this version covers</legend>
          {STAGES.map((s) => (
            <label key={s} className="flex items-center gap-2 text-sm">
              <input type="checkbox" value={s} {...form.register("stages")} /> {STAGE_LABELS[s]}
            </label>
          ))}
          {form.formState.errors.stages?.message && (
            <p role="alert" className="w-full text-xs font-semibold text-alarm-700">
              {form.formState.errors.stages.message}
            </p>
          )}
        </fieldset>
        <div className="overflow-x-auto">
          <DataTable
            headings={[
              "Parameter and stages",
              "Limits",
              "Method, rule, severity",
              <>Law in {version.contract.wine.markets.join(", ")}</>,
              <>
                <span className="sr-only">Remove</span>
              </>,
            ]}
          >
            {rows.fields.map((f, i) => (
              <RequirementRow
                key={f.id}
                index={i}
                versionStages={stages as typeof version.stages}
                markets={version.contract.wine.markets}
                profile={profile}
                onRemove={() => rows.remove(i)}
              />
            ))}
          </DataTable>
          {rows.fields.length === 0 && (
            <p className="py-4 text-sm text-ink-500">No requirement yet. Add parameters from the catalogue below.</p>
          )}
        </div>
        <div className="flex flex-wrap items-end gap-3">
          <div className="flex flex-col">
            <label htmlFor="add-parameter" className="text-sm font-semibold">
              Add a parameter
            </label>
            <select
              id="add-parameter"
              className="rounded-md border border-line bg-white px-3 py-2"
              value={adding}
              onChange={(e) => setAdding(e.target.value)}
            >
              <option value="">Choose from the catalogue…</option>
              {[...new Set(PARAMETERS.map((p) => p.group))].map((g) => (
                <optgroup key={g} label={g}>
                  {PARAMETERS.filter((p) => p.group === g && !used.has(p.id)).map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}
                    </option>
                  ))}
                </optgroup>
              ))}
            </select>
          </div>
          <Button variant="secondary" onClick={addRow} disabled={!adding}>
            Add row
          </Button>
          <Button type="submit" variant="secondary" disabled={save.isPending}>
            Save now
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}

function SaveStatus({ state }: { state: SaveState }) {
  switch (state.kind) {
    case "idle":
      return (
        <p className="text-sm text-ink-500" role="status">
          Changes save automatically.
        </p>
      );
    case "saving":
      return (
        <p className="text-sm text-ink-500" role="status">
          Saving…
        </p>
      );
    case "saved":
      return (
        <p className="text-sm text-verjus-700" role="status">
          All changes saved at {state.at}.
        </p>
      );
    case "invalid":
      return <Notice tone="error">Not saved: fix the marked fields first.</Notice>;
    case "conflict":
      return (
        <Notice tone="error">
          {state.message}{" "}
          <button type="button" className="font-semibold underline" onClick={() => window.location.reload()}>
            Reload
          </button>
        </Notice>
      );
    case "error":
      return <Notice tone="error">Not saved: {state.message}</Notice>;
  }
}
