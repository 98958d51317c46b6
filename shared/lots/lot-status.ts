/**
 * A lot's status, derived in one place from its analyses, the spec version each was judged
 * against and the decisions on its deviations. The lots list, the lot page, the readiness board,
 * the overview, the API and every PDF show what this returns, in these words.
 */
import type { Outcome } from "../engine/index.ts";
import type { DeviationCondition, DeviationDecision, DeviationKind, DeviationStatus } from "../deviations/vocabulary.ts";
import { isFailing, worstOf } from "./judge.ts";
import { specStageFor, type AnalysisStage } from "./vocabulary.ts";

export const LOT_STATUSES = [
  "awaiting_results",
  "incomplete",
  "conforms",
  "conforms_conditionally",
  "does_not_conform",
  "concession",
  "rejected",
] as const;
export type LotStatusCode = (typeof LOT_STATUSES)[number];

export const LOT_STATUS_LABELS: Record<LotStatusCode, string> = {
  awaiting_results: "Awaiting results",
  incomplete: "Results incomplete",
  conforms: "Conforms",
  conforms_conditionally: "Conforms with conditional results",
  does_not_conform: "Does not conform",
  concession: "Accepted under concession",
  rejected: "Rejected",
};

/** Statuses under which a certificate of conformity may be issued. */
export const CERTIFIABLE: readonly LotStatusCode[] = ["conforms", "conforms_conditionally", "concession"];

export interface StatusAnalysis {
  id: number;
  stage: AnalysisStage;
  auditOrderId: number | null;
  /** The evaluation as stored; specVersionId null means no agreed version governed it, so it was not judged. */
  evaluation: { specVersionId: number | null; verdicts: readonly { parameter: string; outcome: Outcome }[] } | null;
}

export interface StatusDeviation {
  id: number;
  kind: DeviationKind;
  status: DeviationStatus;
  parameters: readonly string[];
  decision: DeviationDecision | null;
}

export interface LotStatus {
  code: LotStatusCode;
  label: string;
  /** One sentence saying why, for screens and documents. */
  reason: string;
  /** Parameters outside their limits in the analyses that count, conceded or not. */
  failing: string[];
  /** The concession that accepts the lot, with its conditions, when the status is "concession". */
  concession: { deviationId: number; reason: string; conditions: DeviationCondition[] } | null;
  /** The deviation that rejected the lot, when the status is "rejected". */
  rejection: { deviationId: number; reason: string } | null;
  /** Deviations still open or in discussion. */
  openDeviations: number;
  /** The analyses the status rests on (oldest first). */
  analysisIds: number[];
  /** Spec versions those analyses were judged against. */
  judgedAgainst: number[];
}

const isDecided = (d: StatusDeviation) => (d.status === "decided" || d.status === "closed") && d.decision !== null;
/** Not yet decided: open, in discussion, or agreed between the parties but not yet recorded by the buyer. */
export const isOpenDeviation = (d: { status: DeviationStatus }) =>
  d.status === "open" || d.status === "in_discussion" || d.status === "agreed";

/**
 * The analyses a status rests on: the latest judged analysis of each spec stage (a re-test stands
 * in for pre-filling, since it is judged like it) and the latest independent audit. `analyses`
 * must be in the order they were taken (oldest first).
 */
export function countingAnalyses<A extends StatusAnalysis>(analyses: readonly A[]): A[] {
  const latest = new Map<string, A>();
  for (const a of analyses) {
    if (!a.evaluation || a.evaluation.specVersionId === null) continue;
    latest.set(a.auditOrderId !== null ? "audit" : specStageFor(a.stage), a);
  }
  return [...latest.values()];
}

function words(code: LotStatusCode, reason: string, rest: Omit<LotStatus, "code" | "label" | "reason">): LotStatus {
  return { code, label: LOT_STATUS_LABELS[code], reason, ...rest };
}

export function lotStatus(
  analyses: readonly StatusAnalysis[],
  deviations: readonly StatusDeviation[],
  names: (parameter: string) => string = (p) => p,
): LotStatus {
  const counting = countingAnalyses(analyses);
  const verdicts = counting.flatMap((a) => a.evaluation!.verdicts);
  const failing = [...new Set(verdicts.filter((v) => isFailing(v.outcome)).map((v) => v.parameter))];
  const base = {
    failing,
    concession: null,
    rejection: null,
    openDeviations: deviations.filter(isOpenDeviation).length,
    analysisIds: counting.map((a) => a.id),
    judgedAgainst: [...new Set(counting.map((a) => a.evaluation!.specVersionId!))],
  };
  const list = (ps: string[]) => ps.map(names).join(", ");

  const rejected = deviations.find((d) => isDecided(d) && d.decision!.outcome === "rejected");
  if (rejected)
    return words("rejected", `Rejected by the buyer's decision on deviation #${rejected.id}: ${rejected.decision!.reason}`, {
      ...base,
      rejection: { deviationId: rejected.id, reason: rejected.decision!.reason },
    });

  if (!verdicts.length || worstOf(verdicts.map((v) => v.outcome)) === "not required") {
    const unjudged = analyses.length > 0 && counting.length === 0;
    return words(
      "awaiting_results",
      unjudged
        ? "Results are stored, but no agreed specification covers this vintage, so none has been judged."
        : "No result has yet been judged against an agreed specification at a stage that requires it.",
      base,
    );
  }

  const concessions = deviations.filter((d) => isDecided(d) && d.decision!.outcome === "concession");
  const concededBy = (p: string) => concessions.find((d) => d.parameters.includes(p));
  const unconceded = verdicts.filter((v) => !(isFailing(v.outcome) && concededBy(v.parameter)));
  const worst = worstOf(unconceded.map((v) => v.outcome));

  if (isFailing(worst)) {
    const out = [...new Set(unconceded.filter((v) => isFailing(v.outcome)).map((v) => v.parameter))];
    return words("does_not_conform", `${list(out)} ${out.length > 1 ? "fall" : "falls"} outside the governing limits.`, base);
  }
  if (worst === "missing" || worst === "inconclusive") {
    const open = [...new Set(unconceded.filter((v) => v.outcome === worst).map((v) => v.parameter))];
    return words(
      "incomplete",
      worst === "missing"
        ? `Required results are missing: ${list(open)}.`
        : `Results cannot be decided against their limits: ${list(open)}.`,
      base,
    );
  }
  if (failing.length) {
    const d = concededBy(failing[0]!)!;
    const conditions = concessions.filter((c) => failing.some((p) => c.parameters.includes(p))).flatMap((c) => c.decision!.conditions);
    return words(
      "concession",
      `${list(failing)} outside the governing limits, accepted under concession on deviation #${d.id}: ${d.decision!.reason}`,
      { ...base, concession: { deviationId: d.id, reason: d.decision!.reason, conditions } },
    );
  }
  if (worst === "conditional pass") {
    const near = [...new Set(verdicts.filter((v) => v.outcome === "conditional pass").map((v) => v.parameter))];
    return words(
      "conforms_conditionally",
      `Every required result meets its limit; ${list(near)} ${near.length > 1 ? "lie" : "lies"} within the measurement uncertainty of a limit (ILAC-G8 conditional pass).`,
      base,
    );
  }
  return words("conforms", "Every required result meets its governing limit under the agreed decision rule.", base);
}
