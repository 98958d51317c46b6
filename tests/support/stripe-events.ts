/** Stripe events as Stripe shapes them, signed with the test secret the way Stripe signs them. */
import Stripe from "stripe";
import { randomUUID } from "node:crypto";

export const TEST_WEBHOOK_SECRET = "whsec_payments_test_secret_0123456789";

const id = (prefix: string) => `${prefix}_${randomUUID().replaceAll("-", "")}`;

export function succeededEvent(orderId: number, amount: number, pi = id("pi")) {
  return {
    id: id("evt"),
    object: "event",
    api_version: "2026-10-28.endive",
    created: Math.floor(Date.now() / 1000),
    type: "payment_intent.succeeded",
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    data: {
      object: {
        id: pi,
        object: "payment_intent",
        amount,
        amount_received: amount,
        currency: "eur",
        status: "succeeded",
        metadata: { auditOrderId: String(orderId) },
      },
    },
  };
}

export function signed(event: object, timestamp?: number, secret = TEST_WEBHOOK_SECRET) {
  const payload = JSON.stringify(event);
  return { payload, header: Stripe.webhooks.generateTestHeaderString({ payload, secret, ...(timestamp ? { timestamp } : {}) }) };
}
