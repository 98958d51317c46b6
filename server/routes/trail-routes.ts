import { z } from "zod";
import Papa from "papaparse";
import { CSV_BOM, CSV_EXPORT_OPTIONS } from "../../shared/csv-export.ts";
import { actionLabel, detailsText } from "../../shared/trail/vocabulary.ts";
import type { RouteRegistry } from "../http/route-registry.ts";
import { allowed, PUBLIC } from "../http/access.ts";
import { idParam } from "../../shared/ids.ts";
import {
  consistencyQuerySchema,
  inclusionQuerySchema,
  keptTreeHeadSchema,
  TRAIL_EXPORT_MAX,
  trailQuerySchema,
} from "../../shared/trail/schemas.ts";
import { checkKeptHead, consistencyProof, currentTreeHead, inclusionProof, signingKey } from "../services/trail/tree-heads.ts";
import { listOrganisationTrail, pageOrganisationTrail, verifyOrganisationEntries } from "../services/trail/trail-service.ts";
import { historyFor } from "../services/trail/trail-access.ts";
import { HISTORY_ENTITY_TYPES } from "../../shared/trail/history.ts";

const orgParams = z.object({ orgId: idParam });
const PARTIES = allowed("trail.history");

export function registerTrailRoutes(r: RouteRegistry): void {
  const routes = r.section("trail");
  routes.get(
    "/api/orgs/:orgId/trail",
    {
      summary: "Your organisation's trail with filters; format=csv or json downloads it",
      access: allowed("trail.organisation"),
      params: orgParams,
      query: trailQuerySchema,
    },
    async ({ params, query, res }) => {
      const filters = {
        action: query.action,
        entityType: query.entityType,
        entityId: query.entityId,
        actorUserId: query.actor,
        from: query.from,
        to: query.to,
      };
      if (!query.format) return pageOrganisationTrail(params.orgId, { ...filters, limit: query.limit, cursor: query.cursor });
      const rows = await listOrganisationTrail(params.orgId, filters, TRAIL_EXPORT_MAX);
      if (query.format === "csv") {
        const csv = Papa.unparse(
          rows.map((e) => ({
            seq: e.seq,
            occurred_at: e.occurredAt,
            actor: e.actorName ?? "",
            action: e.action,
            what: actionLabel(e.action),
            entity_type: e.entityType,
            entity_id: e.entityId ?? "",
            details: detailsText(e.details),
            hash: e.hash,
          })),
          CSV_EXPORT_OPTIONS,
        );
        res.status(200).type("text/csv").attachment(`trail-${params.orgId}.csv`).send(`${CSV_BOM}${csv}`);
        return;
      }
      res
        .status(200)
        .type("application/json")
        .attachment(`trail-${params.orgId}.json`)
        .send(JSON.stringify(rows, null, 2));
    },
  );

  routes.get(
    "/api/orgs/:orgId/history/:entityType/:entityId",
    {
      summary: "The recorded history of a spec version, lot, deviation, contract or audit order you are party to",
      access: PARTIES,
      params: orgParams.extend({ entityType: z.enum(HISTORY_ENTITY_TYPES), entityId: idParam }),
    },
    ({ params }) => historyFor(params.orgId, params.entityType, params.entityId),
  );

  routes.get(
    "/api/orgs/:orgId/trail/verify",
    {
      summary:
        "Verify the entries about your organisation (their hashes and their links into the chain); the whole chain is the platform admin's",
      access: PARTIES,
      params: orgParams,
    },
    ({ params }) => verifyOrganisationEntries(params.orgId),
  );

  routes.get("/api/trail/public-key", { summary: "The Ed25519 public key that signs the trail's tree heads", access: PUBLIC }, () => {
    const key = signingKey();
    return { algorithm: "Ed25519", keyId: key.keyId, publicKeyPem: key.publicKeyPem };
  });

  routes.get(
    "/api/orgs/:orgId/trail/tree-head",
    { summary: "A signed head of the trail now (size, Merkle root, time), to keep", access: PARTIES, params: orgParams },
    () => currentTreeHead(),
  );

  routes.get(
    "/api/orgs/:orgId/trail/inclusion",
    {
      summary: "Proof that an entry about your organisation is in the tree of a given size (RFC 9162 §2.1.3)",
      access: PARTIES,
      params: orgParams,
      query: inclusionQuerySchema,
    },
    ({ params, query }) => inclusionProof(params.orgId, query.seq, query.treeSize),
  );

  routes.get(
    "/api/orgs/:orgId/trail/consistency",
    {
      summary: "Proof that the tree of `to` entries extends the one of `from` entries unchanged (RFC 9162 §2.1.4)",
      access: PARTIES,
      params: orgParams,
      query: consistencyQuerySchema,
    },
    ({ query }) => consistencyProof(query.from, query.to),
  );

  routes.post(
    "/api/orgs/:orgId/trail/check-head",
    {
      summary: "Check a signed tree head you kept against the trail now (signature and consistency)",
      access: PARTIES,
      params: orgParams,
      body: keptTreeHeadSchema,
    },
    ({ body }) => checkKeptHead(body),
  );
}
