import { z } from "zod";
import Papa from "papaparse";
import { actionLabel, detailsText } from "../../shared/auth/trail-vocabulary.ts";
import type { RouteRegistry } from "../http/route-registry.ts";
import { orgMember } from "../http/access.ts";
import { idParam } from "../../shared/ids.ts";
import { listOrganisationAudit, verifyAuditChain } from "../services/audit-service.ts";
import { historyFor } from "../services/audit-access.ts";
import { HISTORY_ENTITY_TYPES } from "../../shared/auth/history.ts";

const orgParams = z.object({ orgId: idParam });
const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Use a date like 2026-03-31." });
const PARTIES = orgMember("buyer_technologist", "buyer_finance", "producer_quality", "lab_analyst", "org_admin");

export const auditQuerySchema = z.object({
  action: z.string().trim().max(80).optional(),
  entityType: z.string().trim().max(40).optional(),
  entityId: z.string().trim().max(64).optional(),
  actor: z.coerce.number().int().positive().optional(),
  from: day.optional(),
  to: day.optional(),
  limit: z.coerce.number().int().min(1).max(5000).default(200),
  format: z.enum(["json", "csv"]).optional(),
});

export function registerAuditRoutes(r: RouteRegistry): void {
  r.add(
    { method: "get", path: "/api/orgs/:orgId/audit", tag: "audit", summary: "Your organisation's audit log with filters; format=csv or json downloads it", access: orgMember("org_admin"), params: orgParams, query: auditQuerySchema },
    async ({ params, query, res }) => {
      const rows = await listOrganisationAudit(params.orgId, { action: query.action, entityType: query.entityType, entityId: query.entityId, actorUserId: query.actor, from: query.from, to: query.to, limit: query.limit });
      if (query.format === "csv") {
        const csv = Papa.unparse(rows.map((e) => ({ seq: e.seq, occurred_at: e.occurredAt, actor: e.actorName ?? "", action: e.action, what: actionLabel(e.action), entity_type: e.entityType, entity_id: e.entityId ?? "", details: detailsText(e.details), hash: e.hash })));
        res.status(200).type("text/csv").attachment(`audit-${params.orgId}.csv`).send(`\uFEFF${csv}`);
        return;
      }
      if (query.format === "json") {
        res.status(200).type("application/json").attachment(`audit-${params.orgId}.json`).send(JSON.stringify(rows, null, 2));
        return;
      }
      return rows;
    },
  );

  r.add(
    { method: "get", path: "/api/orgs/:orgId/history/:entityType/:entityId", tag: "audit", summary: "The recorded history of a spec version, lot, deviation, contract or audit order you are party to", access: PARTIES, params: orgParams.extend({ entityType: z.enum(HISTORY_ENTITY_TYPES), entityId: idParam }) },
    ({ params }) => historyFor(params.orgId, params.entityType, params.entityId),
  );

  r.add({ method: "get", path: "/api/orgs/:orgId/audit/verify", tag: "audit", summary: "Verify the whole hash chain and report the first broken entry", access: PARTIES, params: orgParams }, () => verifyAuditChain());
}
