/** One editable requirement row: parameter, unit (converting the limits), limits, method, rule, severity, stages, live check. */
import { useFormContext, useWatch } from "react-hook-form";
import {
  convert,
  isUnit,
  findParameter,
  parseDecimal,
  PARAMETERS,
  UNITS,
  type MarketId,
  type WineProfile,
} from "../../../shared/engine/index.ts";
import { SEVERITIES, SEVERITY_LABELS, STAGE_LABELS, type Stage } from "../../../shared/specs/vocabulary.ts";
import type { SpecDraftInput } from "../../../shared/specs/schemas.ts";
import { LegalCheck } from "./legal-check.tsx";
import { presetOf, ruleOptions, RULE_PRESETS } from "./rule-presets.ts";
import { Row, Cell } from "../../components/ui/table.tsx";

const cell = "rounded border border-line bg-white px-2 py-1 text-sm aria-[invalid=true]:border-alarm-700";
const toNumber = (v: unknown) =>
  v === "" || v === null || v === undefined ? null : typeof v === "number" ? v : (parseDecimal(String(v)) ?? Number.NaN);

interface Props {
  index: number;
  versionStages: Stage[];
  markets: MarketId[];
  profile: WineProfile;
  onRemove: () => void;
}

export function RequirementRow({ index, versionStages, markets, profile, onRemove }: Props) {
  const { register, setValue, getValues, formState } = useFormContext<SpecDraftInput>();
  const row = useWatch<SpecDraftInput, `rows.${number}`>({ name: `rows.${index}` });
  const errors = formState.errors.rows?.[index];
  const p = findParameter(row.parameter);
  const name = p?.name ?? row.parameter;
  const id = (field: string) => `row-${index}-${field}`;
  const err = (field: keyof NonNullable<typeof errors>) => (errors?.[field] as { message?: string } | undefined)?.message;

  /** Changing the unit converts the limits already typed, so the meaning of the row stays the same. */
  const changeUnit = (to: string) => {
    if (!isUnit(to)) return;
    const from = getValues(`rows.${index}.unit`);
    for (const f of ["lower", "upper", "target"] as const) {
      const v = getValues(`rows.${index}.${f}`);
      if (typeof v === "number" && Number.isFinite(v))
        setValue(`rows.${index}.${f}`, Number(convert(v, from, to).toPrecision(6)), { shouldDirty: true });
    }
    setValue(`rows.${index}.unit`, to, { shouldDirty: true, shouldValidate: true });
  };

  const numberField = (f: "lower" | "upper" | "target", label: string) => (
    <div className="flex flex-col">
      <label htmlFor={id(f)} className="text-xs text-ink-500">
        {label}
      </label>
      <input
        id={id(f)}
        inputMode="decimal"
        className={`${cell} w-20`}
        aria-invalid={err(f) ? true : undefined}
        aria-describedby={err(f) ? id(`${f}-error`) : undefined}
        {...register(`rows.${index}.${f}`, { setValueAs: toNumber })}
      />
    </div>
  );

  const messages = (["parameter", "unit", "lower", "upper", "target", "stages", "rule", "method"] as const)
    .map((f) => [f, err(f)] as const)
    .filter(([, m]) => m);

  return (
    <Row aria-label={name}>
      <Cell>
        <label htmlFor={id("parameter")} className="sr-only">
          Parameter of row {index + 1}
        </label>
        <select
          id={id("parameter")}
          className={`${cell} w-52`}
          value={row.parameter}
          onChange={(e) => {
            const next = findParameter(e.target.value);
            if (!next) return;
            setValue(`rows.${index}.parameter`, next.id, { shouldDirty: true });
            setValue(`rows.${index}.unit`, next.unit, { shouldDirty: true });
            setValue(`rows.${index}.method`, next.method?.ref ?? null, { shouldDirty: true, shouldValidate: true });
          }}
        >
          {PARAMETERS.map((q) => (
            <option key={q.id} value={q.id}>
              {q.name}
            </option>
          ))}
        </select>
        <div className="mt-2 flex flex-wrap gap-x-3 gap-y-1" role="group" aria-label={`Stages requiring ${name}`}>
          {versionStages.map((s) => (
            <label key={s} className="flex items-center gap-1 text-xs">
              <input type="checkbox" value={s} {...register(`rows.${index}.stages`)} />
              {STAGE_LABELS[s]}
            </label>
          ))}
        </div>
      </Cell>
      <Cell>
        <div className="grid grid-cols-3 gap-2">
          {numberField("lower", "Min")}
          {numberField("upper", "Max")}
          {numberField("target", "Target")}
          <div className="col-span-3 flex flex-col">
            <label htmlFor={id("unit")} className="text-xs text-ink-500">
              Unit
            </label>
            <select
              id={id("unit")}
              className={`${cell} w-full`}
              value={row.unit}
              onChange={(e) => changeUnit(e.target.value)}
              aria-invalid={err("unit") ? true : undefined}
            >
              {(p?.units ?? [row.unit]).map((u) => (
                <option key={u} value={u}>
                  {UNITS[u]?.label ?? u}
                </option>
              ))}
            </select>
          </div>
        </div>
        {messages.length > 0 && (
          <ul className="mt-1 text-xs font-semibold text-alarm-700">
            {messages.map(([f, m]) => (
              <li key={f} id={id(`${f}-error`)} role="alert">
                {m}
              </li>
            ))}
          </ul>
        )}
      </Cell>
      <Cell>
        <label htmlFor={id("method")} className="text-xs text-ink-500">
          Method
        </label>
        <input
          id={id("method")}
          className={`${cell} w-36`}
          {...register(`rows.${index}.method`, { setValueAs: (v) => (v === "" ? null : v) })}
        />
        <label htmlFor={id("rule")} className="mt-1 block text-xs text-ink-500">
          Decision rule
        </label>
        <select
          id={id("rule")}
          className={`${cell} w-52`}
          value={presetOf(row.rule)}
          onChange={(e) => {
            const preset = RULE_PRESETS.find((x) => x.id === e.target.value);
            if (preset) setValue(`rows.${index}.rule`, preset.rule, { shouldDirty: true, shouldValidate: true });
          }}
        >
          {ruleOptions(row.rule).map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
        <label htmlFor={id("severity")} className="mt-1 block text-xs text-ink-500">
          Severity
        </label>
        <select id={id("severity")} className={`${cell} w-52`} {...register(`rows.${index}.severity`)}>
          {SEVERITIES.map((s) => (
            <option key={s} value={s}>
              {SEVERITY_LABELS[s]}
            </option>
          ))}
        </select>
      </Cell>
      <Cell className="w-72">
        <LegalCheck
          row={{ ...row, lower: toNumber(row.lower), upper: toNumber(row.upper), target: toNumber(row.target) }}
          markets={markets}
          profile={profile}
        />
      </Cell>
      <Cell>
        <button
          type="button"
          onClick={onRemove}
          className="rounded px-2 py-1 text-sm font-semibold text-alarm-700 hover:bg-alarm-50"
          aria-label={`Remove ${name}`}
        >
          Remove
        </button>
      </Cell>
    </Row>
  );
}
