/**
 * A local SMTP server that keeps what it receives and shows it over HTTP on loopback: the inbox
 * page at /, and GET/DELETE /messages for tests.
 * Stands in for a real mail relay in the demo and the tests; the app talks real SMTP to it.
 */
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import http from "node:http";
import { randomUUID } from "node:crypto";
import type { AddressInfo } from "node:net";
import { inboxPage } from "./inbox-page.ts";

export interface CaughtMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  messageId: string | null;
}

export interface MailFake {
  smtpPort: number;
  httpPort: number;
  messages: CaughtMail[];
  stop(): Promise<void>;
}

const addresses = (a: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((x) => x.value.map((v) => v.address ?? ""));

export async function startMailFake(opts: { smtpPort?: number; httpPort?: number; messages?: CaughtMail[] } = {}): Promise<MailFake> {
  const messages = opts.messages ?? [];
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((mail) => {
          messages.push({
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: addresses(mail.from)[0] ?? "",
            to: addresses(mail.to),
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            messageId: mail.messageId ?? null,
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(opts.smtpPort ?? 0, "127.0.0.1", () => resolve());
  });

  const web = http.createServer((req, res) => {
    if (req.url === "/" && req.method === "GET") {
      res
        .writeHead(200, {
          "content-type": "text/html; charset=utf-8",
          "content-security-policy": "default-src 'none'; style-src 'unsafe-inline'",
          "cache-control": "no-store",
        })
        .end(inboxPage(messages));
    } else if (req.url === "/messages" && req.method === "GET") {
      res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify([...messages].reverse()));
    } else if (req.url === "/messages" && req.method === "DELETE") {
      messages.length = 0;
      res.writeHead(204).end();
    } else {
      res.writeHead(404, { "content-type": "text/plain" }).end("not found");
    }
  });
  await new Promise<void>((resolve, reject) => {
    web.once("error", reject);
    web.listen(opts.httpPort ?? 0, "127.0.0.1", () => resolve());
  });

  return {
    smtpPort: (smtp.server.address() as AddressInfo).port,
    httpPort: (web.address() as AddressInfo).port,
    messages,
    async stop() {
      web.closeAllConnections();
      await Promise.all([new Promise<void>((r) => smtp.close(() => r())), new Promise<void>((r) => web.close(() => r()))]);
    },
  };
}
