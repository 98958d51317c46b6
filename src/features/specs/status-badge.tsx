import { SPEC_STATUS_LABELS, type SpecStatus } from "../../../shared/specs/vocabulary.ts";

const TONE: Record<SpecStatus, string> = {
  draft: "bg-line/60 text-ink-700",
  with_producer: "bg-ochre-50 text-ochre-700",
  changes_requested: "bg-alarm-50 text-alarm-700",
  agreed: "bg-verjus-50 text-verjus-700",
  replaced: "bg-line/40 text-ink-500",
  withdrawn: "bg-line/40 text-ink-500 line-through",
};

export function StatusBadge({ status }: { status: SpecStatus }) {
  return (
    <span className={`inline-block rounded-full px-2 py-0.5 text-xs font-semibold ${TONE[status]}`}>{SPEC_STATUS_LABELS[status]}</span>
  );
}
