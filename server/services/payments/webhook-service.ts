/**
 * Applies Stripe's webhook events to audit orders, each exactly once. Stripe delivers at least once and
 * in any order, so: the event id is claimed first (primary key; a concurrent duplicate waits on it and
 * then finds it taken); the order row is locked while the event applies; every payment, refund and
 * decline is stored once per Stripe object; and the order's status is derived from those facts.
 */
import { UniqueConstraintError, type Transaction } from "sequelize";
import type { TrailAction } from "../../../shared/trail/vocabulary.ts";
import { orderPath } from "../../../shared/paths.ts";
import type Stripe from "stripe";
import { AuditOrder } from "../../models/audit-order.ts";
import { AuditPayment } from "../../models/audit-payment.ts";
import { StripeEvent } from "../../models/stripe-event.ts";
import { Contract } from "../../models/contract.ts";
import { User } from "../../models/user.ts";
import { Organisation } from "../../models/organisation.ts";
import { inTransaction } from "../../db/database.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { enqueueMail } from "../../integrations/mail/outbox.ts";
import { notify, usersWithRoles } from "../notification-service.ts";
import { serviceSettings } from "../../settings.ts";
import { contractInclude, type ContractWithParties } from "../specs/spec-access.ts";
import { receiptMail, refundMail } from "../../integrations/mail/payment-templates.ts";
import { formatMoney, orderReference, orderStatus } from "../../../shared/audits/vocabulary.ts";
import { mismatchWith, type EventClaims } from "./event-checks.ts";

export interface AppliedEvent {
  duplicate: boolean;
  outcome: string;
}

const isDeadlock = (err: unknown) => /deadlock|lock wait timeout/i.test(err instanceof Error ? err.message : "");

export async function applyStripeEvent(event: Stripe.Event): Promise<AppliedEvent> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await inTransaction(async (t) => {
        const claim = await StripeEvent.create(
          { id: event.id, type: event.type, outcome: "applying", receivedAt: new Date() },
          { transaction: t },
        );
        const outcome = await apply(t, event);
        await claim.update({ outcome }, { transaction: t });
        return { duplicate: false, outcome };
      });
    } catch (err) {
      if (err instanceof UniqueConstraintError) return { duplicate: true, outcome: "already applied" };
      if (isDeadlock(err) && attempt < 5) continue;
      throw err;
    }
  }
}

type PaymentObject = { metadata?: Stripe.Metadata | null; payment_intent?: string | Stripe.PaymentIntent | null; id: string };

async function orderOf(t: Transaction, object: PaymentObject): Promise<AuditOrder | null> {
  const fromMetadata = Number(object.metadata?.auditOrderId);
  if (Number.isSafeInteger(fromMetadata) && fromMetadata > 0)
    return AuditOrder.findByPk(fromMetadata, { transaction: t, lock: t.LOCK.UPDATE });
  const pi = typeof object.payment_intent === "string" ? object.payment_intent : object.id.startsWith("pi_") ? object.id : null;
  return pi ? AuditOrder.findOne({ where: { paymentIntentId: pi }, transaction: t, lock: t.LOCK.UPDATE }) : null;
}

/** What a PaymentIntent event says of its order, for the cross-check. */
const intentClaims = (pi: Stripe.PaymentIntent, kind: EventClaims["kind"], amountCents: number): EventClaims => ({
  kind,
  metadataOrderId: pi.metadata?.auditOrderId,
  paymentIntentId: pi.id,
  currency: pi.currency,
  amountCents,
});

async function apply(t: Transaction, event: Stripe.Event): Promise<string> {
  switch (event.type) {
    case "checkout.session.completed": {
      const s = event.data.object;
      const order = await orderOf(t, s);
      if (!order) return "no matching order";
      if (s.payment_status !== "paid" || typeof s.payment_intent !== "string") return "session not paid";
      const why = mismatchWith(order, {
        kind: "payment",
        metadataOrderId: s.metadata?.auditOrderId,
        sessionId: s.id,
        paymentIntentId: s.payment_intent,
        currency: s.currency,
        amountCents: s.amount_total,
      });
      return why ? await refused(t, event, order, why) : recordPayment(t, order, s.payment_intent, s.amount_total!);
    }
    case "payment_intent.succeeded": {
      const pi = event.data.object;
      const order = await orderOf(t, pi);
      if (!order) return "no matching order";
      const why = mismatchWith(order, intentClaims(pi, "payment", pi.amount_received));
      return why ? await refused(t, event, order, why) : recordPayment(t, order, pi.id, pi.amount_received);
    }
    case "payment_intent.payment_failed": {
      const pi = event.data.object;
      const order = await orderOf(t, pi);
      if (!order) return "no matching order";
      const why = mismatchWith(order, intentClaims(pi, "failure", pi.amount));
      if (why) return await refused(t, event, order, why);
      const err = pi.last_payment_error;
      const ref = typeof err?.charge === "string" ? err.charge : event.id;
      return recordFailure(t, order, ref, pi.amount, [err?.message, err?.decline_code].filter(Boolean).join(" — ") || "payment failed");
    }
    case "charge.refunded": {
      const charge = event.data.object;
      const order = await orderOf(t, charge);
      if (!order) return "no matching order";
      const refunds = charge.refunds?.data ?? [];
      const outcomes = [];
      for (const r of refunds) {
        const why = mismatchWith(order, {
          kind: "refund",
          metadataOrderId: charge.metadata?.auditOrderId,
          paymentIntentId: typeof charge.payment_intent === "string" ? charge.payment_intent : null,
          currency: r.currency,
          amountCents: r.amount,
        });
        // A refund already recorded is a duplicate, not a mismatch: its amount is in refundedCents already.
        const known = await AuditPayment.findOne({ where: { kind: "refund", stripeRef: r.id }, transaction: t });
        outcomes.push(
          known ? "refund already recorded" : why ? await refused(t, event, order, why) : await recordRefund(t, order, r.id, r.amount),
        );
      }
      return outcomes.join(", ") || "no refund listed";
    }
    default:
      return "ignored";
  }
}

/** An event that does not fit its order changes nothing on it; the order's trail records what came and why it was refused. */
async function refused(t: Transaction, event: Stripe.Event, order: AuditOrder, why: string): Promise<string> {
  await audit(t, order, "payment.event_refused", { event: event.id, type: event.type, why });
  return "refused: does not fit the order";
}

async function claimPayment(
  t: Transaction,
  order: AuditOrder,
  kind: "payment" | "refund" | "failure",
  stripeRef: string,
  amountCents: number,
  detail: string | null,
) {
  const existing = await AuditPayment.findOne({ where: { kind, stripeRef }, transaction: t });
  if (existing) return null;
  return AuditPayment.create({ auditOrderId: order.id, kind, stripeRef, amountCents, detail }, { transaction: t });
}

async function saveFacts(
  t: Transaction,
  order: AuditOrder,
  changes: Partial<Pick<AuditOrder, "paidCents" | "refundedCents" | "paidAt" | "lastFailureAt" | "paymentIntentId">>,
) {
  const next = {
    amountCents: order.amountCents,
    paidCents: order.paidCents,
    refundedCents: order.refundedCents,
    lastFailureAt: order.lastFailureAt,
    resultsSubmittedAt: order.resultsSubmittedAt,
    ...changes,
  };
  await order.update({ ...changes, status: orderStatus(next) }, { transaction: t });
}

async function mailFacts(t: Transaction, order: AuditOrder) {
  const contract = (await Contract.findByPk(order.contractId, { include: contractInclude, transaction: t })) as ContractWithParties;
  const orderer = (await User.findByPk(order.orderedBy, { transaction: t }))!;
  const lab = await Organisation.findByPk(order.laboratoryOrgId, { transaction: t });
  const appUrl = serviceSettings().appUrl;
  return {
    contract,
    facts: {
      to: orderer.email,
      name: orderer.name,
      reference: orderReference(order.id),
      wine: contract.wine.name,
      laboratory: lab?.name ?? "the laboratory",
      currency: order.currency,
      link: `${appUrl}${orderPath(order.id)}`,
      pdfLink: `${appUrl}/api/orgs/${order.buyerOrgId}/audit-orders/${order.id}/invoice.pdf`,
    },
  };
}

const audit = (t: Transaction, order: AuditOrder, action: TrailAction, details: Record<string, unknown>) =>
  recordTrail(t, {
    actorUserId: null,
    organisationId: order.buyerOrgId,
    action,
    entityType: "audit_order",
    entityId: order.id,
    details: { reference: orderReference(order.id), ...details },
  });

async function recordPayment(t: Transaction, order: AuditOrder, paymentIntent: string, amountCents: number): Promise<string> {
  const row = await claimPayment(t, order, "payment", paymentIntent, amountCents, null);
  if (!row) return "payment already recorded";
  await saveFacts(t, order, {
    paidCents: order.paidCents + amountCents,
    paidAt: order.paidAt ?? new Date(),
    paymentIntentId: order.paymentIntentId ?? paymentIntent,
  });
  await audit(t, order, "payment.succeeded", { paymentIntent, amountCents, currency: order.currency });
  const { contract, facts } = await mailFacts(t, order);
  await enqueueMail(t, receiptMail({ ...facts, amountCents, paymentRef: paymentIntent }));
  const analysts = await usersWithRoles([order.laboratoryOrgId], ["lab_analyst"], t);
  await notify(t, analysts, {
    kind: "audit",
    title: `New paid audit ${orderReference(order.id)}: ${contract.wine.name}`,
    body: `${order.lines.map((l) => l.name).join(", ")} on ${order.lines[0]?.lots ?? 0} lot(s) for ${contract.retailer.name}.`,
    link: orderPath(order.id),
  });
  return "payment recorded";
}

async function recordFailure(t: Transaction, order: AuditOrder, ref: string, amountCents: number, detail: string): Promise<string> {
  const row = await claimPayment(t, order, "failure", ref, amountCents, detail.slice(0, 250));
  if (!row) return "failure already recorded";
  await saveFacts(t, order, { lastFailureAt: new Date() });
  await audit(t, order, "payment.failed", { ref, amountCents, detail });
  return "failure recorded";
}

async function recordRefund(t: Transaction, order: AuditOrder, refundId: string, amountCents: number): Promise<string> {
  const row = await claimPayment(t, order, "refund", refundId, amountCents, null);
  if (!row) return "refund already recorded";
  await saveFacts(t, order, { refundedCents: order.refundedCents + amountCents });
  await audit(t, order, "payment.refunded", { refund: refundId, amountCents, total: formatMoney(order.refundedCents, order.currency) });
  const { facts } = await mailFacts(t, order);
  await enqueueMail(t, refundMail({ ...facts, amountCents, paymentRef: refundId }));
  return "refund recorded";
}
