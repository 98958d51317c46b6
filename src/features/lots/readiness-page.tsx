import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { readinessQuery } from "./api/lots.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { QueryStatus } from "../../components/ui/states.tsx";
import { LotStatusBadge } from "../../components/lot-status-badge.tsx";
import { DEVIATION_OUTCOME_LABELS } from "../../../shared/deviations/vocabulary.ts";
import { STAGE_LABELS } from "../../../shared/specs/vocabulary.ts";
import { CONTAINER_LABELS } from "../../../shared/lots/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const names = (ids: string[]) => ids.map((p) => findParameter(p)?.name ?? p).join(", ");

export function ReadinessPage() {
  const { orgId } = useOrganisation();
  const rows = useQuery({ ...readinessQuery(orgId) });
  return (
    <>
      <PageHeader
        title="Readiness"
        lead="Lots due for filling or shipment in the next four months, or not yet planned: what each required stage still lacks, and what fails."
      />
      <Card>
        <QueryStatus query={rows} empty="No lot is due." />
        {rows.data && rows.data.length > 0 && (
          <DataTable headings={["Lot", "Wine", "Due", "Status", "Stages"]}>
            {rows.data.map((r) => (
              <Row key={r.id}>
                <Cell className="font-semibold">
                  <Link to={`/lots/${r.id}`} className="text-must-700 underline">
                    {r.lotCode}
                  </Link>
                  <span className="block text-xs font-normal text-ink-500">{CONTAINER_LABELS[r.container]}</span>
                </Cell>
                <Cell>
                  {r.wineName}
                  <span className="block text-xs text-ink-500">
                    {r.producerName} · {r.vintage}
                  </span>
                </Cell>
                <Cell className="tabular-nums">{r.plannedDate ?? "not planned"}</Cell>
                <Cell>
                  <LotStatusBadge status={r.status} />
                  {r.status.openDeviations > 0 && (
                    <span className="block text-xs text-alarm-700">
                      {r.status.openDeviations === 1 ? "1 open deviation" : `${r.status.openDeviations} open deviations`}
                    </span>
                  )}
                  {r.decidedDeviations.map((d) => (
                    <span key={d.id} className="block text-xs text-ink-500">
                      Deviation #{d.id}: {DEVIATION_OUTCOME_LABELS[d.outcome]}
                    </span>
                  ))}
                </Cell>
                <Cell className="text-xs">
                  {!r.hasAgreedSpec && <span className="text-ochre-700">No agreed specification for this vintage.</span>}
                  <ul className="flex flex-col gap-1">
                    {r.stages.map((s) => (
                      <li key={s.stage}>
                        <strong>{STAGE_LABELS[s.stage]}:</strong>{" "}
                        {!s.analysed ? (
                          <span className="text-ochre-700">no analysis yet</span>
                        ) : s.missing.length ? (
                          <span className="text-ochre-700">missing {names(s.missing)}</span>
                        ) : (
                          <span className="text-verjus-700">complete</span>
                        )}
                        {s.failing.length > 0 && <span className="text-alarm-700"> · failing {names(s.failing)}</span>}
                      </li>
                    ))}
                  </ul>
                </Cell>
              </Row>
            ))}
          </DataTable>
        )}
      </Card>
    </>
  );
}
