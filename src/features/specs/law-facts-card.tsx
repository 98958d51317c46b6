/** What the law needs to know about the wine: read by both sides, stated by the buyer's technologist. */
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { Card } from "../../components/ui/page.tsx";
import { Button } from "../../components/ui/button.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { applyServerErrors } from "../../lib/form-errors.ts";
import {
  LAW_FACT_CHOICES,
  lawFactFormValue,
  lawFactQuestion,
  lawFactsFormSchema,
  lawFactsText,
  relevantLawFacts,
  type LawFactKey,
} from "../../../shared/specs/law-facts.ts";
import type { ContractDetail } from "../../../shared/specs/views.ts";
import { useUpdateLawFacts } from "./api/law-facts.ts";

type FormInput = z.input<typeof lawFactsFormSchema>;
type FormOutput = z.output<typeof lawFactsFormSchema>;

export function LawFactsCard({ orgId, contract }: { orgId: number; contract: ContractDetail }) {
  const [editing, setEditing] = useState(false);
  const stated = lawFactsText(contract.wine.lawFacts ?? {});
  return (
    <Card title="What the law asks about this wine">
      <p className="mb-3 text-sm text-ink-500">
        Some legal limits depend on facts an analysis cannot show. A fact left unstated is never guessed: the limits that need it are shown
        as undetermined.
      </p>
      {editing ? (
        <LawFactsForm orgId={orgId} contract={contract} onDone={() => setEditing(false)} />
      ) : (
        <>
          {stated.length ? (
            <ul className="mb-3 list-disc pl-5 text-sm">
              {stated.map((s) => (
                <li key={s}>{s}</li>
              ))}
            </ul>
          ) : (
            <p className="mb-3 text-sm">No fact stated yet.</p>
          )}
          {contract.canCreateVersion && (
            <Button variant="secondary" onClick={() => setEditing(true)}>
              State the facts
            </Button>
          )}
        </>
      )}
    </Card>
  );
}

function LawFactsForm({ orgId, contract, onDone }: { orgId: number; contract: ContractDetail; onDone: () => void }) {
  const keys = relevantLawFacts(contract.wine);
  const update = useUpdateLawFacts(orgId, contract.id);
  const [error, setError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError: setFieldError,
    formState,
  } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(lawFactsFormSchema),
    defaultValues: { lawFacts: Object.fromEntries(keys.map((k) => [k, lawFactFormValue(contract.wine.lawFacts?.[k])])) },
  });
  const onSubmit = handleSubmit((values) =>
    update.mutate(values.lawFacts, {
      onSuccess: onDone,
      onError: (err) =>
        setError(
          applyServerErrors(
            err,
            setFieldError,
            keys.map((k) => `lawFacts.${k}`),
          ),
        ),
    }),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="grid grid-cols-1 gap-3">
      {error && <Notice tone="error">{error}</Notice>}
      {keys.map((k: LawFactKey) => (
        <SelectField
          key={k}
          label={lawFactQuestion(k)}
          error={formState.errors.lawFacts?.[k]?.message}
          options={[
            { value: "", label: "Not stated" },
            ...LAW_FACT_CHOICES[k].map((c) => ({ value: lawFactFormValue(c.value), label: c.label })),
          ]}
          {...register(`lawFacts.${k}`)}
        />
      ))}
      <p className="text-xs text-ink-500">
        Verdicts already given keep the facts they were judged on; a lot's page offers to judge its results again.
      </p>
      <div className="flex gap-2">
        <Button type="submit" disabled={update.isPending}>
          {update.isPending ? "Saving…" : "Save the facts"}
        </Button>
        <Button type="button" variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
