import { useInfiniteQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { readinessQuery } from "./api/lots.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { QueryStatus } from "../../components/ui/states.tsx";
import { MoreRows } from "../../components/ui/more-rows.tsx";
import { SelectField } from "../../components/ui/field.tsx";
import { rowsOf } from "../../lib/paged.ts";
import { useFilterParams } from "../../lib/use-filter-params.ts";
import { READINESS_HORIZON_DEFAULT, READINESS_HORIZON_MAX } from "../../../shared/lots/schemas.ts";
import { LotStatusBadge } from "../../components/lot-status-badge.tsx";
import { DEVIATION_OUTCOME_LABELS } from "../../../shared/deviations/vocabulary.ts";
import { STAGE_LABELS } from "../../../shared/specs/vocabulary.ts";
import { CONTAINER_LABELS } from "../../../shared/lots/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const names = (ids: string[]) => ids.map((p) => findParameter(p)?.name ?? p).join(", ");

const HORIZONS = [30, 60, READINESS_HORIZON_DEFAULT, 180, 365, READINESS_HORIZON_MAX];

export function ReadinessPage() {
  const { orgId } = useOrganisation();
  const [params, set] = useFilterParams();
  const asked = Number(params.get("horizon"));
  const horizon = HORIZONS.includes(asked) ? asked : READINESS_HORIZON_DEFAULT;
  const rows = useInfiniteQuery(readinessQuery(orgId, horizon));
  return (
    <>
      <PageHeader
        title="Readiness"
        lead="Lots due for filling or shipment within the horizon, soonest first, then those not yet planned: what each required stage still lacks, and what fails."
      />
      <Card>
        <div className="mb-4 max-w-xs">
          <SelectField
            label="Due within"
            value={String(horizon)}
            onChange={(e) => set("horizon", e.target.value === String(READINESS_HORIZON_DEFAULT) ? "" : e.target.value)}
            options={HORIZONS.map((d) => ({ value: String(d), label: `${d} days` }))}
          />
        </div>
        <QueryStatus query={rows} empty="No lot is due." />
        {rowsOf(rows.data).length > 0 && (
          <>
            <DataTable headings={["Lot", "Wine", "Due", "Status", "Stages"]}>
              {rowsOf(rows.data).map((r) => (
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
            <MoreRows query={rows} noun="lots due" />
          </>
        )}
      </Card>
    </>
  );
}
