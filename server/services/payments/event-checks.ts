/**
 * A signed event proves only that Stripe sent it, not that it belongs to the order it names. Before
 * an event moves money on an order, what it carries is checked against what Cellarpact created for
 * that order: the order named in its metadata, the Checkout Session or PaymentIntent, the currency,
 * and the amount (never negative, never more than the order is owed or was paid).
 */
import type { AuditOrder } from "../../models/audit-order.ts";

export interface EventClaims {
  /** The order id in the object's metadata, when it has one. */
  metadataOrderId?: string | null;
  sessionId?: string | null;
  paymentIntentId?: string | null;
  currency?: string | null;
  amountCents: number | null | undefined;
  kind: "payment" | "refund" | "failure";
}

/** Why this event does not fit this order, or null when it does. */
export function mismatchWith(
  order: Pick<AuditOrder, "id" | "checkoutSessionId" | "paymentIntentId" | "currency" | "amountCents" | "paidCents" | "refundedCents">,
  c: EventClaims,
): string | null {
  // Cellarpact opens a Checkout Session before any payment; an order that never had one cannot have been paid.
  if (c.kind === "payment" && !order.checkoutSessionId) return "no payment was ever started for the order";
  if (c.metadataOrderId != null && c.metadataOrderId !== "" && Number(c.metadataOrderId) !== order.id)
    return `it names order ${c.metadataOrderId}, not ${order.id}`;
  if (c.sessionId && order.checkoutSessionId && c.sessionId !== order.checkoutSessionId) return "its Checkout Session is not the order's";
  if (c.paymentIntentId && order.paymentIntentId && c.paymentIntentId !== order.paymentIntentId)
    return "its PaymentIntent is not the order's";
  if (!c.currency || c.currency.toLowerCase() !== order.currency.toLowerCase())
    return `its currency ${c.currency ?? "(none)"} is not the order's ${order.currency}`;
  const amount = c.amountCents;
  if (typeof amount !== "number" || !Number.isSafeInteger(amount) || amount < 0)
    return `its amount ${String(amount)} is not a whole, non-negative number of cents`;
  if (c.kind === "payment" && amount !== order.amountCents) return `it pays ${amount} cents, the order is for ${order.amountCents}`;
  // Stripe may deliver a refund before its payment, so a refund is held to what the order charges, not to what has arrived.
  if (c.kind === "refund" && (amount === 0 || order.refundedCents + amount > order.amountCents))
    return `a refund of ${amount} cents does not fit the ${order.amountCents - order.refundedCents} cents the order can still refund`;
  return null;
}
