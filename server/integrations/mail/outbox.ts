/**
 * Durable mail outbox: mail is written in the same transaction as the change that causes it and
 * delivered later by a worker, so an SMTP outage loses nothing. A row is locked while it is sent,
 * so two workers never send the same message.
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
}

export async function enqueueMail(t: Transaction, mail: OutgoingMail): Promise<void> {
  await OutboxMessage.create(
    { messageKey: randomUUID(), toAddress: mail.to, subject: mail.subject, textBody: mail.text, nextAttemptAt: new Date() },
    { transaction: t },
  );
}

export interface DeliverySettings {
  from: string;
  retryBaseMs: number;
  maxAttempts: number;
}

/** Sends every message that is due; returns how many were delivered in this pass. */
export async function deliverDueMail(transport: Transporter, s: DeliverySettings): Promise<number> {
  let delivered = 0;
  for (;;) {
    const outcome = await database().transaction(async (t) => {
      const msg = await OutboxMessage.findOne({
        where: { status: "pending", nextAttemptAt: { [Op.lte]: new Date() } },
        order: [["id", "ASC"]],
        lock: t.LOCK.UPDATE,
        skipLocked: true,
        transaction: t,
      });
      if (!msg) return "idle" as const;
      try {
        await transport.sendMail({
          from: s.from,
          to: msg.toAddress,
          subject: msg.subject,
          text: msg.textBody,
          messageId: `<${msg.messageKey}@cellarpact.test>`,
        });
        await msg.update({ status: "sent", sentAt: new Date(), attempts: msg.attempts + 1, lastError: null }, { transaction: t });
        return "sent" as const;
      } catch (err) {
        const attempts = msg.attempts + 1;
        const delay = Math.min(s.retryBaseMs * 2 ** (attempts - 1), 60 * 60 * 1000);
        await msg.update(
          {
            attempts,
            status: attempts >= s.maxAttempts ? "dead" : "pending",
            nextAttemptAt: new Date(Date.now() + delay),
            lastError: String((err as Error).message).slice(0, 500),
          },
          { transaction: t },
        );
        return "failed" as const;
      }
    });
    if (outcome === "sent") delivered += 1;
    else return delivered;
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
