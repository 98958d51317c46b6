/**
 * Durable mail outbox: mail is written in the same transaction as the change that causes it and
 * delivered later by a worker, so an SMTP outage loses nothing.
 *
 * Delivery is at least once. A batch of due rows is locked (SKIP LOCKED, so two workers never take
 * the same row), sent concurrently over a pooled SMTP connection, and marked in the same
 * transaction. If the process dies after the relay accepted a message but before the mark is
 * committed, that message is sent again on restart — with the same Message-ID
 * (`<message-key@cellarpact.test>`), by which receivers and relays recognise a duplicate.
 *
 * Mail someone is waiting for goes first: transactional mail (reset links, invitations, receipts)
 * has priority 0, notifications 1. A notification for a person on a thread whose earlier
 * notification mail has not left yet is folded into that mail instead of queuing another.
 */
import { randomUUID } from "node:crypto";
import { Op, type Transaction } from "sequelize";
import type { Transporter } from "nodemailer";
import { OutboxMessage } from "../../models/outbox-message.ts";
import { database } from "../../db/database.ts";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  /** Notifications wait behind transactional mail; absent means transactional. */
  kind?: "transactional" | "notification";
  /** Notifications that may be folded into one mail while it waits (one person, one thread). */
  coalesceKey?: string;
}

const PRIORITY = { transactional: 0, notification: 1 } as const;
/** Rows claimed per pass: enough to keep a pooled connection busy, few enough to commit quickly. */
export const OUTBOX_BATCH = 50;

export async function enqueueMail(t: Transaction, mail: OutgoingMail): Promise<void> {
  if (mail.coalesceKey) {
    // A waiting mail that no worker holds takes in this update; one being sent is left alone.
    const waiting = await OutboxMessage.findOne({
      where: { coalesceKey: mail.coalesceKey, status: "pending", attempts: 0 },
      lock: t.LOCK.UPDATE,
      skipLocked: true,
      transaction: t,
    });
    if (waiting) {
      const updates = waiting.updates + 1;
      const first = waiting.subject.replace(/ \(\+\d+ more\)$/, "");
      await waiting.update(
        { updates, subject: `${first.slice(0, 230)} (+${updates - 1} more)`, textBody: `${waiting.textBody}\n\n---\n\n${mail.text}` },
        { transaction: t },
      );
      return;
    }
  }
  await OutboxMessage.create(
    {
      messageKey: randomUUID(),
      toAddress: mail.to,
      subject: mail.subject,
      textBody: mail.text,
      nextAttemptAt: new Date(),
      priority: PRIORITY[mail.kind ?? "transactional"],
      coalesceKey: mail.coalesceKey ?? null,
    },
    { transaction: t },
  );
}

export interface DeliverySettings {
  from: string;
  retryBaseMs: number;
  maxAttempts: number;
}

/** Sends every message that is due, transactional first; returns how many were delivered in this pass. */
export async function deliverDueMail(transport: Transporter, s: DeliverySettings): Promise<number> {
  let delivered = 0;
  for (;;) {
    const sent = await database().transaction(async (t) => {
      const batch = await OutboxMessage.findAll({
        where: { status: "pending", nextAttemptAt: { [Op.lte]: new Date() } },
        order: [
          ["priority", "ASC"],
          ["id", "ASC"],
        ],
        limit: OUTBOX_BATCH,
        lock: t.LOCK.UPDATE,
        skipLocked: true,
        transaction: t,
      });
      if (!batch.length) return null;
      const outcomes = await Promise.allSettled(
        batch.map((msg) =>
          transport.sendMail({
            from: s.from,
            to: msg.toAddress,
            subject: msg.subject,
            text: msg.textBody,
            messageId: `<${msg.messageKey}@cellarpact.test>`,
          }),
        ),
      );
      const now = new Date();
      const ok = batch.filter((_, i) => outcomes[i]!.status === "fulfilled");
      if (ok.length)
        await OutboxMessage.update(
          { status: "sent", sentAt: now, attempts: database().literal("attempts + 1") as unknown as number, lastError: null },
          { where: { id: ok.map((m) => m.id) }, transaction: t },
        );
      for (const [i, msg] of batch.entries()) {
        const outcome = outcomes[i]!;
        if (outcome.status === "fulfilled") continue;
        const attempts = msg.attempts + 1;
        const delay = Math.min(s.retryBaseMs * 2 ** (attempts - 1), 60 * 60 * 1000);
        await msg.update(
          {
            attempts,
            status: attempts >= s.maxAttempts ? "dead" : "pending",
            nextAttemptAt: new Date(now.getTime() + delay),
            lastError: String((outcome.reason as Error)?.message ?? outcome.reason).slice(0, 500),
          },
          { transaction: t },
        );
      }
      return ok.length;
    });
    if (sent === null) return delivered;
    delivered += sent;
    // A batch where nothing went through means the relay is down: wait for the next poll.
    if (sent === 0) return delivered;
  }
}

/** Polls the outbox until stopped; one pass at a time. */
export function startOutboxWorker(transport: Transporter, s: DeliverySettings & { pollMs: number }, onError: (e: unknown) => void) {
  let stopped = false;
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<unknown> = Promise.resolve();
  const tick = () => {
    running = deliverDueMail(transport, s)
      .catch(onError)
      .finally(() => {
        if (!stopped) timer = setTimeout(tick, s.pollMs);
      });
  };
  timer = setTimeout(tick, 0);
  return {
    async stop() {
      stopped = true;
      clearTimeout(timer);
      await running;
    },
  };
}
