/** Shapes of the lots API's answers, shared by server and client. */
import type { DeviationKind } from "../deviations/vocabulary.ts";
import type {
  Citation,
  MarketId,
  Outcome,
  Reading,
  ReportedUncertainty,
  ResultComparison,
  TransitFinding,
  UnitId,
} from "../engine/index.ts";
import type { OrderStatus } from "../audits/vocabulary.ts";
import type { Severity, Stage } from "../specs/vocabulary.ts";
import type { ContractView, VersionSummary, RequirementView } from "../specs/views.ts";
import type { AnalysisStage, Container } from "./vocabulary.ts";
import type { LotStatus } from "./lot-status.ts";
import type { OutcomeCounts } from "./judge.ts";
import type { DeviationDecision, DeviationStatus } from "../deviations/vocabulary.ts";

export interface StoredBound {
  value: number;
  source: "buyer" | "law";
  market?: MarketId;
  citation?: Citation;
}

/** A verdict as stored with its analysis: enough to show and to reproduce it. */
export interface StoredVerdict {
  parameter: string;
  severity: Severity | null;
  outcome: Outcome;
  informativeOutcome?: Outcome;
  explanation: string;
  resultText: string | null;
  /** Canonical unit of value, bounds and uncertainty. */
  value: number | null;
  unit: UnitId;
  /** The unit of the spec row; resultText and explanation use it. */
  displayUnit: UnitId;
  decidingSide: "lower" | "upper" | null;
  lower: StoredBound | null;
  upper: StoredBound | null;
  uncertainty: { u: number; source: string; basis: string } | null;
  guardBand: number | null;
  conformanceProbability: number | null;
  ruleText: string;
  /** Every legal limit that applies to this parameter in the lot's market, governing or not. */
  legalLimits: { market: MarketId; side: "max" | "min"; value: number; citation: Citation; confirmed?: string }[];
}

export interface LotSummary {
  id: number;
  contractId: number;
  contractReference: string;
  wineName: string;
  producerName: string;
  vintage: number;
  lotCode: string;
  volumeLitres: number;
  container: Container;
  plannedDate: string | null;
  market: MarketId;
  /** The alcoholic strength the label states, % vol; null until the producer enters it. */
  labelledAlcoholPercentVol: number | null;
  latestStage: AnalysisStage | null;
  /** The one status of the lot, from `lotStatus`; every screen and document shows this. */
  status: LotStatus;
  /** Deviations decided or closed, with the buyer's outcome. */
  decidedDeviations: { id: number; outcome: DeviationDecision["outcome"] }[];
}

export interface ResultView {
  parameter: string;
  rawText: string;
  reading: Reading;
  unit: UnitId;
  uncertainty: ReportedUncertainty | null;
  method: string | null;
}

export interface CertificateView {
  id: number;
  originalName: string;
  mime: string;
  sizeBytes: number;
  sha256: string;
  createdAt: string;
}

export interface AnalysisView {
  id: number;
  stage: AnalysisStage;
  laboratoryName: string;
  accreditation: string | null;
  /** Set when an independent laboratory reported this analysis for a paid audit. */
  auditOrderId: number | null;
  /** Set on a re-judgement: the analysis whose results it judges again. */
  rejudgedFromId: number | null;
  sampleDate: string;
  createdAt: string;
  results: ResultView[];
  evaluation: {
    specVersionId: number | null;
    /** The version the analysis was judged against, by number, for people. */
    specVersion: { id: number; number: number } | null;
    engineVersion: string;
    marketVersions: Record<string, string>;
    worstOutcome: Outcome;
    verdicts: StoredVerdict[];
    /** The wine's facts for the law (or its usual sugar and alcohol) have changed since this verdict. */
    factsChanged: boolean;
  } | null;
  certificates: CertificateView[];
}

export interface DeviationSummary {
  id: number;
  kind: DeviationKind;
  status: DeviationStatus;
  parameters: string[];
  summary: string;
  analysisId: number | null;
  decision: DeviationDecision | null;
  createdAt: string;
}

export interface LotDetail extends LotSummary {
  side: "buyer" | "producer";
  canSubmit: boolean;
  contract: ContractView;
  governing: (VersionSummary & { requirements: RequirementView[] }) | null;
  analyses: AnalysisView[];
  transit: TransitFinding[] | null;
  deviations: DeviationSummary[];
  audits: LotAuditView[];
}

export interface LotAuditView {
  orderId: number;
  reference: string;
  laboratoryName: string;
  status: OrderStatus;
  reportReference: string | null;
  resultsSubmittedAt: string | null;
  analysisId: number | null;
  comparisons: ResultComparison[];
}

export interface ReadinessRow extends LotSummary {
  /** Stages the governing version requires, with what is still missing at each. */
  stages: { stage: Stage; analysed: boolean; missing: string[]; failing: string[] }[];
  hasAgreedSpec: boolean;
}

export interface TrendPoint {
  lotId: number;
  lotCode: string;
  vintage: number;
  stage: AnalysisStage;
  sampleDate: string;
  /** In the trend's unit; null for a censored result, which is then described in text. */
  value: number | null;
  text: string;
}

export interface TrendData {
  parameter: string;
  /** The governing spec row's unit (the canonical one when no row names the parameter); limits and values are in it. */
  unit: UnitId;
  /** Decimal places the parameter is shown to in that unit. */
  digits: number;
  /** The governing limits (the stricter of the buyer's and the law's), in `unit`, with where each comes from. */
  lower: { value: number; source: string } | null;
  upper: { value: number; source: string } | null;
  /** The points of the vintages shown, oldest first; at most TREND_POINTS_MAX (the latest), with `truncated` said. */
  points: TrendPoint[];
  truncated: boolean;
  /** Every vintage with results for the parameter, newest first, and how many; the latest `vintagesShown` are drawn. */
  vintages: { vintage: number; results: number }[];
  vintagesShown: number[];
}

/** What one submitted analysis stored: its verdicts counted by outcome, the failing parameters and any deviation opened. */
export interface SubmissionResult {
  analysisId: number;
  counts: OutcomeCounts;
  failing: string[];
  deviationIds: number[];
}

/** What one import batch stored, sample by sample. */
export interface ImportResult {
  analyses: number;
  lotsCreated: number;
  samples: { analysisId: number; lotCode: string; counts: OutcomeCounts }[];
  failing: { analysisId: number; lotCode: string; parameters: string[] }[];
  deviationIds: number[];
}
