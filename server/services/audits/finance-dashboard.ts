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
  // Spend is what was paid, in the month it was paid: an unpaid order is outstanding, never spend.
  const paid = orders.filter((o) => o.paidAt !== null);
  for (const o of paid) {
    const p = producers.get(o.contract.producer.name) ?? {
      producerName: o.contract.producer.name,
      paidOrders: 0,
      paidCents: 0,
      refundedCents: 0,
    };
    p.paidOrders += 1;
    p.paidCents += o.paidCents;
    p.refundedCents += o.refundedCents;
    producers.set(p.producerName, p);
    const month = o.paidAt!.toISOString().slice(0, 7);
    const m = months.get(month) ?? { month, paidOrders: 0, paidCents: 0, refundedCents: 0 };
    m.paidOrders += 1;
    m.paidCents += o.paidCents;
    m.refundedCents += o.refundedCents;
    months.set(month, m);
  }
  const outstanding = orders.filter((o) => o.status === "awaiting_payment" || o.status === "payment_failed");
  return {
    currency: CURRENCY,
    totals: {
      orders: orders.length,
      paidOrders: paid.length,
      paidCents: orders.reduce((s, o) => s + o.paidCents, 0),
      outstandingCents: outstanding.reduce((s, o) => s + o.amountCents, 0),
      refundedCents: orders.reduce((s, o) => s + o.refundedCents, 0),
    },
    byProducer: [...producers.values()].sort((a, b) => b.paidCents - a.paidCents),
    byMonth: [...months.values()].sort((a, b) => b.month.localeCompare(a.month)),
    outstanding: outstanding.map((o) => summaryOf(o, true)),
  };
}
