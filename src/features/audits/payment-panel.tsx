/** The buyer's side of an order: the lines, what Stripe confirmed, and Pay / Refund / the invoice. */
import { useState } from "react";
import { ConfirmButton } from "../../components/ui/confirm-dialog.tsx";
import { invoiceUrl, useCheckout, useRefund } from "./api/audits.ts";
import { Card } from "../../components/ui/page.tsx";
import { Button } from "../../components/ui/button.tsx";
import { TextField } from "../../components/ui/field.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { errorMessage } from "../../lib/api-client.ts";
import { formatMoney } from "../../../shared/audits/vocabulary.ts";
import type { AuditOrderDetail } from "../../../shared/audits/views.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const KIND_LABELS = { payment: "Payment received", refund: "Refunded", failure: "Payment declined" } as const;

export function PaymentPanel({ orgId, order }: { orgId: number; order: AuditOrderDetail }) {
  const checkout = useCheckout(orgId, order.id);
  const refund = useRefund(orgId, order.id);
  const [reason, setReason] = useState("");
  const money = (c: number) => formatMoney(c, order.currency);
  const paid = order.paidCents >= order.amountCents;
  return (
    <Card title="Payment">
      <DataTable headings={["Parameter", "Price per lot", "Lots", "Amount"]} dense>
        {order.lines.map((l) => (
          <Row key={l.parameter}>
            <th scope="row" className="py-1 pr-3 font-normal">
              {l.name}
            </th>
            <Cell dense className="tabular-nums">
              {money(l.unitCents)}
            </Cell>
            <Cell dense className="tabular-nums">
              {l.lots}
            </Cell>
            <Cell dense className="tabular-nums">
              {money(l.totalCents)}
            </Cell>
          </Row>
        ))}
        <tr>
          <th scope="row" className="py-1 pr-3 text-left">
            Total
          </th>
          <Cell />
          <Cell />
          <Cell dense className="font-semibold tabular-nums">
            {money(order.amountCents)}
          </Cell>
        </tr>
      </DataTable>
      {order.payments.length > 0 && (
        <ul className="mt-3 flex flex-col gap-1 text-sm">
          {order.payments.map((p) => (
            <li key={`${p.kind}-${p.stripeRef}`}>
              <span className="font-semibold">{KIND_LABELS[p.kind]}</span> {p.kind !== "failure" && money(p.amountCents)} ·{" "}
              {p.at.slice(0, 16).replace("T", " ")} UTC
              {p.detail && <span className="text-ink-500"> · {p.detail}</span>}
              <span className="block text-xs text-ink-500">{p.stripeRef}</span>
            </li>
          ))}
        </ul>
      )}
      <div className="mt-4 flex flex-wrap items-end gap-3">
        {order.actions.pay && (
          <Button
            onClick={() => checkout.mutate(undefined, { onSuccess: ({ url }) => window.location.assign(url) })}
            disabled={checkout.isPending}
          >
            {order.status === "payment_failed" ? "Try the payment again" : `Pay ${money(order.amountCents)}`}
          </Button>
        )}
        <a className="font-semibold text-must-700 underline" href={invoiceUrl(orgId, order.id)}>
          Download the {paid ? "receipt" : "invoice"} (PDF)
        </a>
      </div>
      {checkout.isError && <Notice tone="error">{errorMessage(checkout.error)}</Notice>}
      {order.actions.refund && (
        <div className="mt-4 flex flex-wrap items-end gap-3 border-t border-line pt-4">
          <TextField
            label="Reason for a refund"
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            hint="Possible until the laboratory sends its results."
          />
          <ConfirmButton
            variant="danger"
            disabled={refund.isPending || reason.trim().length < 3}
            request={{
              title: `Refund ${money(order.paidCents - order.refundedCents)}?`,
              consequence: `The payment for ${order.reference} is returned to the card it came from and the laboratory stops work on the order. This cannot be undone; a new audit needs a new order.`,
              confirmLabel: "Refund the payment",
              tone: "danger",
              onConfirm: () => refund.mutate(reason),
            }}
          >
            Refund {money(order.paidCents - order.refundedCents)}
          </ConfirmButton>
        </div>
      )}
      {refund.isSuccess && <Notice tone="success">Refund requested; it shows here once the payment service confirms it.</Notice>}
      {refund.isError && <Notice tone="error">{errorMessage(refund.error)}</Notice>}
    </Card>
  );
}
