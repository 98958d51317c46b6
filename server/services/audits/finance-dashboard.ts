/** What the buyer's finance staff watch: spend per producer and per month, what is unpaid, what came back. */
import { loadOrders, summaryOf } from "./order-views.ts";
import { CURRENCY } from "../../../shared/audits/vocabulary.ts";
import type { FinanceDashboard } from "../../../shared/audits/views.ts";

export async function financeDashboard(buyerOrgId: number, f: { from?: string; to?: string } = {}): Promise<FinanceDashboard> {
  const from = f.from ? new Date(`${f.from}T00:00:00Z`).getTime() : -Infinity;
  const to = f.to ? new Date(`${f.to}T00:00:00Z`).getTime() + 86_400_000 : Infinity;
  const orders = (await loadOrders({ buyerOrgId })).filter((o) => o.createdAt.getTime() >= from && o.createdAt.getTime() < to);
  const producers = new Map<string, FinanceDashboard["byProducer"][number]>();
  const months = new Map<string, FinanceDashboard["byMonth"][number]>();
  for (const o of orders) {
    const p = producers.get(o.contract.producer.name) ?? { producerName: o.contract.producer.name, orders: 0, paidCents: 0, refundedCents: 0 };
    p.orders += 1;
    p.paidCents += o.paidCents;
    p.refundedCents += o.refundedCents;
    producers.set(p.producerName, p);
    // Spend counts in the month it was paid; unpaid orders in the month they were placed.
    const month = (o.paidAt ?? o.createdAt).toISOString().slice(0, 7);
    const m = months.get(month) ?? { month, orders: 0, paidCents: 0, refundedCents: 0 };
    m.orders += 1;
    m.paidCents += o.paidCents;
    m.refundedCents += o.refundedCents;
    months.set(month, m);
  }
  const outstanding = orders.filter((o) => o.status === "awaiting_payment" || o.status === "payment_failed");
  return {
    currency: CURRENCY,
    totals: {
      orders: orders.length,
      paidCents: orders.reduce((s, o) => s + o.paidCents, 0),
      outstandingCents: outstanding.reduce((s, o) => s + o.amountCents, 0),
      refundedCents: orders.reduce((s, o) => s + o.refundedCents, 0),
    },
    byProducer: [...producers.values()].sort((a, b) => b.paidCents - a.paidCents),
    byMonth: [...months.values()].sort((a, b) => b.month.localeCompare(a.month)),
    outstanding: outstanding.map((o) => summaryOf(o, true)),
  };
}
