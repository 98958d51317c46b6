/** The one stripe SDK client, aimed by settings at Stripe or at the local fake; and webhook verification. */
import Stripe from "stripe";
import { serviceSettings } from "../../settings.ts";
import { AppError, badRequest, paymentDeclined, upstreamFailed } from "../../errors.ts";

let client: { key: string; stripe: Stripe } | null = null;

export function stripe(): Stripe {
  const s = serviceSettings().stripe;
  const key = `${s.secretKey}@${s.protocol}://${s.host}:${s.port}`;
  if (client?.key !== key) {
    // Retries stay with us (idempotency keys make a retry safe); telemetry would leave the machine.
    client = {
      key,
      stripe: new Stripe(s.secretKey, {
        host: s.host,
        port: s.port,
        protocol: s.protocol,
        maxNetworkRetries: 0,
        telemetry: false,
        timeout: 15_000,
      }),
    };
  }
  return client.stripe;
}

/** Verifies Stripe-Signature over the raw bytes; stale (over 300 s) or wrong signatures are refused with 400. */
export function verifiedEvent(rawBody: unknown, signature: string | undefined): Stripe.Event {
  if (!Buffer.isBuffer(rawBody) || rawBody.length === 0) throw badRequest("Send the event as application/json.");
  if (!signature) throw badRequest("The Stripe-Signature header is missing.");
  try {
    return stripe().webhooks.constructEvent(rawBody, signature, serviceSettings().stripe.webhookSecret, 300);
  } catch (err) {
    throw badRequest(`The webhook signature does not verify: ${err instanceof Error ? err.message.split("\n")[0] : "unknown error"}`);
  }
}

/** A Stripe failure as an HTTP answer: card errors are the payer's to fix (402), the rest is the service's (502). */
export function paymentServiceError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof Stripe.errors.StripeCardError) return paymentDeclined(err.message);
  if (err instanceof Stripe.errors.StripeError)
    return upstreamFailed("Payment service error", `The payment service refused the request: ${err.message}`);
  return upstreamFailed(
    "Payment service unavailable",
    "The payment service could not be reached; nothing was charged. Try again in a moment.",
  );
}
