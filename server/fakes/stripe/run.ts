/** Runs the Stripe fake as its own process: STRIPE_FAKE_PORT for the API, STRIPE_WEBHOOK_URL and STRIPE_WEBHOOK_SECRET for events. */
import { startStripeFake } from "./server.ts";

const fake = await startStripeFake({
  port: Number(process.env.STRIPE_FAKE_PORT ?? 12111),
  webhook: {
    url: process.env.STRIPE_WEBHOOK_URL ?? null,
    secret: process.env.STRIPE_WEBHOOK_SECRET ?? "whsec_local",
    retryBaseMs: Number(process.env.STRIPE_WEBHOOK_RETRY_MS ?? 2000),
  },
});
console.log(`Stripe fake: API and payment page on ${fake.url}, webhooks to ${process.env.STRIPE_WEBHOOK_URL ?? "(none)"}`);
const stop = () => void fake.stop().then(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
