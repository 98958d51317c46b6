import { useQuery } from "@tanstack/react-query";
import { Link, useParams } from "react-router-dom";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { lotQuery } from "./api/lots.ts";
import { certificateUrl, conformityUrl } from "../../lib/documents.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, ErrorState, LoadingState } from "../../components/ui/states.tsx";
import { OutcomeBadge } from "../../components/outcome-badge.tsx";
import { LotStatusBadge } from "../../components/lot-status-badge.tsx";
import { LotStatusCard } from "./lot-status-card.tsx";
import { LabelCheckCard } from "./label-check-card.tsx";
import { CERTIFIABLE } from "../../../shared/lots/lot-status.ts";
import { VerdictTable } from "../../components/verdict-table.tsx";
import { ResultEntryForm } from "./result-entry-form.tsx";
import { CertificateUpload } from "../../components/certificate-upload.tsx";
import { LegalCaution } from "../../components/legal-caution.tsx";
import { HistoryPanel } from "../../components/history-panel.tsx";
import { OpenDeviationForm } from "./open-deviation-form.tsx";
import { LotEditForm } from "./lot-edit-form.tsx";
import { ANALYSIS_STAGE_LABELS, CONTAINER_LABELS } from "../../../shared/lots/vocabulary.ts";
import { displayValue, findParameter, unitLabel } from "../../../shared/engine/index.ts";
import { ComparisonTable } from "../../components/comparison-table.tsx";
import { DEVIATION_KIND_LABELS, DEVIATION_OUTCOME_LABELS, DEVIATION_STATUS_LABELS } from "../../../shared/deviations/vocabulary.ts";
import { can } from "../../../shared/auth/permissions.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

export function LotPage() {
  const { orgId, membership } = useOrganisation();
  const { lotId } = useParams();
  const lot = useQuery({ ...lotQuery(orgId, Number(lotId)) });
  if (lot.isPending) return <LoadingState />;
  if (lot.isError) return <ErrorState error={lot.error} onRetry={() => lot.refetch()} />;
  const l = lot.data;
  return (
    <>
      <PageHeader
        title={`Lot ${l.lotCode}`}
        lead={
          <>
            {l.wineName}, vintage {l.vintage} · {CONTAINER_LABELS[l.container]}
            {l.volumeLitres ? `, ${l.volumeLitres.toLocaleString("en-GB")} L` : ""} · for {l.market} · contract{" "}
            <Link to={`/contracts/${l.contractId}`} className="underline">
              {l.contractReference}
            </Link>{" "}
            ({l.producerName})
          </>
        }
        actions={
          <div className="flex items-center gap-3">
            <LotStatusBadge status={l.status} />
            <Link
              to={`/contracts/${l.contractId}/trends`}
              className="rounded-md border border-line bg-card px-3 py-1.5 text-sm font-semibold hover:bg-must-50"
            >
              Trends
            </Link>
            {l.status.code !== "awaiting_results" && (
              <a
                href={conformityUrl(orgId, l.id)}
                className="rounded-md border border-line bg-card px-3 py-1.5 text-sm font-semibold hover:bg-must-50"
              >
                {CERTIFIABLE.includes(l.status.code) ? "Certificate of conformity (PDF)" : "Analysis statement (PDF)"}
              </a>
            )}
          </div>
        }
      />
      <div className="flex flex-col gap-6">
        <LegalCaution />
        <LotStatusCard orgId={orgId} lot={l} canRejudge={can(membership.role, "lots.rejudge")} />
        <LabelCheckCard lot={l} />
        <Card title="Specification in force">
          {l.governing ? (
            <p className="text-sm">
              <Link to={`/specs/${l.governing.id}`} className="font-semibold text-must-700 underline">
                Version {l.governing.number}
              </Link>
              , agreed, covers vintages {l.governing.vintageFrom}
              {l.governing.vintageTo ? `–${l.governing.vintageTo}` : " onwards"} with {l.governing.requirements.length} requirements.
            </p>
          ) : (
            <EmptyState title={`No agreed specification covers vintage ${l.vintage}.`}>
              Results are stored but cannot be judged until a version is agreed.
            </EmptyState>
          )}
        </Card>
        {l.deviations.length > 0 && (
          <Card title="Deviations">
            <ul className="flex flex-col gap-2 text-sm">
              {l.deviations.map((d) => (
                <li
                  key={d.id}
                  className={`rounded-md border px-3 py-2 ${d.decision ? "border-line bg-card" : "border-alarm-700/30 bg-alarm-50"}`}
                >
                  <Link to={`/deviations/${d.id}`} className={`font-semibold underline ${d.decision ? "text-must-700" : "text-alarm-700"}`}>
                    {DEVIATION_KIND_LABELS[d.kind]} deviation #{d.id}
                  </Link>{" "}
                  · {DEVIATION_STATUS_LABELS[d.status]}
                  {d.decision ? `: ${DEVIATION_OUTCOME_LABELS[d.decision.outcome]}` : ""} · {d.summary}
                </li>
              ))}
            </ul>
          </Card>
        )}
        {l.audits.map((a) => (
          <Card key={a.orderId} title={`Independent audit ${a.reference} · ${a.laboratoryName}`}>
            {a.resultsSubmittedAt ? (
              <ComparisonTable
                comparisons={a.comparisons}
                caption={`Results in ${a.resultsSubmittedAt.slice(0, 10)}${a.reportReference ? `, report ${a.reportReference}` : ""}. The laboratory's values are the reference.`}
              />
            ) : (
              <p className="text-sm">
                Paid; the laboratory's results are not in yet.{" "}
                <Link to={`/audits/${a.orderId}`} className="font-semibold text-must-700 underline">
                  The order
                </Link>
              </p>
            )}
          </Card>
        ))}
        {l.transit && (
          <Card title="Transit: arrival against pre-shipment">
            <DataTable headings={["Parameter", "Pre-shipment", "On arrival", "Change", "Allowed", ""]}>
              {l.transit.map((f) => {
                // Transit values are in the parameter's canonical unit; shown rounded, with the unit.
                const unit = findParameter(f.parameter)!.unit;
                const show = (x: number) => `${displayValue(f.parameter, x, unit)} ${unitLabel(unit)}`;
                return (
                  <Row key={f.parameter}>
                    <Cell className="font-semibold">{f.name}</Cell>
                    <Cell className="tabular-nums">{show(f.before)}</Cell>
                    <Cell className="tabular-nums">{show(f.after)}</Cell>
                    <Cell className="tabular-nums">
                      {f.change > 0 ? "+" : ""}
                      {show(f.change)}
                    </Cell>
                    <Cell className="text-xs">
                      {f.allowance.direction === "either" ? "±" : f.allowance.direction === "increase" ? "+" : "−"}
                      {show(f.allowance.allowed)} <span className="block text-ink-500">{f.allowance.basis}</span>
                    </Cell>
                    <Cell>{f.exceeded ? <OutcomeBadge outcome="fail" /> : <OutcomeBadge outcome="pass" />}</Cell>
                  </Row>
                );
              })}
            </DataTable>
          </Card>
        )}
        {l.analyses.length === 0 && (
          <EmptyState title="No analysis yet.">
            {l.canSubmit ? "Enter results below or import a CSV from the contract page." : "The producer has not submitted results yet."}
          </EmptyState>
        )}
        {[...l.analyses].reverse().map((a) => (
          <Card
            key={a.id}
            title={`${ANALYSIS_STAGE_LABELS[a.stage]}${a.auditOrderId ? " · independent audit" : ""}${a.rejudgedFromId ? " · re-judged" : ""} · sampled ${a.sampleDate}`}
          >
            <p className="mb-3 text-sm text-ink-700">
              {a.laboratoryName}
              {a.accreditation ? ` (accreditation ${a.accreditation})` : " (not accredited)"} · submitted{" "}
              {new Date(a.createdAt).toLocaleString("en-GB")}
              {a.evaluation &&
                ` · judged with engine ${a.evaluation.engineVersion}, ${a.evaluation.specVersion ? `against spec version ${a.evaluation.specVersion.number}` : "with no agreed spec version"}, market packs ${Object.entries(
                  a.evaluation.marketVersions,
                )
                  .map(([m, v]) => `${m} ${v}`)
                  .join(", ")}`}
            </p>
            {a.evaluation ? (
              <VerdictTable verdicts={a.evaluation.verdicts} reported={a.results} />
            ) : (
              <p className="text-sm">{a.results.map((r) => `${findParameter(r.parameter)?.name}: ${r.rawText} ${r.unit}`).join(" · ")}</p>
            )}
            <div className="mt-4 flex flex-col gap-2">
              {a.certificates.map((c) => (
                <a key={c.id} href={certificateUrl(orgId, c.id)} className="text-sm font-semibold text-must-700 underline">
                  Certificate: {c.originalName} ({Math.round(c.sizeBytes / 1024)} KB, SHA-256 {c.sha256.slice(0, 12)}…)
                </a>
              ))}
              {l.canSubmit && !a.auditOrderId && <CertificateUpload orgId={orgId} analysisId={a.id} onUploaded={() => lot.refetch()} />}
            </div>
          </Card>
        ))}
        {can(membership.role, "deviations.discuss") && (
          <details className="rounded-card border border-line bg-card p-gutter">
            <summary className="cursor-pointer text-lg font-semibold">Open a deviation by hand</summary>
            <div className="mt-3">
              <OpenDeviationForm orgId={orgId} lotId={l.id} parameters={l.governing?.requirements.map((r) => r.parameter) ?? []} />
            </div>
          </details>
        )}
        {l.canSubmit && (
          <details className="rounded-card border border-line bg-card p-gutter">
            <summary className="cursor-pointer text-lg font-semibold">Correct the lot's details</summary>
            <div className="mt-3">
              <LotEditForm orgId={orgId} lot={l} />
            </div>
          </details>
        )}
        <HistoryPanel orgId={orgId} entityType="lot" entityId={l.id} />
        {l.canSubmit && (
          <Card title="Enter results">
            <ResultEntryForm orgId={orgId} lot={l} />
          </Card>
        )}
      </div>
    </>
  );
}
