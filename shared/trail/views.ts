/** The trail as the API returns it: entries and the result of checking the hash chain. */
export interface TrailEntryView {
  seq: number;
  occurredAt: string;
  actorUserId: number | null;
  organisationId: number | null;
  actorName: string | null;
  action: string;
  entityType: string;
  entityId: string | null;
  details: Record<string, unknown> | null;
  hash: string;
}

export interface ChainVerification {
  ok: boolean;
  checked: number;
  lastSeq: number;
  firstBroken?: { seq: number; reason: string };
}
