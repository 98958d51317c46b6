/**
 * The trail: append-only and hash-chained. Each entry's hash covers its content and the previous hash;
 * the audit_head row serialises appends and acts as the checkpoint for the tail.
 */
import type { Transaction } from "sequelize";
import type { TrailAction } from "../../../shared/trail/vocabulary.ts";
import { afterCursor, orderBy, toPage, type SortKey } from "../../db/keyset.ts";
import type { Page } from "../../../shared/paging.ts";
import { Op, type WhereOptions } from "sequelize";
import { TrailEntry } from "../../models/trail-entry.ts";
import { TrailHead } from "../../models/trail-head.ts";
import { User } from "../../models/user.ts";
import { canonicalJson, sha256 } from "../../lib/crypto.ts";
import type { TrailEntryView, ChainVerification } from "../../../shared/trail/views.ts";

export const GENESIS_HASH = "0".repeat(64);

export interface TrailInput {
  actorUserId: number | null;
  organisationId: number | null;
  /** Only actions with a label in shared/auth/trail-vocabulary.ts can be recorded. */
  action: TrailAction;
  entityType: string;
  entityId: string | number | null;
  before?: unknown;
  after?: unknown;
  /** The digest of `after` when the caller already took it (sha256 of its canonical JSON), instead of `after`. */
  afterDigest?: string;
  details?: Record<string, unknown>;
}

interface ChainedFields {
  seq: number;
  occurredAt: Date;
  actorUserId: number | null;
  organisationId: number | null;
  action: string;
  entityType: string;
  entityId: string | null;
  beforeDigest: string | null;
  afterDigest: string | null;
  details: Record<string, unknown> | null;
  prevHash: string;
}

export function entryHash(e: ChainedFields): string {
  return sha256(
    canonicalJson({
      seq: e.seq,
      occurredAt: e.occurredAt.toISOString(),
      actorUserId: e.actorUserId,
      organisationId: e.organisationId,
      action: e.action,
      entityType: e.entityType,
      entityId: e.entityId,
      beforeDigest: e.beforeDigest,
      afterDigest: e.afterDigest,
      details: e.details,
      prevHash: e.prevHash,
    }),
  );
}

const digest = (v: unknown) => (v === undefined ? null : sha256(canonicalJson(v)));

/** Records one event inside the caller's transaction, so the event exists exactly when the change does. */
export async function recordTrail(t: Transaction, input: TrailInput): Promise<number> {
  return (await recordTrails(t, [input]))[0]!;
}

/**
 * Records many events in one go, chained in the order given: the head is locked and moved once and
 * the entries go in one multi-row insert, so a large import's deviations cost three statements, not three each.
 */
export async function recordTrails(t: Transaction, inputs: TrailInput[]): Promise<number[]> {
  if (!inputs.length) return [];
  const head = await TrailHead.findByPk(1, { transaction: t, lock: t.LOCK.UPDATE });
  if (!head) throw new Error("trail_head row missing; run the migrations");
  let { lastSeq, lastHash } = head;
  const occurredAt = new Date();
  const entries = inputs.map((input) => {
    const fields: ChainedFields = {
      seq: lastSeq + 1,
      occurredAt,
      actorUserId: input.actorUserId,
      organisationId: input.organisationId,
      action: input.action,
      entityType: input.entityType,
      entityId: input.entityId === null ? null : String(input.entityId),
      beforeDigest: digest(input.before),
      afterDigest: input.afterDigest ?? digest(input.after),
      details: input.details ?? null,
      prevHash: lastHash,
    };
    const hash = entryHash(fields);
    lastSeq = fields.seq;
    lastHash = hash;
    return { ...fields, hash };
  });
  await TrailEntry.bulkCreate(entries, { transaction: t });
  await head.update({ lastSeq, lastHash }, { transaction: t });
  return entries.map((e) => e.seq);
}

const brokenAt = (head: TrailHead | null, checked: number, seq: number, reason: string): ChainVerification => ({
  ok: false,
  checked,
  lastSeq: head?.lastSeq ?? 0,
  firstBroken: { seq, reason },
});

/** Walks the whole chain in order; reports the first entry that does not match, or a tail that was cut. */
export async function verifyTrailChain(batchSize = 2000): Promise<ChainVerification> {
  const head = await TrailHead.findByPk(1);
  let prevHash = GENESIS_HASH;
  let expectedSeq = 1;
  let checked = 0;
  const broken = (seq: number, reason: string) => brokenAt(head, checked, seq, reason);
  for (;;) {
    const rows = await TrailEntry.findAll({
      where: { seq: { [Op.gte]: expectedSeq } },
      order: [["seq", "ASC"]],
      limit: batchSize,
    });
    if (rows.length === 0) break;
    for (const row of rows) {
      if (row.seq !== expectedSeq) return broken(expectedSeq, `entry ${expectedSeq} is missing`);
      if (row.prevHash !== prevHash) return broken(row.seq, "its link to the previous entry does not match");
      if (entryHash(row) !== row.hash) return broken(row.seq, "its content does not match its hash");
      prevHash = row.hash;
      expectedSeq += 1;
      checked += 1;
    }
  }
  const lastSeq = expectedSeq - 1;
  if (!head) return broken(lastSeq, "the checkpoint row is missing");
  if (head.lastSeq !== lastSeq || head.lastHash !== prevHash) {
    return broken(
      Math.min(lastSeq, head.lastSeq) + 1,
      `the chain ends at entry ${lastSeq} but the checkpoint records entry ${head.lastSeq}`,
    );
  }
  return { ok: true, checked, lastSeq };
}

/**
 * What a member may check without reading anyone else's records: every entry about their own
 * organisation recomputes to its hash, and is linked both ways into the chain — its link matches
 * the hash of the entry before it, and the entry after it links to it — and the checkpoint is not
 * behind it. Only the neighbours' hashes are read. Cost grows with the organisation's own entries,
 * not the platform's; the whole chain is the platform admin's to walk.
 */
export async function verifyOrganisationEntries(organisationId: number, batchSize = 2000): Promise<ChainVerification> {
  const head = await TrailHead.findByPk(1);
  let checked = 0;
  let after = 0;
  const broken = (seq: number, reason: string) => brokenAt(head, checked, seq, reason);
  for (;;) {
    const rows = await TrailEntry.findAll({
      where: { organisationId, seq: { [Op.gt]: after } },
      order: [["seq", "ASC"]],
      limit: batchSize,
    });
    if (rows.length === 0) break;
    const neighbours = await TrailEntry.findAll({
      where: { seq: [...new Set(rows.flatMap((r) => [r.seq - 1, r.seq + 1]))] },
      attributes: ["seq", "hash", "prevHash"],
      raw: true,
    });
    const bySeq = new Map(neighbours.map((n) => [n.seq, n]));
    for (const row of rows) {
      if (entryHash(row) !== row.hash) return broken(row.seq, "its content does not match its hash");
      const before = row.seq === 1 ? GENESIS_HASH : bySeq.get(row.seq - 1)?.hash;
      if (before === undefined) return broken(row.seq - 1, `entry ${row.seq - 1} before it is missing`);
      if (row.prevHash !== before) return broken(row.seq, "its link to the previous entry does not match");
      const next = bySeq.get(row.seq + 1);
      if (next && next.prevHash !== row.hash) return broken(row.seq + 1, `the entry after ${row.seq} does not link to it`);
      if (!next && (!head || head.lastSeq !== row.seq || head.lastHash !== row.hash))
        return broken(row.seq + 1, `entry ${row.seq} has no successor, yet the checkpoint records entry ${head?.lastSeq ?? 0}`);
      checked += 1;
      after = row.seq;
    }
  }
  if (!head) return broken(after, "the checkpoint row is missing");
  return { ok: true, checked, lastSeq: head.lastSeq };
}

export interface AuditFilters {
  action?: string;
  entityType?: string;
  entityId?: string;
  actorUserId?: number;
  from?: string;
  to?: string;
}

const NEWEST_FIRST: SortKey[] = [{ attribute: "seq", direction: "DESC" }];

function trailWhere(organisationId: number, f: AuditFilters): WhereOptions {
  const where: WhereOptions = { organisationId };
  if (f.action) Object.assign(where, { action: { [Op.like]: `${f.action.replace(/[%_\\]/g, "")}%` } });
  if (f.entityType) Object.assign(where, { entityType: f.entityType });
  if (f.entityId) Object.assign(where, { entityId: f.entityId });
  if (f.actorUserId) Object.assign(where, { actorUserId: f.actorUserId });
  if (f.from || f.to)
    Object.assign(where, {
      occurredAt: {
        ...(f.from ? { [Op.gte]: new Date(`${f.from}T00:00:00Z`) } : {}),
        ...(f.to ? { [Op.lte]: new Date(`${f.to}T23:59:59.999Z`) } : {}),
      },
    });
  return where;
}

/** A page of the entries recorded for an organisation, newest first, narrowed by the filters. */
export async function pageOrganisationTrail(
  organisationId: number,
  f: AuditFilters & { limit: number; cursor?: string },
): Promise<Page<TrailEntryView>> {
  const where = trailWhere(organisationId, f);
  const [rows, total] = await Promise.all([
    TrailEntry.findAll({
      where: { [Op.and]: [where, afterCursor(NEWEST_FIRST, f.cursor)] },
      order: orderBy(NEWEST_FIRST),
      limit: f.limit + 1,
      raw: true,
    }),
    TrailEntry.count({ where }),
  ]);
  return toPage(rows, f.limit, (r) => [r.seq], toViews, total);
}

/** Every entry matching the filters, newest first, up to `max`: what a download holds. */
export async function listOrganisationTrail(organisationId: number, f: AuditFilters, max: number): Promise<TrailEntryView[]> {
  return toViews(await TrailEntry.findAll({ where: trailWhere(organisationId, f), order: orderBy(NEWEST_FIRST), limit: max, raw: true }));
}

/** The history of one entity, across the organisations that recorded it. */
export async function entityHistory(entityType: string, entityId: string): Promise<TrailEntryView[]> {
  return toViews(await TrailEntry.findAll({ where: { entityType, entityId }, order: [["seq", "ASC"]], limit: 1000, raw: true }));
}

async function toViews(rows: TrailEntry[]): Promise<TrailEntryView[]> {
  const actorIds = [...new Set(rows.map((r) => r.actorUserId).filter((id): id is number => id !== null))];
  const actors = await User.findAll({ where: { id: actorIds }, attributes: ["id", "name"], raw: true });
  const nameOf = new Map(actors.map((a) => [a.id, a.name]));
  return rows.map((r) => ({
    seq: r.seq,
    occurredAt: new Date(r.occurredAt).toISOString(),
    actorUserId: r.actorUserId,
    organisationId: r.organisationId,
    actorName: r.actorUserId === null ? null : (nameOf.get(r.actorUserId) ?? `user ${r.actorUserId}`),
    action: r.action,
    entityType: r.entityType,
    entityId: r.entityId,
    details: typeof r.details === "string" ? JSON.parse(r.details) : r.details,
    hash: r.hash,
  }));
}
