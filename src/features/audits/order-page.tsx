import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { certificateUrl, conformityUrl } from "../../lib/documents.ts";
import { OutcomeBadge } from "../../components/outcome-badge.tsx";
import { verdictText } from "../../../shared/lots/verdict-text.ts";
import type { StoredVerdict } from "../../../shared/lots/views.ts";
import { Link, useParams, useSearchParams } from "react-router-dom";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { orderQuery } from "./api/audits.ts";
import { OrderStatusBadge } from "./order-status-badge.tsx";
import { PaymentPanel } from "./payment-panel.tsx";
import { ComparisonTable } from "../../components/comparison-table.tsx";
import { LabResultsForm } from "./lab-results-form.tsx";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { ErrorState, LoadingState, Notice } from "../../components/ui/states.tsx";
import { LegalCaution } from "../../components/legal-caution.tsx";
import { HistoryPanel } from "../../components/history-panel.tsx";
import { CertificateUpload } from "../../components/certificate-upload.tsx";
import { ANALYSIS_STAGE_LABELS } from "../../../shared/lots/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import { can } from "../../../shared/auth/permissions.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

export function OrderPage() {
  const { orgId, membership } = useOrganisation();
  const id = Number(useParams().orderId);
  const [search] = useSearchParams();
  const [sent, setSent] = useState<string | null>(null);
  const returning = search.get("paid") === "1";
  const q = useQuery({
    ...orderQuery(orgId, id),
    // Back from the payment page, the webhook may not have landed yet: look again until it has.
    refetchInterval: (query) =>
      returning && ["awaiting_payment", "payment_failed"].includes(query.state.data?.status ?? "") ? 1000 : false,
  });
  if (q.isPending) return <LoadingState />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const o = q.data;
  const lab = can(membership.role, "audits.report");
  const party = !lab;
  const waiting = returning && (o.status === "awaiting_payment" || o.status === "payment_failed");
  return (
    <>
      <PageHeader
        title={`Audit ${o.reference}`}
        lead={`${o.wineName} from ${o.producerName}, analysed by ${o.laboratoryName}`}
        actions={<OrderStatusBadge status={o.status} />}
      />
      <div className="flex flex-col gap-6">
        {waiting && (
          <Notice>
            Back from the payment page. Waiting for the payment service to confirm…{" "}
            {o.status === "payment_failed" && "The last attempt was declined."}
          </Notice>
        )}
        {returning && o.status === "paid" && (
          <Notice tone="success">Payment confirmed. The laboratory has been told; a receipt is on its way by e-mail.</Notice>
        )}
        <Card title="Order">
          <dl className="grid gap-x-6 gap-y-2 text-sm md:grid-cols-2">
            <div>
              <dt className="text-ink-500">Lots</dt>
              <dd>
                {o.lots.map((l) =>
                  party ? (
                    <Link key={l.lotId} to={`/lots/${l.lotId}`} className="mr-2 font-semibold text-must-700 underline">
                      {l.lotCode}
                    </Link>
                  ) : (
                    <span key={l.lotId} className="mr-2">
                      {l.lotCode} ({l.vintage})
                    </span>
                  ),
                )}
              </dd>
            </div>
            <div>
              <dt className="text-ink-500">Parameters</dt>
              <dd>{o.parameters.map((p) => findParameter(p)?.name ?? p).join(", ")}</dd>
            </div>
            <div>
              <dt className="text-ink-500">Compared with the producer's results at</dt>
              <dd>{ANALYSIS_STAGE_LABELS[o.stage]}</dd>
            </div>
            <div>
              <dt className="text-ink-500">Ordered</dt>
              <dd>
                {o.createdAt.slice(0, 10)} by {o.orderedBy} for {o.buyerName}
              </dd>
            </div>
            {o.note && (
              <div className="md:col-span-2">
                <dt className="text-ink-500">Note</dt>
                <dd>{o.note}</dd>
              </div>
            )}
          </dl>
        </Card>
        {o.lines.length > 0 && <PaymentPanel orgId={orgId} order={o} />}
        {lab && o.actions.submitResults && (
          <Card title="Your results">
            <LabResultsForm orgId={orgId} order={o} onSent={setSent} />
          </Card>
        )}
        {sent && <Notice tone="success">{sent}</Notice>}
        {o.resultsSubmittedAt && (
          <Card title="Independent results">
            <p className="mb-3 text-sm">
              Sent {o.resultsSubmittedAt.slice(0, 16).replace("T", " ")} UTC{o.reportReference ? `, report ${o.reportReference}` : ""}.
              {o.deviationIds.length > 0 && (
                <>
                  {" "}
                  Deviations opened:{" "}
                  {o.deviationIds.map((d) => (
                    <Link key={d} to={`/deviations/${d}`} className="mr-2 font-semibold text-must-700 underline">
                      #{d}
                    </Link>
                  ))}
                </>
              )}
            </p>
            {lab &&
              o.lots.map((l) =>
                l.analysisId ? (
                  <div key={l.lotId} className="mb-4 flex flex-col gap-2">
                    <h3 className="font-semibold">Lot {l.lotCode}: the values you sent</h3>
                    <SentValues verdicts={l.verdicts} />
                    <ReportLinks orgId={orgId} reports={l.reports} />
                    <CertificateUpload
                      orgId={orgId}
                      analysisId={l.analysisId}
                      label={`Attach your signed report for lot ${l.lotCode}`}
                      onUploaded={() => q.refetch()}
                    />
                  </div>
                ) : null,
              )}
            {party &&
              o.lots.map((l) => (
                <div key={l.lotId} className="mb-6">
                  <h3 className="mb-2 font-semibold">
                    Lot {l.lotCode} ·{" "}
                    <a className="text-must-700 underline" href={conformityUrl(orgId, l.lotId)}>
                      Conformity document (PDF)
                    </a>
                    <span className="block text-xs font-normal text-ink-500">
                      A certificate of conformity when the lot's status allows one, otherwise an analysis statement saying why not.
                    </span>
                  </h3>
                  <ReportLinks orgId={orgId} reports={l.reports} />
                  <ComparisonTable
                    comparisons={l.comparisons}
                    caption={`Declared results against ${o.laboratoryName}'s (the reference). En uses both expanded uncertainties; z uses the catalogue's standard uncertainty as σ_pt.`}
                  />
                </div>
              ))}
            <LegalCaution />
          </Card>
        )}
        {o.lines.length > 0 && <HistoryPanel orgId={orgId} entityType="audit_order" entityId={o.id} />}
      </div>
    </>
  );
}

/** What the laboratory sent for one lot, in the spec's units, as the engine judged it. */
function SentValues({ verdicts }: { verdicts: StoredVerdict[] }) {
  return (
    <DataTable
      headings={["Parameter", "Result ± U (k = 2)", "Against the spec"]}
      dense
      caption="Values sent by the laboratory"
      captionHidden
    >
      {verdicts.map((v) => (
        <Row key={v.parameter}>
          <th scope="row" className="py-1 pr-3 font-normal">
            {findParameter(v.parameter)?.name ?? v.parameter}
          </th>
          <Cell dense className="tabular-nums">
            {verdictText(v).result}
          </Cell>
          <Cell dense>
            <OutcomeBadge outcome={v.outcome} />
          </Cell>
        </Row>
      ))}
    </DataTable>
  );
}

function ReportLinks({ orgId, reports }: { orgId: number; reports: { id: number; originalName: string }[] }) {
  if (!reports.length) return <p className="text-xs text-ink-500">No signed report attached yet.</p>;
  return (
    <p className="text-sm">
      Signed report:{" "}
      {reports.map((r) => (
        <a key={r.id} href={certificateUrl(orgId, r.id)} className="mr-2 font-semibold text-must-700 underline">
          {r.originalName}
        </a>
      ))}
    </p>
  );
}
