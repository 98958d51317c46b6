import type { RouteRegistry } from "../http/route-registry.ts";
import { PUBLIC } from "../http/access.ts";
import { verifiedEvent } from "../integrations/payments/stripe-client.ts";
import { applyStripeEvent } from "../services/payments/webhook-service.ts";

/** Mounted with express.raw in app.ts: the signature covers the exact bytes Stripe sent. */
export const STRIPE_WEBHOOK_PATH = "/api/webhooks/stripe";

export function registerPaymentWebhookRoutes(r: RouteRegistry): void {
  const routes = r.section("payments");
  routes.post(
    STRIPE_WEBHOOK_PATH,
    {
      summary: "Stripe's events (signed; each applied once, duplicates answered 200)",
      access: PUBLIC,
      consumes: "application/json",
      errors: { 400: "missing, wrong or stale (over 300 s) signature" },
    },
    async ({ req }) => {
      const event = verifiedEvent(req.body, req.get("stripe-signature"));
      return { received: true, ...(await applyStripeEvent(event)) };
    },
  );
}
