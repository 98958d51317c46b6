/** Delivers the outbox to an in-process SMTP fake over real SMTP, as the worker does. */
import nodemailer from "nodemailer";
import { startMailFake, type MailFake } from "../../server/fakes/mail-fake.ts";
import { deliverDueMail } from "../../server/integrations/mail/outbox.ts";

export async function startTestMail(port?: number) {
  const fake: MailFake = await startMailFake({ smtpPort: port });
  const transport = nodemailer.createTransport({
    host: "127.0.0.1",
    port: fake.smtpPort,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 2000,
  });
  return {
    fake,
    transport,
    deliver: () => deliverDueMail(transport, { from: "Cellarpact <no-reply@cellarpact.test>", retryBaseMs: 10, maxAttempts: 5 }),
    to: (address: string) => fake.messages.filter((m) => m.to.includes(address)),
    async stop() {
      transport.close();
      await fake.stop();
    },
  };
}

export const linkIn = (text: string, path: string): string => {
  const m = text.match(new RegExp(`https?://\\S+${path}/([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${path} link in mail:\n${text}`);
  return m[1]!;
};
