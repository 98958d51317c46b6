/**
 * Entering one analysis by hand: one line per requirement of the governing version, with the
 * verdict computed by the engine in the browser as the user types.
 */
import { useMemo, useState } from "react";
import { findParameter, implausibility, UNITS } from "../../../shared/engine/index.ts";
import { analysisSubmissionSchema } from "../../../shared/lots/schemas.ts";
import { countsText } from "../../../shared/lots/judge.ts";
import { ANALYSIS_STAGES, ANALYSIS_STAGE_LABELS, specStageFor, type AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import type { LotDetail } from "../../../shared/lots/views.ts";
import { entryResults, judgeForLot, previewJudgement, type EntryLine } from "./entry-preview.ts";
import { useSubmitAnalysis } from "./api/lots.ts";
import { OutcomeBadge } from "../../components/outcome-badge.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { errorMessage, ApiError } from "../../lib/api-client.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

export function ResultEntryForm({ orgId, lot }: { orgId: number; lot: LotDetail }) {
  const submit = useSubmitAnalysis(orgId, lot.id);
  const requirements = lot.governing?.requirements ?? [];
  const [stage, setStage] = useState<AnalysisStage>("pre_filling");
  const [lab, setLab] = useState("");
  const [accreditation, setAccreditation] = useState("");
  const [sampleDate, setSampleDate] = useState(new Date().toISOString().slice(0, 10));
  const [lines, setLines] = useState<Record<string, EntryLine>>(() =>
    Object.fromEntries(requirements.map((r) => [r.parameter, { raw: "", unit: r.unit, u: "" }])),
  );
  const [key, setKey] = useState(() => crypto.randomUUID());
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState<string | null>(null);
  const judge = useMemo(() => judgeForLot(lot), [lot]);
  const visible = requirements.filter((r) => r.stages.includes(specStageFor(stage)) || lines[r.parameter]?.raw);
  const results = entryResults(requirements, lines);
  const preview = previewJudgement(judge, stage, results);
  const verdictOf = new Map(preview.verdicts.map((v) => [v.parameter, v]));
  const readOf = new Map(preview.read.map((r) => [r.parameter, r]));

  const onSubmit = () => {
    setDone(null);
    const body = { idempotencyKey: key, stage, laboratoryName: lab, accreditation: accreditation || null, sampleDate, results };
    const parsed = analysisSubmissionSchema.safeParse(body);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [i.path.join("."), i.message])));
      return;
    }
    setErrors({});
    submit.mutate(parsed.data, {
      onSuccess: (r) => {
        const stored = `Saved: ${countsText(r.counts)}.`;
        setDone(
          r.failing.length
            ? `${stored} Outside the specification: ${r.failing.map((p) => findParameter(p)?.name).join(", ")}. A deviation was opened.`
            : stored,
        );
        setKey(crypto.randomUUID());
        setLines(Object.fromEntries(requirements.map((r) => [r.parameter, { raw: "", unit: r.unit, u: "" }])));
      },
      onError: (err) => {
        if (err instanceof ApiError) setErrors(Object.fromEntries(err.errors.map((e) => [e.path, e.message])));
      },
    });
  };

  if (!lot.governing)
    return (
      <Notice>
        No agreed specification covers vintage {lot.vintage} yet, so results cannot be judged. The buyer must send a version and you must
        agree to it first.
      </Notice>
    );
  return (
    <div className="flex flex-col gap-4">
      {done && <Notice tone={done.includes("Outside") ? "error" : "success"}>{done}</Notice>}
      {submit.isError && <Notice tone="error">{errorMessage(submit.error)}</Notice>}
      <div className="grid gap-3 md:grid-cols-4">
        <SelectField
          label="Stage"
          value={stage}
          onChange={(e) => setStage(e.target.value as AnalysisStage)}
          options={ANALYSIS_STAGES.map((s) => ({ value: s, label: ANALYSIS_STAGE_LABELS[s] }))}
        />
        <TextField
          label="Laboratory"
          value={lab}
          onChange={(e) => setLab(e.target.value)}
          error={errors.laboratoryName}
          placeholder="Own laboratory or external lab"
        />
        <TextField
          label="Accreditation number"
          value={accreditation}
          onChange={(e) => setAccreditation(e.target.value)}
          hint="Empty for an own, unaccredited lab."
        />
        <TextField
          label="Sample date"
          type="date"
          value={sampleDate}
          onChange={(e) => setSampleDate(e.target.value)}
          error={errors.sampleDate}
        />
      </div>
      <DataTable headings={["Parameter", "Result", "Unit", "U (k = 2)", "Verdict as you type"]}>
        {visible.map((r) => {
          const p = findParameter(r.parameter);
          const l = lines[r.parameter]!;
          const i = results.findIndex((x) => x.parameter === r.parameter);
          // The same reading the verdict was made from: one parse for the error, the plausibility and the verdict.
          const read = readOf.get(r.parameter);
          const verdict = read?.reading ? verdictOf.get(r.parameter) : null;
          const odd = read?.reading ? implausibility(r.parameter, read.reading, read.unit) : null;
          const set = (patch: Partial<EntryLine>) => setLines((all) => ({ ...all, [r.parameter]: { ...l, ...patch } }));
          const error = read?.error ?? errors[`results.${i}.raw`] ?? errors[`results.${i}.unit`];
          return (
            <Row key={r.parameter}>
              <Cell className="font-semibold">
                <label htmlFor={`result-${r.parameter}`}>{p?.name ?? r.parameter}</label>
              </Cell>
              <Cell>
                <input
                  id={`result-${r.parameter}`}
                  inputMode="decimal"
                  className="w-28 rounded border border-line px-2 py-1"
                  value={l.raw}
                  onChange={(e) => set({ raw: e.target.value })}
                  aria-invalid={error ? true : undefined}
                  placeholder={p?.kind === "presence" ? "absent" : "e.g. 0,45 or <0.5"}
                />
                {error && (
                  <span role="alert" className="block text-xs font-semibold text-alarm-700">
                    {error}
                  </span>
                )}
              </Cell>
              <Cell>
                <label className="sr-only" htmlFor={`unit-${r.parameter}`}>
                  Unit of {p?.name}
                </label>
                <select
                  id={`unit-${r.parameter}`}
                  className="rounded border border-line px-2 py-1"
                  value={l.unit}
                  onChange={(e) => set({ unit: e.target.value })}
                >
                  {(p?.units ?? [r.unit]).map((x) => (
                    <option key={x} value={x}>
                      {UNITS[x]?.label ?? x}
                    </option>
                  ))}
                </select>
              </Cell>
              <Cell>
                <label className="sr-only" htmlFor={`u-${r.parameter}`}>
                  Expanded uncertainty of {p?.name}
                </label>
                <input
                  id={`u-${r.parameter}`}
                  inputMode="decimal"
                  className="w-20 rounded border border-line px-2 py-1"
                  value={l.u}
                  onChange={(e) => set({ u: e.target.value })}
                />
              </Cell>
              <Cell className="text-xs">
                {verdict ? (
                  <>
                    <OutcomeBadge outcome={verdict.outcome} />{" "}
                    <span className="text-ink-500">{verdict.uncertainty?.source === "default" ? "default uncertainty" : ""}</span>
                  </>
                ) : (
                  <span className="text-ink-500">—</span>
                )}
                {odd && <span className="block font-semibold text-ochre-700">{odd}</span>}
              </Cell>
            </Row>
          );
        })}
      </DataTable>
      {errors.results && <Notice tone="error">{errors.results}</Notice>}
      <Button onClick={onSubmit} disabled={submit.isPending}>
        {submit.isPending ? "Saving…" : "Submit the analysis"}
      </Button>
    </div>
  );
}
