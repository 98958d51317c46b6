/** Boots Cellarpact: config, database, HTTP server, mail outbox worker; stops cleanly on SIGTERM. */
import { pino } from "pino";
import nodemailer from "nodemailer";
import { ConfigError, loadConfig, type Config } from "./config.ts";
import { createSequelize } from "./db/connection.ts";
import { useDatabase } from "./db/database.ts";
import { createApp } from "./app.ts";
import { startOutboxWorker } from "./integrations/mail/outbox.ts";
import { sendDigests } from "./services/notification-service.ts";
import { warnApproachingDeadlines } from "./services/deviations/deadline-job.ts";
import { answerClientErrors } from "./http/client-errors.ts";
import { mailDailyTreeHead } from "./services/trail/tree-head-mail.ts";

let config: Config;
try {
  config = loadConfig();
} catch (err) {
  if (err instanceof ConfigError) {
    console.error(err.message);
    process.exit(1);
  }
  throw err;
}

// Requests log one compact line without headers (server/http/request-log.ts); the redaction is a second guard.
const logger = pino({
  level: config.LOG_LEVEL,
  redact: ["req.headers.cookie", "req.headers.authorization", 'req.headers["x-csrf-token"]', 'res.headers["set-cookie"]'],
});
const sequelize = createSequelize(config, logger);
useDatabase(sequelize);
await sequelize.authenticate();

const { app } = createApp(config, logger);
// Pooled: a few connections kept open and reused, instead of a handshake per message.
const transport = nodemailer.createTransport({
  pool: true,
  maxConnections: 5,
  host: config.SMTP_HOST,
  port: config.SMTP_PORT,
  secure: false,
  ignoreTLS: true,
  connectionTimeout: 5000,
  greetingTimeout: 5000,
});
const worker = startOutboxWorker(
  transport,
  {
    from: config.MAIL_FROM,
    retryBaseMs: config.OUTBOX_RETRY_BASE_MS,
    maxAttempts: config.OUTBOX_MAX_ATTEMPTS,
    pollMs: config.OUTBOX_POLL_MS,
  },
  (err) => logger.warn({ err }, "outbox pass failed"),
);

// Hourly housekeeping: daily digests (each user at most once a day), deadline warnings, the daily signed trail head.
const housekeeping = setInterval(
  () => {
    void sendDigests().catch((err) => logger.warn({ err }, "digest pass failed"));
    void warnApproachingDeadlines().catch((err) => logger.warn({ err }, "deadline pass failed"));
    void mailDailyTreeHead().catch((err) => logger.warn({ err }, "tree head pass failed"));
  },
  60 * 60 * 1000,
);

const server = app.listen(config.PORT, config.HOST, () => {
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : config.PORT;
  logger.info({ port }, "listening");
  console.log(`Cellarpact is running at http://${config.HOST}:${port}`);
});
answerClientErrors(server);

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, "shutting down");
  const force = setTimeout(() => process.exit(1), 10_000);
  force.unref();
  // close() stops new connections and waits for requests in flight.
  await new Promise<void>((resolve) => server.close(() => resolve()));
  clearInterval(housekeeping);
  await worker.stop();
  transport.close();
  await sequelize.close();
  process.exit(0);
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
