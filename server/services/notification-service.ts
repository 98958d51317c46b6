/**
 * In-app notifications, mirrored by e-mail through the outbox according to each user's preference:
 * at once, in a daily digest, or not at all; and only for the kinds the user chose.
 */
import { afterCursor, orderBy, toPage, type SortKey } from "../db/keyset.ts";
import { Op, type Transaction } from "sequelize";
import { Notification } from "../models/notification.ts";
import { NotificationPreference } from "../models/notification-preference.ts";
import { Membership } from "../models/membership.ts";
import { User } from "../models/user.ts";
import { enqueueMail } from "../integrations/mail/outbox.ts";
import { database } from "../db/database.ts";
import { serviceSettings } from "../settings.ts";
import { NOTIFICATION_KINDS, type NotificationKind } from "../../shared/deviations/vocabulary.ts";

export interface NotificationPreferences {
  emailMode: "immediate" | "daily_digest" | "off";
  kinds: NotificationKind[];
}

export const DEFAULT_PREFERENCES: NotificationPreferences = { emailMode: "immediate", kinds: [...NOTIFICATION_KINDS] };

export async function preferencesOf(userId: number, t?: Transaction): Promise<NotificationPreferences> {
  const p = await NotificationPreference.findByPk(userId, { transaction: t });
  return p ? { emailMode: p.emailMode, kinds: p.kinds as NotificationKind[] } : DEFAULT_PREFERENCES;
}

export async function setPreferences(userId: number, prefs: NotificationPreferences): Promise<NotificationPreferences> {
  await NotificationPreference.upsert({ userId, emailMode: prefs.emailMode, kinds: prefs.kinds });
  return prefs;
}

/** Users holding one of these roles in one of these organisations. */
export async function usersWithRoles(organisationIds: number[], roles: string[], t?: Transaction): Promise<number[]> {
  const rows = await Membership.findAll({
    where: { organisationId: organisationIds, role: roles },
    attributes: ["userId"],
    transaction: t,
  });
  return [...new Set(rows.map((r) => r.userId))];
}

export async function notify(
  t: Transaction,
  userIds: number[],
  n: { kind: NotificationKind; title: string; body: string; link: string },
  exceptUserId?: number,
): Promise<void> {
  const targets = [...new Set(userIds)].filter((id) => id !== exceptUserId);
  if (!targets.length) return;
  await Notification.bulkCreate(
    targets.map((userId) => ({ userId, kind: n.kind, title: n.title, body: n.body, link: n.link })),
    { transaction: t },
  );
  const users = await User.findAll({ where: { id: targets }, attributes: ["id", "email"], transaction: t });
  for (const u of users) {
    const prefs = await preferencesOf(u.id, t);
    if (prefs.emailMode !== "immediate" || !prefs.kinds.includes(n.kind)) continue;
    await enqueueMail(t, {
      to: u.email,
      subject: n.title,
      text: `${n.body}\n\n${serviceSettings().appUrl}${n.link}\n\nYou can change which notifications reach you by e-mail on your Cellarpact profile page.`,
      kind: "notification",
      // A busy thread's comments and proposals arrive together, one waiting mail per person and thread;
      // a mention, a decision or a deadline always has a mail of its own.
      ...(n.kind === "comment" ? { coalesceKey: `${u.id}:${n.link}` } : {}),
    });
  }
}

const NEWEST_FIRST: SortKey[] = [{ attribute: "id", direction: "DESC" }];

/** A page of the user's notifications, newest first, with how many are unread in all. */
export async function listNotifications(userId: number, q: { limit: number; cursor?: string }) {
  const [rows, total, unread] = await Promise.all([
    Notification.findAll({
      where: { [Op.and]: [{ userId }, afterCursor(NEWEST_FIRST, q.cursor)] },
      order: orderBy(NEWEST_FIRST),
      limit: q.limit + 1,
      raw: true,
    }),
    Notification.count({ where: { userId } }),
    Notification.count({ where: { userId, readAt: null } }),
  ]);
  const page = await toPage(
    rows,
    q.limit,
    (r) => [r.id],
    (shown) =>
      shown.map((r) => ({
        id: r.id,
        kind: r.kind,
        title: r.title,
        body: r.body,
        link: r.link,
        read: r.readAt !== null,
        createdAt: new Date(r.createdAt).toISOString(),
      })),
    total,
  );
  return { ...page, unread };
}

export async function markRead(userId: number, ids: number[] | "all"): Promise<void> {
  await Notification.update({ readAt: new Date() }, { where: { userId, readAt: null, ...(ids === "all" ? {} : { id: ids }) } });
}

/**
 * The daily digest: one mail per user who chose it, listing what arrived since their last digest.
 * Safe to run often: a user gets at most one digest per 24 hours.
 */
export async function sendDigests(now = new Date()): Promise<number> {
  const dayAgo = new Date(now.getTime() - 86_400_000);
  const prefs = await NotificationPreference.findAll({
    where: { emailMode: "daily_digest", [Op.or]: [{ lastDigestAt: null }, { lastDigestAt: { [Op.lte]: dayAgo } }] },
  });
  let sent = 0;
  for (const p of prefs) {
    await database().transaction(async (t) => {
      const pending = await Notification.findAll({
        where: { userId: p.userId, digestedAt: null, kind: p.kinds },
        order: [["createdAt", "ASC"]],
        transaction: t,
        lock: t.LOCK.UPDATE,
      });
      await p.update({ lastDigestAt: now }, { transaction: t });
      if (!pending.length) return;
      const user = await User.findByPk(p.userId, { transaction: t });
      if (!user) return;
      await enqueueMail(t, {
        to: user.email,
        subject: `Cellarpact: ${pending.length} update${pending.length === 1 ? "" : "s"} since yesterday`,
        text: pending.map((n) => `• ${n.title}\n  ${serviceSettings().appUrl}${n.link}`).join("\n"),
        kind: "notification",
      });
      await Notification.update({ digestedAt: now }, { where: { id: pending.map((n) => n.id) }, transaction: t });
      sent += 1;
    });
  }
  return sent;
}
