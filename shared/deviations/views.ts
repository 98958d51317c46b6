import type { DeviationDecision, DeviationKind, DeviationProposal, DeviationStatus, MessageKind, QuotedResult } from "./vocabulary.ts";
import type { StoredVerdict } from "../lots/views.ts";

export interface DeviationSummaryView {
  id: number;
  kind: DeviationKind;
  status: DeviationStatus;
  parameters: string[];
  summary: string;
  lotId: number;
  lotCode: string;
  vintage: number;
  contractId: number;
  contractReference: string;
  wineName: string;
  producerName: string;
  respondBy: string | null;
  overdue: boolean;
  /** The buyer's decided outcome, once decided. */
  outcome: DeviationDecision["outcome"] | null;
  createdAt: string;
  updatedAt: string;
}

export interface MessageView {
  id: number;
  parentId: number | null;
  kind: MessageKind;
  author: string;
  organisation: string;
  side: "buyer" | "producer" | "laboratory";
  body: string;
  proposal: DeviationProposal | null;
  quote: QuotedResult | null;
  mentions: string[];
  edits: { previousBody: string; editedAt: string }[];
  attachments: { id: number; originalName: string; sizeBytes: number; sha256: string }[];
  mine: boolean;
  createdAt: string;
  editedAt: string | null;
}

export interface DeviationDetail extends DeviationSummaryView {
  side: "buyer" | "producer" | "laboratory";
  /** The analysis that opened it, if any; its results can be quoted. */
  analysisId: number | null;
  /** The verdicts that opened it, when it came from an analysis. */
  verdicts: StoredVerdict[];
  decision: DeviationDecision | null;
  decidedAt: string | null;
  decidedBy: string | null;
  messages: MessageView[];
  participants: { handle: string; name: string; organisation: string }[];
  actions: { comment: boolean; propose: boolean; accept: boolean; decide: boolean; close: boolean };
}
