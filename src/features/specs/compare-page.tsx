import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Link, useParams, useSearchParams } from "react-router-dom";
import { useState } from "react";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { diffQuery, pastResultsQuery } from "./api/specs.ts";
import { BACKTEST_LOTS_DEFAULT, BACKTEST_LOTS_MAX } from "../../../shared/specs/schemas.ts";

import { specQuery } from "../../lib/contracts.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, ErrorState, LoadingState, Notice } from "../../components/ui/states.tsx";
import { Button } from "../../components/ui/button.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import { convert, findParameter, UNITS, type BacktestSummary, type DiffKind } from "../../../shared/engine/index.ts";
import { runBacktest, toPastResults } from "./run-backtest.ts";
import { errorMessage } from "../../lib/api-client.ts";
import type { SpecVersionDetail } from "../../../shared/specs/views.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const KIND_STYLE: Record<DiffKind, string> = {
  added: "text-verjus-700",
  removed: "text-alarm-700",
  tightened: "text-must-700",
  loosened: "text-ochre-700",
  "tightened and loosened": "text-ochre-700",
  unchanged: "text-ink-500",
};
const n = (x: number | null) => (x === null ? "—" : String(Number(x.toPrecision(5))));

export function ComparePage() {
  const { orgId } = useOrganisation();
  const { specId } = useParams();
  const [params, setParams] = useSearchParams();
  const id = Number(specId);
  const spec = useQuery({ ...specQuery(orgId, id) });
  const against = Number(params.get("against"));
  const diff = useQuery({ ...diffQuery(orgId, id, against), enabled: against > 0 });
  if (spec.isPending) return <LoadingState />;
  if (spec.isError) return <ErrorState error={spec.error} />;
  const v = spec.data;
  return (
    <>
      <PageHeader
        title={`Compare version ${v.number} of ${v.contract.wine.name}`}
        lead={
          <Link to={`/specs/${v.id}`} className="underline">
            Back to version {v.number}
          </Link>
        }
      />
      <div className="flex flex-col gap-6">
        <Card title="What changed">
          <div className="mb-4 max-w-xs">
            <SelectField
              label="Compare with"
              value={against || ""}
              onChange={(e) => setParams({ against: e.target.value }, { replace: true })}
              options={[
                { value: "", label: "Choose a version" },
                ...v.otherVersions.map((o) => ({ value: String(o.id), label: `Version ${o.number}` })),
              ]}
            />
          </div>
          {diff.isPending && against > 0 && <LoadingState />}
          {diff.isError && <ErrorState error={diff.error} />}
          {diff.data && (
            <DataTable
              headings={[
                "Parameter",
                "Change",
                `Min: v${diff.data.from.number} → v${diff.data.to.number}`,
                `Max: v${diff.data.from.number} → v${diff.data.to.number}`,
                "Also changed",
              ]}
            >
              {diff.data.parameters.map((p) => {
                const side = (s: "lower" | "upper") => p.sides.find((x) => x.side === s);
                // Show limits in the unit the buyer wrote them in, not the engine's canonical one.
                const canonical = findParameter(p.parameter)?.unit;
                const unit = v.requirements.find((r) => r.parameter === p.parameter)?.unit ?? canonical;
                const shown = (x: number | null) => (x === null || !canonical || !unit ? n(x) : n(convert(x, canonical, unit)));
                return (
                  <Row key={p.parameter}>
                    <Cell className="font-semibold">{p.name}</Cell>
                    <Cell className={`font-semibold ${KIND_STYLE[p.kind]}`}>{p.kind}</Cell>
                    {(["lower", "upper"] as const).map((s) => (
                      <Cell key={s} className="tabular-nums">
                        {side(s) ? `${shown(side(s)!.before)} → ${shown(side(s)!.after)} ${unit ? UNITS[unit].label : ""}` : "—"}
                      </Cell>
                    ))}
                    <Cell className="text-ink-500">{p.otherChanges.join(", ") || "—"}</Cell>
                  </Row>
                );
              })}
            </DataTable>
          )}
          {diff.data && (
            <p className="mt-2 text-xs text-ink-500">
              Limits are compared after converting both versions to one unit, so a change of unit alone is not a change of limit.
            </p>
          )}
        </Card>
        {against > 0 && <BacktestCard orgId={orgId} version={v} againstId={against} />}
      </div>
    </>
  );
}

const BACKTEST_WINDOWS = [50, BACKTEST_LOTS_DEFAULT, 500, 1000, BACKTEST_LOTS_MAX];

function BacktestCard({ orgId, version, againstId }: { orgId: number; version: SpecVersionDetail; againstId: number }) {
  const qc = useQueryClient();
  const [progress, setProgress] = useState<{ done: number; total: number } | null>(null);
  const [summary, setSummary] = useState<BacktestSummary | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [windowLots, setWindowLots] = useState(BACKTEST_LOTS_DEFAULT);
  const [covered, setCovered] = useState<{ lots: number; truncated: boolean } | null>(null);
  const run = async () => {
    setError(null);
    setSummary(null);
    try {
      const current = await qc.fetchQuery(specQuery(orgId, againstId));
      // Only the parameters either version names: the rest cannot change a verdict.
      const parameters = [...new Set([...current.requirements, ...version.requirements].map((r) => r.parameter))];
      const past = await qc.fetchQuery(pastResultsQuery(orgId, version.contract.id, windowLots, parameters));
      setCovered({ lots: past.lots, truncated: past.truncated });
      const results = toPastResults(past.rows, version.contract.wine);
      setProgress({ done: 0, total: results.length });
      setSummary(
        await runBacktest(results, current.requirements, version.requirements, version.contract.wine.markets, (done, total) =>
          setProgress({ done, total }),
        ),
      );
    } catch (err) {
      setError(errorMessage(err));
    }
  };
  const running = progress !== null && summary === null && error === null;
  return (
    <Card title="Backtest against past results">
      <p className="mb-3 text-sm text-ink-700">
        Evaluates the past results of this contract's latest lots under the other version and under this one, with the engine in your
        browser, and lists what would change.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <div className="w-56">
          <SelectField
            label="Over"
            value={String(windowLots)}
            onChange={(e) => setWindowLots(Number(e.target.value))}
            options={BACKTEST_WINDOWS.map((n) => ({ value: String(n), label: `the last ${n.toLocaleString("en-GB")} lots` }))}
          />
        </div>
        <Button onClick={() => void run()} disabled={running}>
          {running ? "Running…" : "Run backtest"}
        </Button>
      </div>
      {covered && (
        <p className="mt-2 text-xs text-ink-500">
          {covered.lots.toLocaleString("en-GB")} lots read
          {covered.truncated ? "; the window held more results than one backtest reads, so the oldest were left out." : "."}
        </p>
      )}
      {progress && (
        <div className="mt-3">
          <progress
            className="h-2 w-full accent-must-700"
            max={Math.max(progress.total, 1)}
            value={progress.done}
            aria-label="Backtest progress"
          />
          <p className="text-xs text-ink-500" role="status">
            {progress.done} of {progress.total} results evaluated
          </p>
        </div>
      )}
      {error && <Notice tone="error">{error}</Notice>}
      {summary && (
        <div className="mt-4 flex flex-col gap-2">
          {summary.checked === 0 && <EmptyState title="No past results for this contract yet." />}
          {summary.checked > 0 && summary.sentences.length === 0 && (
            <Notice tone="success">No past result would change its verdict.</Notice>
          )}
          {summary.sentences.map((s) => (
            <p key={s} className="rounded-md bg-ochre-50 px-3 py-2 font-semibold text-ochre-700">
              {s}.
            </p>
          ))}
          {summary.newlyFailing.length > 0 && (
            <DataTable headings={["Lot", "Vintage", "Parameter", "Before", "Now"]} dense className="mt-2">
              {[...summary.newlyFailing, ...summary.newlyPassing].map((c) => (
                <Row key={`${c.lotId}-${c.parameter}`}>
                  <Cell dense>{c.lotCode}</Cell>
                  <Cell dense>{c.vintage}</Cell>
                  <Cell dense>{findParameter(c.parameter)?.name ?? c.parameter}</Cell>
                  <Cell dense>{c.before}</Cell>
                  <Cell dense className="font-semibold">
                    {c.after}
                  </Cell>
                </Row>
              ))}
            </DataTable>
          )}
        </div>
      )}
    </Card>
  );
}
