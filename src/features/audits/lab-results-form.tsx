/**
 * The laboratory's results for a paid order: one line per lot and ordered parameter, typed or filled
 * from the laboratory's CSV export (same column mapping as the producers' import).
 */
import { useState } from "react";
import { useConfirm } from "../../components/ui/confirm-dialog.tsx";
import Papa from "papaparse";
import { useSubmitLabResults } from "./api/audits.ts";
import { Button } from "../../components/ui/button.tsx";
import { FileField, TextField } from "../../components/ui/field.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { ApiError, errorMessage } from "../../lib/api-client.ts";
import { labResultsSchema } from "../../../shared/audits/schemas.ts";
import { cellKey, cellsFromSamples, type FormCell } from "../../../shared/audits/lab-csv.ts";
import { buildSamples, guessMapping } from "../../../shared/lots/csv.ts";
import { findParameter, UNITS } from "../../../shared/engine/index.ts";
import type { AuditOrderDetail } from "../../../shared/audits/views.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const today = () => new Date().toISOString().slice(0, 10);

/** onSent receives the confirmation: the page keeps it, since the form itself goes once the order is complete. */
export function LabResultsForm({ orgId, order, onSent }: { orgId: number; order: AuditOrderDetail; onSent: (message: string) => void }) {
  const submit = useSubmitLabResults(orgId, order.id);
  const confirm = useConfirm();
  const [sampleDate, setSampleDate] = useState(today());
  const [accreditation, setAccreditation] = useState("");
  const [reportReference, setReportReference] = useState("");
  const [cells, setCells] = useState<Record<string, FormCell>>(() =>
    Object.fromEntries(
      order.lots.flatMap((l) =>
        order.parameters.map((p) => [cellKey(l.lotId, p), { raw: "", unit: order.units[p] ?? findParameter(p)?.unit ?? "", u: "" }]),
      ),
    ),
  );
  const [key] = useState(() => crypto.randomUUID());
  const [errors, setErrors] = useState<string[]>([]);
  const [fileNote, setFileNote] = useState<string | null>(null);
  const set = (k: string, patch: Partial<FormCell>) => setCells((c) => ({ ...c, [k]: { ...c[k]!, ...patch } }));

  const readCsv = (file: File) =>
    Papa.parse<string[]>(file, {
      skipEmptyLines: "greedy",
      complete: (res) => {
        const [headers = [], ...rows] = res.data;
        const clean = headers.map((h) => h.replace(/^\uFEFF/, "").trim());
        const built = buildSamples(clean, rows, guessMapping(clean), { sampleDate });
        const { cells: found, skipped } = cellsFromSamples(built.samples, order.lots, order.parameters);
        setCells((c) => ({ ...c, ...found }));
        const problems = [
          ...built.errors.slice(0, 5).map((e) => `row ${e.row}${e.column ? `, ${e.column}` : ""}: ${e.message}`),
          ...skipped.slice(0, 5),
        ];
        setFileNote(
          `${Object.keys(found).length} result(s) filled from ${file.name}.${problems.length ? ` Not used: ${problems.join("; ")}.` : ""}`,
        );
      },
      error: (err) => setFileNote(`The file could not be read: ${err.message}`),
    });

  const onSubmit = () => {
    const body = {
      idempotencyKey: key,
      sampleDate,
      accreditation: accreditation.trim() || null,
      reportReference: reportReference.trim() || null,
      lots: order.lots.map((l) => ({
        lotId: l.lotId,
        results: order.parameters
          .map((p) => ({ p, c: cells[cellKey(l.lotId, p)]! }))
          .filter(({ c }) => c.raw.trim())
          .map(({ p, c }) => ({
            parameter: p,
            raw: c.raw.trim(),
            unit: c.unit,
            uncertainty: c.u.trim() ? { kind: "expanded" as const, value: Number(c.u.replace(",", ".")), k: 2 } : null,
          })),
      })),
    };
    const sent = body.lots.map((l) => l.results.map((r) => r.parameter));
    const parsed = labResultsSchema.safeParse(body);
    if (!parsed.success) {
      setErrors(parsed.error.issues.map((i) => describe(i.path, i.message, order, sent)));
      return;
    }
    setErrors([]);
    confirm.ask({
      title: `Send the results for ${order.reference}?`,
      consequence: `They are stored as your laboratory's analysis, compared with the producer's declared results, and any disagreement opens a deviation. Results can be sent once per order.`,
      confirmLabel: "Send the results",
      onConfirm: () => send(parsed.data, sent),
    });
  };

  const send = (data: Parameters<typeof submit.mutate>[0], sent: string[][]) => {
    submit.mutate(data, {
      onSuccess: (r) =>
        onSent(
          `Results sent. ${r.discrepancies.length ? `${r.discrepancies.length} lot(s) disagree with the declared results; a deviation was opened for each.` : "No discrepancy with the declared results."}`,
        ),
      onError: (err) => err instanceof ApiError && setErrors(err.errors.map((e) => describe(e.path.split("."), e.message, order, sent))),
    });
  };

  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-3 md:grid-cols-4">
        <TextField label="Sample date" type="date" value={sampleDate} onChange={(e) => setSampleDate(e.target.value)} />
        <TextField
          label="Accreditation"
          value={accreditation}
          onChange={(e) => setAccreditation(e.target.value)}
          hint="e.g. your ISO/IEC 17025 number"
        />
        <TextField label="Report reference" value={reportReference} onChange={(e) => setReportReference(e.target.value)} />
        <FileField label="Fill from a CSV export" accept=".csv,text/csv" onFile={readCsv} />
      </div>
      {fileNote && <Notice>{fileNote}</Notice>}
      <DataTable headings={["Lot", "Parameter", "Result", "Unit", "U (k = 2)"]}>
        {order.lots.flatMap((l) =>
          order.parameters.map((p) => {
            const k = cellKey(l.lotId, p);
            const def = findParameter(p);
            const name = def?.name ?? p;
            return (
              <Row key={k}>
                <Cell dense>{l.lotCode}</Cell>
                <th scope="row" className="py-1 pr-3 font-normal">
                  {name}
                </th>
                <Cell dense>
                  <input
                    aria-label={`${name}, lot ${l.lotCode}`}
                    className="w-28 rounded-md border border-line px-2 py-1"
                    value={cells[k]!.raw}
                    onChange={(e) => set(k, { raw: e.target.value })}
                  />
                </Cell>
                <Cell dense>
                  <select
                    aria-label={`Unit of ${name}, lot ${l.lotCode}`}
                    className="rounded-md border border-line bg-white px-2 py-1"
                    value={cells[k]!.unit}
                    onChange={(e) => set(k, { unit: e.target.value })}
                  >
                    {(def?.units ?? []).map((u) => (
                      <option key={u} value={u}>
                        {UNITS[u]?.label ?? u}
                      </option>
                    ))}
                  </select>
                </Cell>
                <Cell dense>
                  <input
                    aria-label={`Uncertainty of ${name}, lot ${l.lotCode}`}
                    className="w-20 rounded-md border border-line px-2 py-1"
                    value={cells[k]!.u}
                    onChange={(e) => set(k, { u: e.target.value })}
                  />
                </Cell>
              </Row>
            );
          }),
        )}
      </DataTable>
      {errors.length > 0 && (
        <Notice tone="error">
          <ul className="list-disc pl-5">
            {errors.map((e) => (
              <li key={e}>{e}</li>
            ))}
          </ul>
        </Notice>
      )}
      {submit.isError && !(submit.error instanceof ApiError && submit.error.errors.length) && (
        <Notice tone="error">{errorMessage(submit.error)}</Notice>
      )}
      <Button className="self-start" onClick={onSubmit} disabled={submit.isPending || submit.isSuccess}>
        Send the results
      </Button>
      {confirm.dialog}
    </div>
  );
}

/** "lots.0.results.2.raw" → "Lot SB-25-11, Free SO2: …" */
function describe(path: readonly PropertyKey[], message: string, order: AuditOrderDetail, sent: string[][]): string {
  const lotIndex = path[0] === "lots" && typeof path[1] !== "undefined" ? Number(path[1]) : -1;
  const lot = order.lots[lotIndex];
  if (!lot) return message;
  const parameter = path[2] === "results" && typeof path[3] !== "undefined" ? sent[lotIndex]?.[Number(path[3])] : undefined;
  return `Lot ${lot.lotCode}${parameter ? `, ${findParameter(parameter)?.name ?? parameter}` : ""}: ${message}`;
}
