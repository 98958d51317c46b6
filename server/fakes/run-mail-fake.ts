/** Runs the mail fake as its own process: SMTP_PORT for mail, MAIL_FAKE_HTTP_PORT for the inbox page and API (loopback only). */
import { startMailFake } from "./mail-fake.ts";

const fake = await startMailFake({
  smtpPort: Number(process.env.SMTP_PORT ?? 2525),
  httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2580),
});
console.log(`Mail fake: SMTP on 127.0.0.1:${fake.smtpPort}, inbox on http://127.0.0.1:${fake.httpPort}/`);
const stop = () => void fake.stop().then(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
