import { ORDER_STATUS_LABELS, type OrderStatus } from "../../../shared/audits/vocabulary.ts";

const TONE: Record<OrderStatus, string> = {
  awaiting_payment: "bg-ochre-50 text-ochre-700",
  payment_failed: "bg-alarm-50 text-alarm-700",
  paid: "bg-must-50 text-must-700",
  completed: "bg-verjus-50 text-verjus-700",
  refunded: "bg-line/50 text-ink-700",
};

export function OrderStatusBadge({ status }: { status: OrderStatus }) {
  return (
    <span className={`inline-block whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-semibold ${TONE[status]}`}>
      {ORDER_STATUS_LABELS[status]}
    </span>
  );
}
