/** The kinds of record whose history a party may read, each at /api/orgs/:orgId/history/:entityType/:id. */
export const HISTORY_ENTITY_TYPES = ["spec_version", "lot", "deviation", "contract", "audit_order"] as const;
export type HistoryEntityType = (typeof HISTORY_ENTITY_TYPES)[number];
