/** The lot's status with its reason, the concession or rejection behind it, and any version that now governs instead. */
import { Link } from "react-router-dom";
import type { LotDetail } from "../../../shared/lots/views.ts";
import { CONDITION_LABELS } from "../../../shared/deviations/vocabulary.ts";
import { Card } from "../../components/ui/page.tsx";
import { LotStatusBadge } from "../../components/lot-status-badge.tsx";

export function LotStatusCard({ lot }: { lot: LotDetail }) {
  const s = lot.status;
  const stale = lot.governing ? lot.analyses.filter((a) => s.analysisIds.includes(a.id) && a.evaluation?.specVersion && a.evaluation.specVersion.id !== lot.governing!.id) : [];
  return (
    <Card title="Status">
      <div className="flex flex-col gap-2 text-sm">
        <p className="flex flex-wrap items-center gap-2">
          <LotStatusBadge status={s} /> <span>{s.reason}</span>
        </p>
        {s.concession && (
          <div>
            <Link to={`/deviations/${s.concession.deviationId}`} className="font-semibold text-must-700 underline">Concession on deviation #{s.concession.deviationId}</Link>
            {s.concession.conditions.length > 0 ? (
              <ul className="ml-5 list-disc">
                {s.concession.conditions.map((c, i) => <li key={i}>{CONDITION_LABELS[c.kind]}: {c.detail}</li>)}
              </ul>
            ) : (
              <span> · no conditions attached.</span>
            )}
          </div>
        )}
        {s.rejection && <Link to={`/deviations/${s.rejection.deviationId}`} className="font-semibold text-alarm-700 underline">The decision on deviation #{s.rejection.deviationId}</Link>}
        {s.openDeviations > 0 && <p className="text-alarm-700">{s.openDeviations === 1 ? "1 deviation is still open." : `${s.openDeviations} deviations are still open.`}</p>}
        {stale.map((a) => (
          <p key={a.id} className="rounded-md border border-ochre-700/40 bg-ochre-50 px-3 py-2 text-ochre-700">
            The {a.stage.replace("_", "-")} analysis of {a.sampleDate} was judged against version {a.evaluation!.specVersion!.number}; version {lot.governing!.number} now governs this vintage. Its verdict stands as judged until someone re-judges it.
          </p>
        ))}
      </div>
    </Card>
  );
}
