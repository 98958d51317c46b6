/** Opening deviations (from failing results, transit drift, or by hand): deadline, trail entry, notifications. */
import type { DeviationKind } from "../../../shared/deviations/vocabulary.ts";
import { deviationPath } from "../../../shared/paths.ts";
import type { Transaction } from "sequelize";
import { Deviation } from "../../models/deviation.ts";
import { recordTrails } from "../trail/trail-service.ts";
import { notify, usersWithRoles } from "../notification-service.ts";
import { RESPONSE_DAYS } from "../../../shared/deviations/vocabulary.ts";
import type { ContractWithParties } from "../specs/spec-access.ts";

export interface NewDeviation {
  lotId: number;
  analysisId: number | null;
  kind: DeviationKind;
  parameters: string[];
  summary: string;
  auditOrderId?: number | null;
}

export const responseDeadline = (from = new Date()) => new Date(from.getTime() + RESPONSE_DAYS * 86_400_000);

export async function openDeviations(
  t: Transaction,
  contract: ContractWithParties,
  actor: { userId: number; organisationId: number },
  rows: NewDeviation[],
): Promise<number[]> {
  if (!rows.length) return [];
  const created = await Deviation.bulkCreate(
    rows.map((r) => ({ ...r, contractId: contract.id, status: "open" as const, openedBy: actor.userId, respondBy: responseDeadline() })),
    { transaction: t },
  );
  const parties = await usersWithRoles([contract.retailerOrgId, contract.producerOrgId], ["buyer_technologist", "producer_quality"], t);
  await recordTrails(
    t,
    created.map((d) => ({
      actorUserId: actor.userId,
      organisationId: actor.organisationId,
      action: "deviation.opened" as const,
      entityType: "deviation",
      entityId: d.id,
      after: { kind: d.kind, parameters: d.parameters },
      details: { lotId: d.lotId, kind: d.kind, parameters: d.parameters },
    })),
  );
  // One notification per party for the whole batch keeps a large import from flooding inboxes.
  await notify(
    t,
    parties,
    created.length === 1
      ? {
          kind: "deviation_opened",
          title: `New deviation #${created[0]!.id}: ${contract.wine.name}`,
          body: created[0]!.summary,
          link: deviationPath(created[0]!.id),
        }
      : {
          kind: "deviation_opened",
          title: `${created.length} new deviations: ${contract.wine.name}`,
          body: created
            .slice(0, 20)
            .map((d) => d.summary)
            .join("\n"),
          link: `/deviations?contract=${contract.id}`,
        },
    actor.userId,
  );
  return created.map((d) => d.id);
}
