import { renderInvoice } from "../../pdf/invoice-pdf.tsx";
import { notFound } from "../../errors.ts";
import { orderFor } from "./order-access.ts";
import { detailOf } from "./order-views.ts";
import type { Role } from "../../../shared/auth/roles.ts";

/** The invoice (unpaid) or receipt (paid) of an order, for the buyer who ordered it. */
export async function invoicePdf(buyerOrgId: number, id: number, role: Role) {
  const { side } = await orderFor(buyerOrgId, id);
  if (side !== "buyer") throw notFound("The audit order");
  const o = await detailOf(id, side, role);
  return { filename: `${o.paidCents >= o.amountCents ? "receipt" : "invoice"}-${o.reference}.pdf`, pdf: await renderInvoice(o) };
}
