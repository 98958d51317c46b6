/**
 * Ordering and paying for independent audits. The buyer's finance staff choose lots, parameters and a
 * laboratory; the price comes from the laboratory's list; payment goes through a Stripe Checkout Session.
 * Nothing here marks an order paid: only a verified webhook event does (payments/webhook-service.ts).
 */
import { Op } from "sequelize";
import { AuditOrder } from "../../models/audit-order.ts";
import { AuditOrderLot } from "../../models/audit-order-lot.ts";
import { LabPrice } from "../../models/lab-price.ts";
import { Organisation } from "../../models/organisation.ts";
import { Lot } from "../../models/lot.ts";
import { inTransaction } from "../../db/database.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { idempotent } from "../idempotency.ts";
import { conflict, notFound, validationFailed } from "../../errors.ts";
import { contractFor } from "../specs/spec-access.ts";
import { serviceSettings } from "../../settings.ts";
import { paymentServiceError, stripe } from "../../integrations/payments/stripe-client.ts";
import { orderFor } from "./order-access.ts";
import { detailOf, pageOrders } from "./order-views.ts";
import { quoteAudit } from "../../../shared/audits/pricing.ts";
import { CURRENCY, orderReference, orderStatus, type OrderStatus } from "../../../shared/audits/vocabulary.ts";
import { findParameter } from "../../../shared/engine/index.ts";
import type { NewAuditOrder } from "../../../shared/audits/schemas.ts";
import type { SessionMembership, SessionUser } from "../session-service.ts";

export async function createOrder(buyerOrgId: number, user: SessionUser, input: NewAuditOrder) {
  const { idempotencyKey, ...body } = input;
  return idempotent(buyerOrgId, idempotencyKey, { audit: body }, async (t) => {
    const { contract, side } = await contractFor(buyerOrgId, body.contractId, t);
    if (side !== "buyer") throw notFound("The contract");
    const lots = await Lot.findAll({ where: { id: body.lotIds, contractId: contract.id }, transaction: t });
    if (lots.length !== body.lotIds.length)
      throw validationFailed([{ path: "lotIds", message: "Some of these lots are not under this contract." }]);
    const lab = await Organisation.findOne({ where: { id: body.laboratoryOrgId, kind: "laboratory" }, transaction: t });
    if (!lab) throw validationFailed([{ path: "laboratoryOrgId", message: "Choose one of the laboratories listed." }]);
    const prices = await LabPrice.findAll({ where: { organisationId: lab.id }, transaction: t });
    const quote = quoteAudit(prices, lots.length, body.parameters);
    if (quote.unpriced.length) {
      throw validationFailed([
        { path: "parameters", message: `${lab.name} does not offer ${quote.unpriced.map((p) => findParameter(p)?.name ?? p).join(", ")}.` },
      ]);
    }
    const facts = { amountCents: quote.totalCents, paidCents: 0, refundedCents: 0, lastFailureAt: null, resultsSubmittedAt: null };
    const order = await AuditOrder.create(
      {
        contractId: contract.id,
        buyerOrgId,
        producerOrgId: contract.producerOrgId,
        laboratoryOrgId: lab.id,
        orderedBy: user.id,
        stage: body.stage,
        parameters: body.parameters,
        lines: quote.lines,
        amountCents: quote.totalCents,
        currency: CURRENCY,
        note: body.note ?? null,
        status: orderStatus(facts),
      },
      { transaction: t },
    );
    await AuditOrderLot.bulkCreate(
      lots.map((l) => ({ auditOrderId: order.id, lotId: l.id })),
      { transaction: t },
    );
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: buyerOrgId,
      action: "audit_order.created",
      entityType: "audit_order",
      entityId: order.id,
      after: body,
      details: {
        reference: orderReference(order.id),
        laboratory: lab.name,
        lots: lots.map((l) => l.lotCode),
        amountCents: quote.totalCents,
      },
    });
    return { id: order.id, reference: orderReference(order.id), amountCents: quote.totalCents };
  });
}

export interface OrderFilters {
  status?: OrderStatus;
  from?: string;
  to?: string;
}

/** A page of the orders the organisation may see, newest first: the buyer's own, the laboratory's once paid, the producer's once reported. */
export async function listOrders(orgId: number, f: OrderFilters & { limit: number; cursor?: string }) {
  const created = {
    ...(f.from ? { [Op.gte]: new Date(`${f.from}T00:00:00Z`) } : {}),
    ...(f.to ? { [Op.lt]: new Date(new Date(`${f.to}T00:00:00Z`).getTime() + 86_400_000) } : {}),
  };
  const where = {
    [Op.or]: [
      { buyerOrgId: orgId },
      { laboratoryOrgId: orgId, paidAt: { [Op.ne]: null } },
      { producerOrgId: orgId, resultsSubmittedAt: { [Op.ne]: null } },
    ],
    ...(f.status ? { status: f.status } : {}),
    ...(f.from || f.to ? { createdAt: created } : {}),
  };
  return pageOrders(where, f.limit, f.cursor, (o) => o.buyerOrgId === orgId);
}

export async function getOrder(orgId: number, id: number, membership: SessionMembership) {
  const { side } = await orderFor(orgId, id);
  return detailOf(id, side, membership.role);
}

/**
 * The hosted payment page for an order. One Checkout Session per order: a second click, a retry or a
 * second tab gets the same session (the idempotency key is the order's), never a second charge.
 */
export async function startCheckout(buyerOrgId: number, id: number, user: SessionUser): Promise<{ url: string }> {
  const { order, side } = await orderFor(buyerOrgId, id);
  if (side !== "buyer") throw notFound("The audit order");
  if (order.status !== "awaiting_payment" && order.status !== "payment_failed")
    throw conflict(`This order is ${order.status.replace("_", " ")}; there is nothing to pay.`);
  const client = stripe();
  const appUrl = serviceSettings().appUrl;
  try {
    if (order.checkoutSessionId) {
      const existing = await client.checkout.sessions.retrieve(order.checkoutSessionId);
      if (existing.status === "open" && existing.url) return { url: existing.url };
      // Paid, but Stripe's event has not reached us yet: a second session would charge twice.
      if (existing.status === "complete")
        throw conflict("This order is already paid; the confirmation from the payment service is on its way.");
    }
    // After an expired session the key names the session it replaces, so concurrent retries still meet.
    const attempt = order.checkoutSessionId ? `${order.id}-after-${order.checkoutSessionId}` : String(order.id);
    const session = await client.checkout.sessions.create(
      {
        mode: "payment",
        line_items: order.lines.map((l) => ({
          quantity: l.lots,
          price_data: {
            currency: order.currency,
            unit_amount: l.unitCents,
            product_data: { name: `${l.name}, independent analysis per lot` },
          },
        })),
        success_url: `${appUrl}/audits/${order.id}?paid=1`,
        cancel_url: `${appUrl}/audits/${order.id}`,
        client_reference_id: String(order.id),
        customer_email: user.email,
        metadata: { auditOrderId: String(order.id) },
        payment_intent_data: { metadata: { auditOrderId: String(order.id) }, description: `Cellarpact audit ${orderReference(order.id)}` },
      },
      { idempotencyKey: `cellarpact-audit-order-${attempt}-checkout` },
    );
    await inTransaction(async (t) => {
      await AuditOrder.update(
        { checkoutSessionId: session.id, paymentIntentId: typeof session.payment_intent === "string" ? session.payment_intent : null },
        { where: { id: order.id }, transaction: t },
      );
      await recordTrail(t, {
        actorUserId: user.id,
        organisationId: buyerOrgId,
        action: "audit_order.checkout_started",
        entityType: "audit_order",
        entityId: order.id,
        details: { session: session.id, amountCents: session.amount_total },
      });
    });
    return { url: session.url! };
  } catch (err) {
    throw paymentServiceError(err);
  }
}

/** Asks Stripe for a full refund; the refund is recorded when Stripe's event confirms it. */
export async function requestRefund(buyerOrgId: number, id: number, user: SessionUser, reason: string) {
  const { order, side } = await orderFor(buyerOrgId, id);
  if (side !== "buyer") throw notFound("The audit order");
  if (order.status !== "paid" || !order.paymentIntentId) throw conflict("Only a paid order whose results are not in yet can be refunded.");
  try {
    const refund = await stripe().refunds.create(
      { payment_intent: order.paymentIntentId, reason: "requested_by_customer", metadata: { auditOrderId: String(order.id) } },
      { idempotencyKey: `cellarpact-audit-order-${order.id}-refund` },
    );
    await inTransaction((t) =>
      recordTrail(t, {
        actorUserId: user.id,
        organisationId: buyerOrgId,
        action: "audit_order.refund_requested",
        entityType: "audit_order",
        entityId: order.id,
        details: { refund: refund.id, amountCents: refund.amount, reason },
      }),
    );
    return { refundId: refund.id, amountCents: refund.amount };
  } catch (err) {
    throw paymentServiceError(err);
  }
}
