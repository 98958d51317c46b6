/** The lot's status with its reason, the concession or rejection behind it, and any version that now governs instead. */
import { Link } from "react-router-dom";
import type { LotDetail } from "../../../shared/lots/views.ts";
import { CONDITION_LABELS } from "../../../shared/deviations/vocabulary.ts";
import { Card } from "../../components/ui/page.tsx";
import { LotStatusBadge } from "../../components/lot-status-badge.tsx";
import { ConfirmButton } from "../../components/ui/confirm-dialog.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { errorMessage } from "../../lib/api-client.ts";
import { ANALYSIS_STAGE_LABELS } from "../../../shared/lots/vocabulary.ts";
import { countsText } from "../../../shared/lots/judge.ts";
import { useRejudge } from "./api/lots.ts";

export function LotStatusCard({ orgId, lot, canRejudge }: { orgId: number; lot: LotDetail; canRejudge: boolean }) {
  const s = lot.status;
  const rejudge = useRejudge(orgId, lot.id);
  const stale = lot.governing
    ? lot.analyses.filter(
        (a) =>
          s.analysisIds.includes(a.id) &&
          a.evaluation?.specVersion &&
          (a.evaluation.specVersion.id !== lot.governing!.id || a.evaluation.factsChanged),
      )
    : [];
  return (
    <Card title="Status">
      <div className="flex flex-col gap-2 text-sm">
        <p className="flex flex-wrap items-center gap-2">
          <LotStatusBadge status={s} /> <span>{s.reason}</span>
        </p>
        {s.concession && (
          <div>
            <Link to={`/deviations/${s.concession.deviationId}`} className="font-semibold text-must-700 underline">
              Concession on deviation #{s.concession.deviationId}
            </Link>
            {s.concession.conditions.length > 0 ? (
              <ul className="ml-5 list-disc">
                {s.concession.conditions.map((c, i) => (
                  <li key={i}>
                    {CONDITION_LABELS[c.kind]}: {c.detail}
                  </li>
                ))}
              </ul>
            ) : (
              <span> · no conditions attached.</span>
            )}
          </div>
        )}
        {s.rejection && (
          <Link to={`/deviations/${s.rejection.deviationId}`} className="font-semibold text-alarm-700 underline">
            The decision on deviation #{s.rejection.deviationId}
          </Link>
        )}
        {rejudge.isError && <Notice tone="error">{errorMessage(rejudge.error)}</Notice>}
        {rejudge.isSuccess && <Notice tone="success">Re-judged and recorded: {countsText(rejudge.data.counts)}.</Notice>}
        {s.openDeviations > 0 && (
          <p className="text-alarm-700">
            {s.openDeviations === 1 ? "1 deviation is still open." : `${s.openDeviations} deviations are still open.`}
          </p>
        )}
        {stale.map((a) => {
          const judged = a.evaluation!.specVersion!.number;
          const now = lot.governing!.number;
          const why =
            judged !== now
              ? `was judged against version ${judged}; version ${now} now governs this vintage`
              : "was judged with facts about the wine that have since changed (its facts for the law, or its usual sugar and alcohol)";
          return (
            <div key={a.id} className="flex flex-col gap-2 rounded-md border border-ochre-700/40 bg-ochre-50 px-3 py-2 text-ochre-700">
              <p>
                The {ANALYSIS_STAGE_LABELS[a.stage].toLowerCase()} analysis of {a.sampleDate} {why}. Its verdict stands as judged until
                someone re-judges it.
              </p>
              {canRejudge && (
                <div>
                  <ConfirmButton
                    variant="secondary"
                    disabled={rejudge.isPending}
                    request={{
                      title: `Re-judge against version ${now}?`,
                      consequence: `The results of ${a.sampleDate} are judged again against version ${now}, with the wine's facts as they stand, as a new, recorded analysis, which then speaks for the lot. The first verdict stays as it was; a failing result opens a deviation.`,
                      confirmLabel: "Re-judge",
                      onConfirm: () => rejudge.mutate(a.id),
                    }}
                  >
                    Re-judge against version {now}
                  </ConfirmButton>
                </div>
              )}
            </div>
          );
        })}
      </div>
    </Card>
  );
}
