/**
 * One parameter across lots and vintages: the results, the spec limits, the EWMA with its limits,
 * Western Electric signals and capability, plus the full result list (virtualised) and a CSV export.
 */
import { useQuery } from "@tanstack/react-query";
import { Link, useParams } from "react-router-dom";
import { useFilterParams } from "../../lib/use-filter-params.ts";
import { useRef } from "react";
import { CartesianGrid, ComposedChart, Line, ResponsiveContainer, Scatter, Tooltip, XAxis, YAxis, Legend } from "recharts";
import { useVirtualizer } from "@tanstack/react-virtual";
import Papa from "papaparse";
import { CSV_BOM, CSV_EXPORT_OPTIONS } from "../../../shared/csv-export.ts";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { contractQuery, specQuery } from "../../lib/contracts.ts";
import { trendQuery } from "./api/lots.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, QueryStatus } from "../../components/ui/states.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import {
  capability,
  driftWarning,
  ewmaChart,
  findParameter,
  individualsChart,
  PARAMETERS,
  UNITS,
  westernElectricSignals,
} from "../../../shared/engine/index.ts";
import { ANALYSIS_STAGE_LABELS } from "../../../shared/lots/vocabulary.ts";
import type { TrendData } from "../../../shared/lots/views.ts";
import { TREND_VINTAGES_DEFAULT, TREND_VINTAGES_MAX } from "../../../shared/lots/schemas.ts";
import { chartDomain } from "./chart-domain.ts";

/** A number to `digits` decimal places; "—" for none. */
const fixed = (x: number | null | undefined, digits: number) =>
  x === null || x === undefined || !Number.isFinite(x) ? "—" : x.toFixed(digits);

export function TrendsPage() {
  const { orgId } = useOrganisation();
  const { contractId } = useParams();
  const [params, choose] = useFilterParams();
  const parameter = params.get("parameter") ?? "volatile_acidity";
  const asked = Number(params.get("vintages"));
  const vintages = asked >= 1 && asked <= TREND_VINTAGES_MAX ? asked : TREND_VINTAGES_DEFAULT;
  const contract = useQuery({ ...contractQuery(orgId, Number(contractId)) });
  const agreed = contract.data?.versions.find((v) => v.status === "agreed");
  const spec = useQuery({ ...specQuery(orgId, agreed?.id ?? 0), enabled: !!agreed });
  const trend = useQuery({ ...trendQuery(orgId, Number(contractId), parameter, vintages) });
  const options = (spec.data?.requirements.map((r) => r.parameter) ?? [])
    .concat(PARAMETERS.map((p) => p.id))
    .filter((p, i, all) => all.indexOf(p) === i);
  return (
    <>
      <PageHeader
        title={`Trends${contract.data ? ` for ${contract.data.wine.name}` : ""}`}
        lead={
          contract.data && (
            <>
              Contract{" "}
              <Link className="underline" to={`/contracts/${contract.data.id}`}>
                {contract.data.reference}
              </Link>
              , its lots over the latest vintages.
            </>
          )
        }
      />
      <div className="flex flex-col gap-6">
        <div className="grid max-w-2xl gap-3 md:grid-cols-2">
          <SelectField
            label="Parameter"
            value={parameter}
            onChange={(e) => choose("parameter", e.target.value)}
            options={options.map((p) => ({ value: p, label: findParameter(p)?.name ?? p }))}
          />
          <SelectField
            label="Vintages"
            value={String(vintages)}
            onChange={(e) => choose("vintages", e.target.value)}
            options={[1, 2, 3, 5, TREND_VINTAGES_MAX].map((n) => ({
              value: String(n),
              label: n === 1 ? "The latest vintage" : `The latest ${n}`,
            }))}
          />
        </div>
        {trend.data && trend.data.vintages.length > trend.data.vintagesShown.length && (
          <p className="text-sm text-ink-500">
            Showing {trend.data.vintagesShown.join(", ")} of the {trend.data.vintages.length} vintages with results.
          </p>
        )}
        {trend.data?.truncated && (
          <p className="text-sm text-ochre-700">
            These vintages hold more results than one chart draws; the latest {trend.data.points.length.toLocaleString("en-GB")} are shown.
          </p>
        )}
        <QueryStatus query={trend} />
        {trend.data && <TrendView data={trend.data} />}
      </div>
    </>
  );
}

function TrendView({ data: trend }: { data: TrendData }) {
  // The chart works on plain numbers; the limits' sources go into the legend.
  const data = { ...trend, lower: trend.lower?.value ?? null, upper: trend.upper?.value ?? null };
  const unit = UNITS[data.unit]?.label ?? data.unit;
  const show = (x: number | null | undefined) => fixed(x, data.digits);
  // Statistics carry one more decimal than the results they summarise.
  const stat = (x: number | null | undefined) => fixed(x, data.digits + 1);
  const numeric = data.points.filter((p) => p.value !== null);
  const values = numeric.map((p) => p.value!);
  const stats = (() => {
    if (values.length < 3) return null;
    const chart = individualsChart(values);
    const ewma = ewmaChart(values, { target: chart.centre, sigma: chart.sigma || 1e-9, lambda: 0.3 });
    const signals = westernElectricSignals(values, chart.centre, chart.sigma || 1e-9);
    const spec = { ...(data.lower !== null ? { lower: data.lower } : {}), ...(data.upper !== null ? { upper: data.upper } : {}) };
    const cap = data.lower !== null || data.upper !== null ? capability(values, spec, chart.sigma || undefined) : null;
    return { chart, ewma, signals, cap, drift: driftWarning(values, spec) };
  })();
  if (data.points.length === 0) return <EmptyState title="No result for this parameter yet." />;
  const flagged = new Set(stats?.signals.map((s) => s.index));
  const outside = (v: number) => (data.upper !== null && v > data.upper) || (data.lower !== null && v < data.lower);
  const series = numeric.map((p, i) => ({
    i: i + 1,
    label: `${p.lotCode} (${p.vintage})`,
    value: p.value,
    ewma: stats?.ewma[i]?.ewma,
    flagged: flagged.has(i) ? p.value : null,
    out: outside(p.value!) ? p.value : null,
    specMax: data.upper,
    specMin: data.lower,
    ucl: stats?.ewma[0]?.ucl,
    lcl: stats?.ewma[0]?.lcl,
  }));
  const outCount = series.filter((x) => x.out !== null).length;
  const domain = chartDomain(values, data.lower, data.upper);
  return (
    <>
      <Card title={`${findParameter(data.parameter)?.name} (${unit})`}>
        {outCount > 0 && (
          <p className="mb-3 text-sm font-semibold text-alarm-700">
            {outCount === 1 ? "1 result lies" : `${outCount} results lie`} outside the governing limits (red diamonds).
          </p>
        )}
        {stats?.drift && (
          <p className="mb-3 rounded-md bg-ochre-50 px-3 py-2 text-sm font-semibold text-ochre-700" role="status">
            {stats.drift.message}
          </p>
        )}
        <div className="h-80" role="img" aria-label={`Chart of ${findParameter(data.parameter)?.name} by lot with spec limits and EWMA`}>
          <ResponsiveContainer width="100%" height="100%">
            <ComposedChart data={series} margin={{ top: 10, right: 20, bottom: 10, left: 10 }}>
              <CartesianGrid stroke="#ddd6ca" strokeDasharray="3 3" />
              <XAxis
                dataKey="i"
                tick={{ fontSize: 12 }}
                label={{ value: "sample, oldest first", position: "insideBottom", offset: -4, fontSize: 12 }}
              />
              <YAxis tick={{ fontSize: 12 }} domain={domain} allowDataOverflow={false} tickFormatter={(v: number) => show(v)} width={64} />
              <Tooltip
                formatter={(v: unknown) => `${show(v as number)} ${unit}`}
                labelFormatter={(i: unknown) => series[Number(i) - 1]?.label ?? ""}
              />
              <Legend />
              {/* Limits are drawn as lines rather than reference marks, so each has its own legend entry. */}
              {data.upper !== null && (
                <Line
                  type="linear"
                  dataKey="specMax"
                  name={`Max ${show(data.upper)} (${trend.upper!.source})`}
                  stroke="#a3261d"
                  strokeDasharray="6 3"
                  dot={false}
                  isAnimationActive={false}
                />
              )}
              {data.lower !== null && (
                <Line
                  type="linear"
                  dataKey="specMin"
                  name={`Min ${show(data.lower)} (${trend.lower!.source})`}
                  stroke="#a3261d"
                  strokeDasharray="2 2"
                  dot={false}
                  isAnimationActive={false}
                />
              )}
              {stats && (
                <Line
                  type="linear"
                  dataKey="ucl"
                  name="EWMA upper control limit"
                  stroke="#7a5200"
                  strokeDasharray="2 4"
                  dot={false}
                  isAnimationActive={false}
                />
              )}
              {stats && (
                <Line
                  type="linear"
                  dataKey="lcl"
                  name="EWMA lower control limit"
                  stroke="#7a5200"
                  strokeDasharray="1 5"
                  dot={false}
                  isAnimationActive={false}
                />
              )}
              <Line type="linear" dataKey="value" name="Result" stroke="#5b1f3c" dot={{ r: 3 }} isAnimationActive={false} />
              {stats && (
                <Line type="monotone" dataKey="ewma" name="EWMA (λ = 0.3)" stroke="#7a5200" dot={false} isAnimationActive={false} />
              )}
              <Scatter dataKey="out" name="Outside the limits" fill="#a3261d" shape="diamond" isAnimationActive={false} />
              <Scatter dataKey="flagged" name="Run-rule signal" fill="#1b2230" isAnimationActive={false} />
            </ComposedChart>
          </ResponsiveContainer>
        </div>
        {stats && (
          <dl className="mt-4 grid grid-cols-2 gap-x-6 gap-y-1 text-sm md:grid-cols-4">
            <dt className="text-ink-500">Mean</dt>
            <dd className="tabular-nums">
              {stat(stats.chart.centre)} {unit}
            </dd>
            <dt className="text-ink-500">σ (moving range)</dt>
            <dd className="tabular-nums">
              {stat(stats.chart.sigma)} {unit}
            </dd>
            <dt className="text-ink-500">Cp</dt>
            <dd className="tabular-nums">{fixed(stats.cap?.cp, 2)}</dd>
            <dt className="text-ink-500">Cpk</dt>
            <dd className="tabular-nums">{fixed(stats.cap?.cpk, 2)}</dd>
            <dt className="text-ink-500">Control limits (I chart)</dt>
            <dd className="tabular-nums">
              {stat(stats.chart.lcl)} – {stat(stats.chart.ucl)} {unit}
            </dd>
            <dt className="text-ink-500">Run-rule signals</dt>
            <dd>{stats.signals.length ? stats.signals.map((s) => `#${s.index + 1} rule ${s.rule}`).join(", ") : "none"}</dd>
          </dl>
        )}
        {!stats && (
          <p className="mt-3 text-sm text-ink-500">At least three numeric results are needed for control limits and capability.</p>
        )}
      </Card>
      <ResultsTable data={trend} unit={unit} />
    </>
  );
}

function ResultsTable({ data, unit }: { data: TrendData; unit: string }) {
  const parent = useRef<HTMLDivElement>(null);
  const rows = data.points;
  // eslint-disable-next-line react-hooks/incompatible-library -- the virtualiser is read fresh on every render by design
  const virtual = useVirtualizer({ count: rows.length, getScrollElement: () => parent.current, estimateSize: () => 33, overscan: 10 });
  const exportCsv = () => {
    const csv = Papa.unparse(
      rows.map((p) => ({ lot: p.lotCode, vintage: p.vintage, stage: p.stage, sample_date: p.sampleDate, result: p.text, unit })),
      CSV_EXPORT_OPTIONS,
    );
    const url = URL.createObjectURL(new Blob([`${CSV_BOM}${csv}`], { type: "text/csv;charset=utf-8" }));
    const a = Object.assign(document.createElement("a"), { href: url, download: `${data.parameter}-results.csv` });
    a.click();
    URL.revokeObjectURL(url);
  };
  return (
    <Card title={`All results (${rows.length})`}>
      <Button variant="secondary" onClick={exportCsv} className="mb-3">
        Export CSV
      </Button>
      <div role="table" aria-label="Results" aria-rowcount={rows.length} className="text-sm">
        <div role="rowgroup">
          <div role="row" aria-rowindex={1} className="grid grid-cols-5 border-b border-line py-1 font-semibold text-ink-500">
            {["Lot", "Vintage", "Stage", "Sampled", `Result (${unit})`].map((h) => (
              <span key={h} role="columnheader">
                {h}
              </span>
            ))}
          </div>
        </div>
        {/* Only the rows in view are in the DOM, so ten thousand results scroll smoothly. */}
        <div ref={parent} role="rowgroup" className="max-h-96 overflow-y-auto" tabIndex={0} aria-label="Scrollable results">
          <div role="presentation" style={{ height: virtual.getTotalSize(), position: "relative" }}>
            {virtual.getVirtualItems().map((v) => {
              const p = rows[v.index]!;
              return (
                <div
                  key={v.key}
                  role="row"
                  aria-rowindex={v.index + 2}
                  className="absolute left-0 grid w-full grid-cols-5 border-b border-line/60 py-1"
                  style={{ top: v.start, height: v.size }}
                >
                  <span role="cell">{p.lotCode}</span>
                  <span role="cell">{p.vintage}</span>
                  <span role="cell">{ANALYSIS_STAGE_LABELS[p.stage]}</span>
                  <span role="cell">{p.sampleDate}</span>
                  <span role="cell" className="tabular-nums">
                    {p.text}
                  </span>
                </div>
              );
            })}
          </div>
        </div>
      </div>
    </Card>
  );
}
