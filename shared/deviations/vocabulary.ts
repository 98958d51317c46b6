/** Words of the deviation workflow. */

/**
 * A deviation is open, then discussed; once one side accepts the other's proposal it is agreed and
 * waits for the buyer's recorded decision; then it is decided, then closed once its conditions are met.
 */
export const DEVIATION_STATUSES = ["open", "in_discussion", "agreed", "decided", "closed"] as const;
export type DeviationStatus = (typeof DEVIATION_STATUSES)[number];
export const DEVIATION_STATUS_LABELS: Record<DeviationStatus, string> = {
  open: "Open",
  in_discussion: "In discussion",
  agreed: "Proposal agreed, awaiting the decision",
  decided: "Decided",
  closed: "Closed",
};

/** What opened a deviation: a failing result, drift in transit, a person, or an independent audit that disagreed. */
export const DEVIATION_KINDS = ["result", "transit", "manual", "audit"] as const;
export type DeviationKind = (typeof DEVIATION_KINDS)[number];
export const DEVIATION_KIND_LABELS: Record<DeviationKind, string> = {
  result: "Result",
  transit: "Transit",
  manual: "Manual",
  audit: "Audit",
};

export const DEVIATION_OUTCOMES = ["concession", "rejected", "retest_passed", "spec_change"] as const;
export type DeviationOutcome = (typeof DEVIATION_OUTCOMES)[number];
export const DEVIATION_OUTCOME_LABELS: Record<DeviationOutcome, string> = {
  concession: "Concession for this lot",
  rejected: "Lot rejected",
  retest_passed: "Resolved by a passing re-test",
  spec_change: "Specification change proposed",
};

export const CONDITION_KINDS = ["retest", "treatment", "price_adjustment", "other"] as const;
export type ConditionKind = (typeof CONDITION_KINDS)[number];
export const CONDITION_LABELS: Record<ConditionKind, string> = {
  retest: "Re-test",
  treatment: "Treatment",
  price_adjustment: "Price adjustment",
  other: "Other condition",
};

export interface DeviationCondition {
  kind: ConditionKind;
  detail: string;
}

export interface DeviationProposal {
  outcome: DeviationOutcome;
  conditions: DeviationCondition[];
}

/** A proposal in words, with every condition: "Concession for this lot, on condition of: re-test: …". */
export function proposalText(p: DeviationProposal): string {
  const label = DEVIATION_OUTCOME_LABELS[p.outcome];
  return p.conditions.length
    ? `${label}, on condition of: ${p.conditions.map((c) => `${CONDITION_LABELS[c.kind].toLowerCase()}: ${c.detail}`).join("; ")}`
    : label;
}

export interface DeviationDecision extends DeviationProposal {
  reason: string;
  /** Draft spec version started when the outcome is a spec change. */
  specVersionId?: number;
}

export const MESSAGE_KINDS = ["comment", "proposal", "acceptance", "decision"] as const;
export type MessageKind = (typeof MESSAGE_KINDS)[number];

/** A result quoted into a message, as it stood when quoted. */
export interface QuotedResult {
  analysisId: number;
  parameter: string;
  resultText: string | null;
  outcome: string;
}

export const NOTIFICATION_KINDS = ["deviation_opened", "comment", "mention", "decision", "deadline", "audit", "spec"] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];
export const NOTIFICATION_KIND_LABELS: Record<NotificationKind, string> = {
  deviation_opened: "A new deviation",
  comment: "A new comment",
  mention: "Someone mentions me",
  decision: "A decision",
  deadline: "A response deadline draws near",
  audit: "An independent audit is paid or its results arrive",
  spec: "A spec version is sent, agreed, sent back, or commented on",
};

/** Days each side has to respond before a deviation is marked overdue (common practice). */
export const RESPONSE_DAYS = 5;
