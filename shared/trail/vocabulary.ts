/**
 * Words for the trail, the tamper-evident record: every action the server records has a label here (recordTrail takes
 * only these, so the type-checker refuses an action without one), and the detail fields read as
 * words too. Screens, exports and PDFs print these, never the codes.
 */
import { formatMoney } from "../audits/vocabulary.ts";
import { findParameter } from "../engine/index.ts";
import { ANALYSIS_STAGE_LABELS, type AnalysisStage } from "../lots/vocabulary.ts";

const PARAMETER_FIELDS = new Set(["failing", "parameters"]);
const ID_LIST_FIELDS = new Set(["deviations", "deviationIds"]);

export const ACTION_LABELS = {
  "auth.sign_in": "Signed in",
  "auth.sign_in_failed": "Sign-in failed",
  "auth.sign_out": "Signed out",
  "auth.password_changed": "Password changed",
  "auth.password_reset": "Password reset",
  "auth.reset_requested": "Password reset requested",
  "user.profile_updated": "Profile updated",
  "organisation.created": "Organisation opened",
  "invitation.created": "Invitation sent",
  "invitation.accepted": "Invitation accepted",
  "invitation.revoked": "Invitation revoked",
  "membership.role_changed": "Role changed",
  "membership.removed": "Member removed",
  "contract.created": "Contract opened",
  "contract.accepted": "Contract accepted by the producer",
  "wine.law_facts_changed": "Wine's facts for the law changed",
  "spec.version_created": "Spec version started",
  "spec.draft_saved": "Spec draft saved",
  "spec.sent": "Spec sent to the producer",
  "spec.commented": "Spec row commented on",
  "spec.agreed": "Spec agreed",
  "spec.changes_requested": "Spec sent back for changes",
  "spec.replaced": "Spec replaced by a newer version",
  "spec.withdrawn": "Spec withdrawn",
  "lot.registered": "Lot registered",
  "lot.updated": "Lot corrected",
  "analysis.submitted": "Analysis submitted",
  "analysis.imported": "Analyses imported",
  "analysis.rejudged": "Analysis re-judged against the version in force",
  "certificate.uploaded": "Certificate attached",
  "deviation.opened": "Deviation opened",
  "deviation.commented": "Deviation comment",
  "deviation.proposed": "Outcome proposed",
  "deviation.accepted": "Proposal accepted",
  "deviation.message_edited": "Deviation message edited",
  "deviation.attachment_added": "Attachment added to a deviation",
  "deviation.decided": "Deviation decided",
  "deviation.closed": "Deviation closed",
  "audit_order.created": "Audit ordered",
  "audit_order.checkout_started": "Payment page opened",
  "audit_order.refund_requested": "Refund requested",
  "audit_order.results_submitted": "Laboratory results sent",
  "payment.succeeded": "Payment received",
  "payment.failed": "Payment declined",
  "payment.refunded": "Payment refunded",
  "payment.event_refused": "Payment event refused",
  "price_list.updated": "Price list updated",
} as const;

export type TrailAction = keyof typeof ACTION_LABELS;

export const actionLabel = (action: string) => (ACTION_LABELS as Record<string, string>)[action] ?? action;

/** The detail fields recorded with events, as words. */
export const FIELD_LABELS: Record<string, string> = {
  amountCents: "Amount",
  currency: "Currency",
  paymentIntent: "Payment reference",
  refund: "Refund reference",
  reason: "Reason",
  lotCode: "Lot",
  lotId: "Lot id",
  contractId: "Contract id",
  stage: "Stage",
  results: "Results",
  failing: "Failing",
  deviations: "Deviations opened",
  analyses: "Analyses",
  lotsCreated: "Lots registered",
  outcome: "Outcome",
  conditions: "Conditions",
  messageId: "Message",
  requirementId: "Spec row",
  from: "Started from",
  by: "Replaced by version id",
  role: "Role",
  email: "E-mail",
  sha256: "SHA-256",
  originalName: "File",
  sizeBytes: "Size (bytes)",
  parameters: "Parameters",
  lots: "Lots",
  reportReference: "Report",
  discrepancies: "Discrepancies",
  kind: "Kind",
  summary: "Summary",
  items: "Prices",
  rejudged: "Re-judged analysis",
  analysis: "New analysis",
  fromVersion: "First judged against version id",
  version: "Now judged against version",
};

/** "Amount: €45.00 · Lot: SB-25-11"; money fields in cents are shown as money. */
export function detailsText(details: Record<string, unknown> | null | undefined): string {
  if (!details) return "";
  const currency = typeof details.currency === "string" ? details.currency : "eur";
  return Object.entries(details)
    .filter(([k, v]) => v !== null && v !== undefined && k !== "currency")
    .map(([k, v]) => {
      const label =
        FIELD_LABELS[k] ??
        k
          .replace(/([a-z])([A-Z])/g, "$1 $2")
          .replace(/_/g, " ")
          .replace(/^./, (c) => c.toUpperCase());
      const list = (xs: unknown[]) =>
        xs
          .map((x) =>
            PARAMETER_FIELDS.has(k) && typeof x === "string" ? (findParameter(x)?.name ?? x) : ID_LIST_FIELDS.has(k) ? `#${x}` : String(x),
          )
          .join(", ") || "none";
      const value =
        k.endsWith("Cents") && typeof v === "number"
          ? formatMoney(v, currency)
          : k === "stage" && typeof v === "string" && v in ANALYSIS_STAGE_LABELS
            ? ANALYSIS_STAGE_LABELS[v as AnalysisStage]
            : Array.isArray(v)
              ? list(v)
              : typeof v === "object"
                ? JSON.stringify(v)
                : String(v);
      return `${label}: ${value}`;
    })
    .join(" · ");
}
