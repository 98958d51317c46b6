/** Words of the paid compliance audit: an order to an independent laboratory, paid by the buyer. */

/** Where an order stands; derived from what has happened to it (see orderStatus). */
export const ORDER_STATUSES = ["awaiting_payment", "payment_failed", "paid", "completed", "refunded"] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];
export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  awaiting_payment: "Awaiting payment",
  payment_failed: "Payment declined",
  paid: "Paid, with the laboratory",
  completed: "Results in",
  refunded: "Refunded",
};

export interface OrderFacts {
  amountCents: number;
  paidCents: number;
  refundedCents: number;
  lastFailureAt: Date | string | null;
  resultsSubmittedAt: Date | string | null;
}

/**
 * The status follows from the facts, never from the order events arrived in: a refund recorded before
 * its payment (webhooks come in any order) still ends as "refunded", and a late decline never undoes a payment.
 */
export function orderStatus(f: OrderFacts): OrderStatus {
  if (f.refundedCents > 0 && f.refundedCents >= f.amountCents) return "refunded";
  if (f.resultsSubmittedAt) return "completed";
  if (f.paidCents >= f.amountCents) return "paid";
  if (f.lastFailureAt) return "payment_failed";
  return "awaiting_payment";
}

/** Money is kept in integer cents of one currency; the platform bills in euro. */
export const CURRENCY = "eur";

export function formatMoney(cents: number, currency = CURRENCY): string {
  return new Intl.NumberFormat("en-GB", { style: "currency", currency: currency.toUpperCase() }).format(cents / 100);
}

export const PAYMENT_KINDS = ["payment", "refund", "failure"] as const;
export type PaymentKind = (typeof PAYMENT_KINDS)[number];

export const orderReference = (id: number) => `AUD-${String(id).padStart(5, "0")}`;

/** "14", "14.5", "14,50" → 1450 cents; anything else (three decimals, signs, words) → null. */
export function parseMoney(text: string): number | null {
  const m = text.trim().match(/^(\d{1,6})(?:[.,](\d{1,2}))?$/);
  if (!m) return null;
  return Number(m[1]) * 100 + Number((m[2] ?? "").padEnd(2, "0"));
}
