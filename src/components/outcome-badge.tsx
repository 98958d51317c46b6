import type { Outcome } from "../../shared/engine/index.ts";

const TONE: Record<Outcome, string> = {
  pass: "bg-verjus-50 text-verjus-700",
  "conditional pass": "bg-verjus-50 text-verjus-700 ring-1 ring-ochre-700/40",
  "conditional fail": "bg-alarm-50 text-alarm-700 ring-1 ring-ochre-700/40",
  fail: "bg-alarm-50 text-alarm-700",
  missing: "bg-ochre-50 text-ochre-700",
  "not required": "bg-line/50 text-ink-500",
  inconclusive: "bg-ochre-50 text-ochre-700",
};

export function OutcomeBadge({ outcome }: { outcome: Outcome }) {
  return (
    <span className={`inline-block whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-semibold ${TONE[outcome]}`}>{outcome}</span>
  );
}
