/** Outcome and conditions, shared by proposals and decisions. */
import {
  CONDITION_KINDS,
  CONDITION_LABELS,
  DEVIATION_OUTCOMES,
  DEVIATION_OUTCOME_LABELS,
  type DeviationCondition,
  type DeviationOutcome,
} from "../../../shared/deviations/vocabulary.ts";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";

export function ProposalFields({
  idPrefix,
  outcome,
  conditions,
  onChange,
}: {
  idPrefix: string;
  outcome: DeviationOutcome;
  conditions: DeviationCondition[];
  onChange: (o: DeviationOutcome, c: DeviationCondition[]) => void;
}) {
  return (
    <div className="flex flex-col gap-2">
      <SelectField
        label="Outcome"
        id={`${idPrefix}-outcome`}
        value={outcome}
        onChange={(e) => onChange(e.target.value as DeviationOutcome, conditions)}
        options={DEVIATION_OUTCOMES.map((o) => ({ value: o, label: DEVIATION_OUTCOME_LABELS[o] }))}
      />
      {conditions.map((c, i) => (
        <div key={i} className="grid gap-2 md:grid-cols-[1fr_2fr_auto] md:items-end">
          <SelectField
            label={`Condition ${i + 1}`}
            value={c.kind}
            onChange={(e) =>
              onChange(
                outcome,
                conditions.map((x, j) => (j === i ? { ...x, kind: e.target.value as DeviationCondition["kind"] } : x)),
              )
            }
            options={CONDITION_KINDS.map((k) => ({ value: k, label: CONDITION_LABELS[k] }))}
          />
          <TextField
            label={`What condition ${i + 1} requires`}
            value={c.detail}
            onChange={(e) =>
              onChange(
                outcome,
                conditions.map((x, j) => (j === i ? { ...x, detail: e.target.value } : x)),
              )
            }
          />
          <Button
            variant="quiet"
            onClick={() =>
              onChange(
                outcome,
                conditions.filter((_, j) => j !== i),
              )
            }
          >
            Remove
          </Button>
        </div>
      ))}
      <Button variant="quiet" className="self-start" onClick={() => onChange(outcome, [...conditions, { kind: "retest", detail: "" }])}>
        Add a condition
      </Button>
    </div>
  );
}
