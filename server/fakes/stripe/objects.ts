/**
 * The fake's in-memory state and the Stripe objects it hands out, in Stripe's shapes
 * (https://docs.stripe.com/api): PaymentIntents, Checkout Sessions, Charges, Refunds and Events.
 */
import { randomBytes } from "node:crypto";

export const API_VERSION = "2026-10-28.endive";
type Metadata = Record<string, string>;

export const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString("hex")}`;
const now = () => Math.floor(Date.now() / 1000);

export interface PaymentError {
  type: "card_error";
  code: string;
  decline_code: string;
  message: string;
  charge?: string;
}

export interface PaymentIntent {
  id: string;
  object: "payment_intent";
  amount: number;
  amount_received: number;
  currency: string;
  status: "requires_payment_method" | "requires_confirmation" | "succeeded" | "canceled";
  metadata: Metadata;
  description: string | null;
  receipt_email: string | null;
  latest_charge: string | null;
  last_payment_error: PaymentError | null;
  payment_method: string | null;
  created: number;
  livemode: false;
}

export interface Refund {
  id: string;
  object: "refund";
  amount: number;
  charge: string;
  payment_intent: string;
  currency: string;
  reason: string | null;
  status: "succeeded";
  metadata: Metadata;
  created: number;
}

export interface Charge {
  id: string;
  object: "charge";
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  currency: string;
  paid: boolean;
  refunded: boolean;
  status: "succeeded" | "failed";
  payment_intent: string;
  metadata: Metadata;
  failure_code: string | null;
  failure_message: string | null;
  refunds: { object: "list"; data: Refund[]; has_more: false };
  created: number;
}

export interface CheckoutSession {
  id: string;
  object: "checkout.session";
  mode: "payment";
  status: "open" | "complete" | "expired";
  payment_status: "unpaid" | "paid";
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  metadata: Metadata;
  payment_intent: string;
  success_url: string;
  cancel_url: string | null;
  url: string | null;
  line_items_summary: { name: string; amount: number; quantity: number }[];
  created: number;
  livemode: false;
}

export interface StripeEventObject {
  id: string;
  object: "event";
  api_version: string;
  created: number;
  type: string;
  data: { object: unknown };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
}

/** Everything the fake remembers, in memory: a restart forgets it, as a test double should. */
export class FakeState {
  paymentIntents = new Map<string, PaymentIntent>();
  sessions = new Map<string, CheckoutSession>();
  charges: Charge[] = [];
  events: StripeEventObject[] = [];

  createPaymentIntent(p: {
    amount: number;
    currency: string;
    metadata: Metadata;
    description?: string | null;
    receiptEmail?: string | null;
  }): PaymentIntent {
    const pi: PaymentIntent = {
      id: newId("pi"),
      object: "payment_intent",
      amount: p.amount,
      amount_received: 0,
      currency: p.currency,
      status: "requires_payment_method",
      metadata: p.metadata,
      description: p.description ?? null,
      receipt_email: p.receiptEmail ?? null,
      latest_charge: null,
      last_payment_error: null,
      payment_method: null,
      created: now(),
      livemode: false,
    };
    this.paymentIntents.set(pi.id, pi);
    return pi;
  }

  charge(pi: PaymentIntent, failure: PaymentError | null): Charge {
    const c: Charge = {
      id: newId("ch"),
      object: "charge",
      amount: pi.amount,
      amount_captured: failure ? 0 : pi.amount,
      amount_refunded: 0,
      currency: pi.currency,
      paid: !failure,
      refunded: false,
      status: failure ? "failed" : "succeeded",
      payment_intent: pi.id,
      metadata: pi.metadata,
      failure_code: failure?.code ?? null,
      failure_message: failure?.message ?? null,
      refunds: { object: "list", data: [], has_more: false },
      created: now(),
    };
    this.charges.push(c);
    pi.latest_charge = c.id;
    return c;
  }

  refund(charge: Charge, amount: number, reason: string | null): Refund {
    const r: Refund = {
      id: newId("re"),
      object: "refund",
      amount,
      charge: charge.id,
      payment_intent: charge.payment_intent,
      currency: charge.currency,
      reason,
      status: "succeeded",
      metadata: charge.metadata,
      created: now(),
    };
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded >= charge.amount;
    charge.refunds.data.unshift(r);
    return r;
  }

  event(type: string, object: unknown, idempotencyKey: string | null = null): StripeEventObject {
    const e: StripeEventObject = {
      id: newId("evt"),
      object: "event",
      api_version: API_VERSION,
      created: now(),
      type,
      // A snapshot: later changes to the object do not rewrite events already sent.
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: idempotencyKey },
    };
    this.events.push(e);
    return e;
  }
}

/** Stripe's test payment methods and card numbers, and what each does (https://docs.stripe.com/testing). */
const DECLINES: Record<string, PaymentError> = {
  generic: { type: "card_error", code: "card_declined", decline_code: "generic_decline", message: "Your card was declined." },
  funds: { type: "card_error", code: "card_declined", decline_code: "insufficient_funds", message: "Your card has insufficient funds." },
};
export const TEST_PAYMENT_METHODS: Record<string, PaymentError | null> = {
  pm_card_visa: null,
  pm_card_mastercard: null,
  pm_card_chargeDeclined: DECLINES.generic!,
  pm_card_chargeDeclinedInsufficientFunds: DECLINES.funds!,
};
export const TEST_CARDS: Record<string, PaymentError | null> = {
  "4242424242424242": null,
  "5555555555554444": null,
  "4000000000000002": DECLINES.generic!,
  "4000000000009995": DECLINES.funds!,
};
