/** Which audit orders an organisation may see, and as which party: the buyer who pays, the laboratory, or the producer. */
import type { Transaction } from "sequelize";
import { AuditOrder } from "../../models/audit-order.ts";
import { notFound } from "../../errors.ts";

export type OrderSide = "buyer" | "laboratory" | "producer";

export function orderSide(order: AuditOrder, orgId: number): OrderSide | null {
  if (order.buyerOrgId === orgId) return "buyer";
  // The laboratory sees an order only once it is paid: unpaid orders are not work yet.
  if (order.laboratoryOrgId === orgId && order.paidAt) return "laboratory";
  // The producer sees the audit of its lots once the independent results are in.
  if (order.producerOrgId === orgId && order.resultsSubmittedAt) return "producer";
  return null;
}

export async function orderFor(orgId: number, id: number, t?: Transaction, lock = false): Promise<{ order: AuditOrder; side: OrderSide }> {
  const order = await AuditOrder.findByPk(id, { transaction: t, lock: lock && t ? t.LOCK.UPDATE : undefined });
  const side = order ? orderSide(order, orgId) : null;
  if (!order || !side) throw notFound("The audit order");
  return { order, side };
}
