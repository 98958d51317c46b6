/**
 * Importing a laboratory's CSV: read the file (papaparse, with progress), map its columns, preview
 * the samples with every row error, then send them in batches (each idempotent) with progress.
 */
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Link, useParams } from "react-router-dom";
import { useMemo, useState } from "react";
import Papa from "papaparse";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { contractQuery } from "../../lib/contracts.ts";
import { importBatch, lotKeys } from "./api/lots.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { ErrorState, LoadingState, Notice } from "../../components/ui/states.tsx";
import { SelectField, TextField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import { CsvMapping } from "./csv-mapping.tsx";
import { ambiguousNumbers, buildSamples, guessMapping, type ColumnRole } from "../../../shared/lots/csv.ts";
import { IMPORT_BATCH_MAX, NUMBER_FORMATS, NUMBER_FORMAT_LABELS } from "../../../shared/lots/schemas.ts";
import type { NumberFormat } from "../../../shared/engine/index.ts";
import { rememberedFormat, rememberFormat } from "./number-format-memory.ts";
import { ANALYSIS_STAGES, ANALYSIS_STAGE_LABELS, type AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import type { ImportResult } from "../../../shared/lots/views.ts";
import { ImportSummary } from "./import-summary.tsx";
import { errorMessage } from "../../lib/api-client.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

interface Parsed {
  name: string;
  headers: string[];
  rows: string[][];
}

type Outcome = { analyses: number; lotsCreated: number; samples: ImportResult["samples"]; failing: ImportResult["failing"] };

export function ImportPage() {
  const { orgId } = useOrganisation();
  const { contractId } = useParams();
  const contract = useQuery({ ...contractQuery(orgId, Number(contractId)) });
  const qc = useQueryClient();
  const [parsed, setParsed] = useState<Parsed | null>(null);
  const [readProgress, setReadProgress] = useState<number | null>(null);
  const [mapping, setMapping] = useState<ColumnRole[]>([]);
  const [stage, setStage] = useState<AnalysisStage>("pre_filling");
  const [lab, setLab] = useState("");
  const [accreditation, setAccreditation] = useState("");
  const [sampleDate, setSampleDate] = useState(new Date().toISOString().slice(0, 10));
  const [sent, setSent] = useState<{ done: number; total: number } | null>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [confirmed, setConfirmed] = useState(false);

  const [numberFormat, setNumberFormat] = useState<NumberFormat | "">("");
  const ambiguous = useMemo(() => (parsed ? ambiguousNumbers(parsed.rows, mapping) : []), [parsed, mapping]);
  const preview = useMemo(
    () => (parsed ? buildSamples(parsed.headers, parsed.rows, mapping, { sampleDate, numberFormat: numberFormat || null }) : null),
    [parsed, mapping, sampleDate, numberFormat],
  );
  // Once a laboratory's number format is known, it is remembered for its next file.
  const chooseLab = (name: string) => {
    setLab(name);
    const known = rememberedFormat(name);
    if (known) setNumberFormat(known);
  };
  const chooseFormat = (f: NumberFormat | "") => {
    setNumberFormat(f);
    if (f && lab.trim()) rememberFormat(lab, f);
  };

  const readFile = (file: File) => {
    setParsed(null);
    setOutcome(null);
    setConfirmed(false);
    setError(null);
    setReadProgress(0);
    const rows: string[][] = [];
    Papa.parse<string[]>(file, {
      skipEmptyLines: "greedy",
      chunkSize: 256 * 1024,
      chunk: (res) => {
        rows.push(...res.data);
        setReadProgress(Math.min(1, res.meta.cursor / Math.max(file.size, 1)));
      },
      complete: () => {
        const [headers = [], ...data] = rows;
        const clean = headers.map((h) => h.replace(/^\uFEFF/, "").trim());
        setParsed({ name: file.name, headers: clean, rows: data });
        setMapping(guessMapping(clean));
        setReadProgress(1);
      },
      error: (err) => setError(`The file could not be read: ${err.message}`),
    });
  };

  const send = async () => {
    if (!preview) return;
    setError(null);
    const importId = crypto.randomUUID();
    if (numberFormat && lab.trim()) rememberFormat(lab, numberFormat);
    const total = preview.samples.length;
    const summary: Outcome = { analyses: 0, lotsCreated: 0, samples: [], failing: [] };
    setSent({ done: 0, total });
    try {
      for (let i = 0; i < total; i += IMPORT_BATCH_MAX) {
        const batch = preview.samples.slice(i, i + IMPORT_BATCH_MAX).map(({ rows: _rows, ...s }) => s);
        const r = await importBatch(orgId, Number(contractId), {
          idempotencyKey: `${importId}-${i}`,
          stage,
          laboratoryName: lab,
          accreditation: accreditation || null,
          numberFormat: numberFormat || null,
          samples: batch,
        });
        summary.analyses += r.analyses;
        summary.lotsCreated += r.lotsCreated;
        summary.samples.push(...r.samples);
        summary.failing.push(...r.failing);
        setSent({ done: Math.min(total, i + batch.length), total });
      }
      setOutcome(summary);
      await qc.invalidateQueries({ queryKey: lotKeys.all(orgId) });
    } catch (err) {
      setError(`Import stopped: ${errorMessage(err)} Batches already sent are stored; sending again is safe.`);
    }
  };

  if (contract.isPending) return <LoadingState />;
  if (contract.isError) return <ErrorState error={contract.error} />;
  const busy = sent !== null && outcome === null && error === null;
  return (
    <>
      <PageHeader
        title={`Import results for ${contract.data.wine.name}`}
        lead={
          <>
            Contract{" "}
            <Link className="underline" to={`/contracts/${contract.data.id}`}>
              {contract.data.reference}
            </Link>
            . One row per sample with a column per parameter, or one row per result; decimal commas, semicolons and a byte-order mark are
            fine.
          </>
        }
      />
      <div className="flex flex-col gap-6">
        <Card title="1. The file and the analysis">
          <div className="grid gap-3 md:grid-cols-4">
            <div className="flex flex-col gap-1">
              <label htmlFor="csv-file" className="text-sm font-semibold">
                CSV file
              </label>
              <input
                id="csv-file"
                type="file"
                accept=".csv,text/csv,.txt"
                onChange={(e) => e.target.files?.[0] && readFile(e.target.files[0])}
              />
            </div>
            <SelectField
              label="Stage"
              value={stage}
              onChange={(e) => setStage(e.target.value as AnalysisStage)}
              options={ANALYSIS_STAGES.map((s) => ({ value: s, label: ANALYSIS_STAGE_LABELS[s] }))}
            />
            <TextField label="Laboratory" value={lab} onChange={(e) => chooseLab(e.target.value)} />
            <TextField label="Accreditation number" value={accreditation} onChange={(e) => setAccreditation(e.target.value)} />
            <TextField
              label="Sample date when the file has none"
              type="date"
              value={sampleDate}
              onChange={(e) => setSampleDate(e.target.value)}
            />
          </div>
          {readProgress !== null && readProgress < 1 && (
            <div className="mt-3">
              <progress className="h-2 w-full" max={1} value={readProgress} aria-label="Reading the file" />
            </div>
          )}
          {error && (
            <div className="mt-3">
              <Notice tone="error">{error}</Notice>
            </div>
          )}
        </Card>
        {parsed && (
          <Card title={`2. What the columns of ${parsed.name} mean`}>
            <CsvMapping headers={parsed.headers} sample={parsed.rows} mapping={mapping} onChange={setMapping} />
          </Card>
        )}
        {preview && (
          <Card title="3. Check and import">
            <p className="mb-3 text-sm">
              {parsed!.rows.length} rows read: <strong>{preview.samples.length} samples</strong> ready with{" "}
              {preview.samples.reduce((n, s) => n + s.results.length, 0)} results; <strong>{preview.errors.length} problem(s)</strong>
              {preview.errors.length ? ", listed below; those rows are left out" : ""}.
            </p>
            {preview.errors.length > 0 && (
              <div className="mb-4 max-h-64 overflow-y-auto rounded-md border border-alarm-700/30">
                <table className="w-full text-left text-sm">
                  <thead className="sticky top-0 bg-alarm-50 text-alarm-700">
                    <tr>
                      {["Row", "Column", "Problem"].map((h) => (
                        <th key={h} scope="col" className="px-3 py-1 font-semibold">
                          {h}
                        </th>
                      ))}
                    </tr>
                  </thead>
                  <tbody>
                    {preview.errors.slice(0, 200).map((e, i) => (
                      <Row key={i}>
                        <Cell dense className="px-3 tabular-nums">
                          {e.row || "—"}
                        </Cell>
                        <Cell dense className="px-3">
                          {e.column ?? "—"}
                        </Cell>
                        <Cell dense className="px-3">
                          {e.message}
                        </Cell>
                      </Row>
                    ))}
                  </tbody>
                </table>
              </div>
            )}
            {preview.samples.length > 0 && (
              <DataTable headings={["Lot", "Vintage", "Sampled", "Results"]} dense className="mb-4">
                {preview.samples.slice(0, 10).map((s) => (
                  <Row key={`${s.lotCode}-${s.sampleDate}`}>
                    <Cell dense>{s.lotCode}</Cell>
                    <Cell dense>{s.vintage ?? "registered"}</Cell>
                    <Cell dense>{s.sampleDate}</Cell>
                    <Cell dense className="text-xs">
                      {s.results.map((r) => `${findParameter(r.parameter)?.name} ${r.raw} ${r.unit}`).join(" · ")}
                    </Cell>
                  </Row>
                ))}
              </DataTable>
            )}
            {ambiguous.length > 0 && (
              <div className="mb-4 flex flex-col gap-2 rounded-md border border-ochre-700/40 bg-ochre-50 p-3 text-sm">
                <p className="font-semibold text-ochre-700">
                  Some numbers read two ways ({ambiguous.join(", ")}): a thousands separator or three decimals. How does{" "}
                  {lab.trim() || "this laboratory"} write numbers?
                </p>
                <div className="max-w-sm">
                  <SelectField
                    label="The laboratory's number format"
                    value={numberFormat}
                    onChange={(e) => chooseFormat(e.target.value as NumberFormat | "")}
                    options={[
                      { value: "", label: "Choose…" },
                      ...NUMBER_FORMATS.map((f) => ({ value: f, label: NUMBER_FORMAT_LABELS[f] })),
                    ]}
                  />
                </div>
              </div>
            )}
            {preview.implausible.length > 0 && (
              <div className="mb-4 flex flex-col gap-2 rounded-md border border-ochre-700/40 bg-ochre-50 p-3 text-sm">
                <p className="font-semibold text-ochre-700">
                  {preview.implausible.length === 1 ? "1 value looks implausible" : `${preview.implausible.length} values look implausible`}
                  : check the unit of each column before sending.
                </p>
                <ul className="max-h-40 overflow-y-auto">
                  {preview.implausible.slice(0, 100).map((f, i) => (
                    <li key={i}>
                      Row {f.row}, {f.column}: {f.message}
                    </li>
                  ))}
                </ul>
                <label className="flex items-center gap-2 font-semibold">
                  <input type="checkbox" checked={confirmed} onChange={(e) => setConfirmed(e.target.checked)} /> I have checked these values
                  and their units; send them as they are.
                </label>
              </div>
            )}
            <Button
              onClick={() => void send()}
              disabled={
                busy ||
                preview.samples.length === 0 ||
                lab.trim().length < 2 ||
                (preview.implausible.length > 0 && !confirmed) ||
                (ambiguous.length > 0 && !numberFormat)
              }
            >
              {busy ? "Importing…" : `Import ${preview.samples.length} samples`}
            </Button>
            {lab.trim().length < 2 && <p className="mt-1 text-xs text-ink-500">Name the laboratory first.</p>}
            {sent && (
              <div className="mt-3">
                <progress className="h-2 w-full" max={Math.max(sent.total, 1)} value={sent.done} aria-label="Import progress" />
                <p className="text-xs text-ink-500" role="status">
                  {sent.done} of {sent.total} samples stored
                </p>
              </div>
            )}
            {outcome && (
              <div className="mt-4 flex flex-col gap-2">
                <ImportSummary outcome={outcome} />
                <Link to={`/lots?contract=${contractId}`} className="text-sm font-semibold text-must-700 underline">
                  See the lots
                </Link>
              </div>
            )}
          </Card>
        )}
      </div>
    </>
  );
}
