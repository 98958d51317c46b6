import type { LotStatus, LotStatusCode } from "../../shared/lots/lot-status.ts";

const TONE: Record<LotStatusCode, string> = {
  awaiting_results: "bg-line/50 text-ink-700",
  incomplete: "bg-ochre-50 text-ochre-700",
  conforms: "bg-verjus-50 text-verjus-700",
  conforms_conditionally: "bg-verjus-50 text-verjus-700 ring-1 ring-ochre-700/40",
  does_not_conform: "bg-alarm-50 text-alarm-700",
  concession: "bg-ochre-50 text-ochre-700 ring-1 ring-verjus-700/40",
  rejected: "bg-alarm-50 text-alarm-700 ring-1 ring-alarm-700/60",
};

/** The lot's one status, in the words every screen and document uses; the reason is read out on hover and to screen readers. */
export function LotStatusBadge({ status, withReason = false }: { status: LotStatus; withReason?: boolean }) {
  return (
    <span className="inline-flex flex-col gap-0.5">
      <span
        data-lot-status={status.code}
        title={status.reason}
        className={`inline-block whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-semibold ${TONE[status.code]}`}
      >
        {status.label}
      </span>
      {withReason && <span className="text-xs text-ink-500">{status.reason}</span>}
    </span>
  );
}
