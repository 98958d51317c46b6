/** What the audit endpoints return. */
import type { ResultComparison } from "../engine/index.ts";
import type { AnalysisStage } from "../lots/vocabulary.ts";
import type { StoredVerdict } from "../lots/views.ts";
import type { OrderStatus, PaymentKind } from "./vocabulary.ts";
import type { QuoteLine } from "./pricing.ts";

export interface LaboratoryOffer {
  id: number;
  name: string;
  items: { parameter: string; priceCents: number }[];
}

export interface AuditOrderSummary {
  id: number;
  reference: string;
  status: OrderStatus;
  contractId: number;
  wineName: string;
  buyerName: string;
  producerName: string;
  laboratoryName: string;
  lotCodes: string[];
  parameters: string[];
  amountCents: number;
  paidCents: number;
  refundedCents: number;
  currency: string;
  orderedBy: string;
  createdAt: string;
  paidAt: string | null;
  resultsSubmittedAt: string | null;
}

export interface PaymentView {
  kind: PaymentKind;
  amountCents: number;
  stripeRef: string;
  detail: string | null;
  at: string;
}

export interface AuditedLotView {
  lotId: number;
  lotCode: string;
  vintage: number;
  analysisId: number | null;
  declaredAnalysisId: number | null;
  comparisons: ResultComparison[];
  /** The laboratory's own results as judged against the spec: the values it sent. */
  verdicts: StoredVerdict[];
  /** The laboratory's signed reports for this lot. */
  reports: { id: number; originalName: string }[];
}

export interface AuditOrderDetail extends AuditOrderSummary {
  stage: AnalysisStage;
  note: string | null;
  lines: QuoteLine[];
  payments: PaymentView[];
  lots: AuditedLotView[];
  deviationIds: number[];
  reportReference: string | null;
  /** The unit each parameter is asked in: the governing spec row's, else the catalogue's. */
  units: Record<string, string>;
  /** What the caller may do now. */
  actions: { pay: boolean; refund: boolean; submitResults: boolean };
}

export interface FinanceDashboard {
  currency: string;
  /** orders: every order placed in the period; paidOrders: those paid. Spend counts paid orders only. */
  totals: { orders: number; paidOrders: number; paidCents: number; outstandingCents: number; refundedCents: number };
  byProducer: { producerName: string; paidOrders: number; paidCents: number; refundedCents: number }[];
  /** By the month each order was paid. */
  byMonth: { month: string; paidOrders: number; paidCents: number; refundedCents: number }[];
  outstanding: AuditOrderSummary[];
}
