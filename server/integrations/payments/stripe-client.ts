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

const SIGNATURE_TOLERANCE_SECONDS = 300;

/**
 * Verifies Stripe-Signature over the raw bytes and the event's shape. Wrong signatures, and
 * signatures dated more than 300 s from now either way (the SDK checks only the past), are refused
 * with 400, and so is a signed event without an id, a type or a data object.
 */
export function verifiedEvent(rawBody: unknown, signature: string | undefined): Stripe.Event {
  if (!Buffer.isBuffer(rawBody) || rawBody.length === 0) throw badRequest("Send the event as application/json.");
  if (!signature) throw badRequest("The Stripe-Signature header is missing.");
  const signedAt = Number(/(?:^|,)t=(\d+)/.exec(signature)?.[1]);
  if (Number.isFinite(signedAt) && signedAt - Date.now() / 1000 > SIGNATURE_TOLERANCE_SECONDS)
    throw badRequest("The webhook signature is dated in the future; check the sender's clock.");
  let event: Stripe.Event;
  try {
    event = stripe().webhooks.constructEvent(rawBody, signature, serviceSettings().stripe.webhookSecret, SIGNATURE_TOLERANCE_SECONDS);
  } catch (err) {
    throw badRequest(`The webhook signature does not verify: ${err instanceof Error ? err.message.split("\n")[0] : "unknown error"}`);
  }
  const e = event as unknown as { id?: unknown; type?: unknown; data?: { object?: unknown } };
  if (typeof e.id !== "string" || typeof e.type !== "string" || typeof e.data?.object !== "object" || e.data.object === null)
    throw badRequest("The event has no id, type or data object.");
  return event;
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
