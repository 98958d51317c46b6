/**
 * What the buyer's finance staff watch: spend per producer and per month, what is unpaid, what came
 * back. Totals are summed by MariaDB over every order of the period, however many there are; the
 * list of unpaid orders is the newest page of them.
 */
import { Op, QueryTypes } from "sequelize";
import { database } from "../../db/database.ts";
import { pageOrders } from "./order-views.ts";
import { CURRENCY } from "../../../shared/audits/vocabulary.ts";
import type { FinanceDashboard } from "../../../shared/audits/views.ts";
import { PAGE_SIZE_MAX } from "../../../shared/paging.ts";

const OUTSTANDING = ["awaiting_payment", "payment_failed"];

export async function financeDashboard(buyerOrgId: number, f: { from?: string; to?: string } = {}): Promise<FinanceDashboard> {
  const from = f.from ? new Date(`${f.from}T00:00:00Z`) : null;
  const to = f.to ? new Date(new Date(`${f.to}T00:00:00Z`).getTime() + 86_400_000) : null;
  const period = `o.buyer_org_id = :buyerOrgId${from ? " AND o.created_at >= :from" : ""}${to ? " AND o.created_at < :to" : ""}`;
  const replacements = { buyerOrgId, from, to, outstanding: OUTSTANDING };
  const query = <T extends object>(sql: string) => database().query<T>(sql, { replacements, type: QueryTypes.SELECT });
  // Spend is what was paid, in the month it was paid: an unpaid order is outstanding, never spend.
  const [[totals], byProducer, byMonth, outstanding] = await Promise.all([
    query<Record<string, number | string | null>>(
      `SELECT COUNT(*) AS orders, SUM(o.paid_at IS NOT NULL) AS paidOrders, SUM(o.paid_cents) AS paidCents,
              SUM(IF(o.status IN (:outstanding), o.amount_cents, 0)) AS outstandingCents, SUM(o.refunded_cents) AS refundedCents
         FROM audit_orders o WHERE ${period}`,
    ),
    query<{ producerName: string; paidOrders: number; paidCents: number; refundedCents: number }>(
      `SELECT p.name AS producerName, COUNT(*) AS paidOrders, SUM(o.paid_cents) AS paidCents, SUM(o.refunded_cents) AS refundedCents
         FROM audit_orders o JOIN contracts c ON c.id = o.contract_id JOIN organisations p ON p.id = c.producer_org_id
        WHERE ${period} AND o.paid_at IS NOT NULL GROUP BY p.name ORDER BY paidCents DESC`,
    ),
    query<{ month: string; paidOrders: number; paidCents: number; refundedCents: number }>(
      `SELECT DATE_FORMAT(o.paid_at, '%Y-%m') AS month, COUNT(*) AS paidOrders, SUM(o.paid_cents) AS paidCents, SUM(o.refunded_cents) AS refundedCents
         FROM audit_orders o WHERE ${period} AND o.paid_at IS NOT NULL GROUP BY month ORDER BY month DESC`,
    ),
    pageOrders(
      {
        buyerOrgId,
        status: OUTSTANDING,
        ...(from || to ? { createdAt: { ...(from ? { [Op.gte]: from } : {}), ...(to ? { [Op.lt]: to } : {}) } } : {}),
      },
      PAGE_SIZE_MAX,
      undefined,
      () => true,
    ),
  ]);
  const n = (v: unknown) => Number(v ?? 0);
  const sums = <T extends Record<string, unknown>>(row: T, keys: (keyof T)[]) => ({
    ...row,
    ...Object.fromEntries(keys.map((k) => [k, n(row[k])])),
  });
  return {
    currency: CURRENCY,
    totals: {
      orders: n(totals!.orders),
      paidOrders: n(totals!.paidOrders),
      paidCents: n(totals!.paidCents),
      outstandingCents: n(totals!.outstandingCents),
      refundedCents: n(totals!.refundedCents),
    },
    byProducer: byProducer.map((r) => sums(r, ["paidOrders", "paidCents", "refundedCents"])),
    byMonth: byMonth.map((r) => sums(r, ["paidOrders", "paidCents", "refundedCents"])),
    outstanding: outstanding.items,
  };
}
