/**
 * The outbox against the local SMTP fake: 3,000 notification mails from a burst, with one
 * invitation queued after them, delivered by the worker's pass over a pooled SMTP transport.
 * Prints mails per second (goal ≥ 100) and how many mails left before the invitation (goal: it
 * goes in the first batch, not behind the burst). Uses the cellarpact_bench database.
 */
import nodemailer from "nodemailer";
import { openBenchDatabase } from "./bench-db.ts";
import { loadConfig } from "../../server/config.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { inTransaction, useDatabase } from "../../server/db/database.ts";
import { createMigrator } from "../../server/db/migrator.ts";
import { startMailFake } from "../../server/fakes/mail-fake.ts";
import { deliverDueMail, enqueueMail, OUTBOX_BATCH } from "../../server/integrations/mail/outbox.ts";
import { OutboxMessage } from "../../server/models/outbox-message.ts";

const BURST = 3000;
const benchDb = openBenchDatabase();
const config = loadConfig({ ...process.env, DB_NAME: "cellarpact_bench", LOG_LEVEL: "silent" });
const sequelize = createSequelize(config);
useDatabase(sequelize);
await createMigrator(sequelize).up();
await OutboxMessage.destroy({ where: {} });

const fake = await startMailFake();
const transport = nodemailer.createTransport({
  pool: true,
  maxConnections: 5,
  host: "127.0.0.1",
  port: fake.smtpPort,
  secure: false,
  ignoreTLS: true,
});

await inTransaction(async (t) => {
  for (let i = 0; i < BURST; i++)
    await enqueueMail(t, {
      to: `reader${i % 40}@example.test`,
      subject: `Deviation #${i}: a comment`,
      text: "A comment on the thread.",
      kind: "notification",
      coalesceKey: `${i % 40}:/deviations/${i}`,
    });
});
await inTransaction((t) => enqueueMail(t, { to: "invited@example.test", subject: "You are invited", text: "Accept here." }));

const start = performance.now();
const delivered = await deliverDueMail(transport, { from: "Cellarpact <no-reply@cellarpact.test>", retryBaseMs: 1000, maxAttempts: 3 });
const seconds = (performance.now() - start) / 1000;
const before = fake.messages.findIndex((m) => m.to.includes("invited@example.test"));

console.log(
  `Mail outbox: ${BURST.toLocaleString("en-GB")} notifications and 1 invitation queued after them, pooled SMTP to the local fake`,
);
console.log(`  delivered ${delivered} in ${seconds.toFixed(2)} s: ${(delivered / seconds).toFixed(0)} mails per second (goal ≥ 100)`);
console.log(`  mails sent before the invitation: ${before} (goal: within the first batch of ${OUTBOX_BATCH})`);

transport.close();
await fake.stop();
await sequelize.close();
benchDb.stop();
