import type { WineLawFacts } from "./law-facts.ts";
/** Shapes of the spec-sheet API's answers, shared by the server that builds them and the client that reads them. */
import type { DecisionRule, MarketId, ParameterDiff, Reading, ReportedUncertainty, WineCategory, Colour, UnitId } from "../engine/index.ts";
import type { Severity, SpecStatus, Stage } from "./vocabulary.ts";

export interface RequirementView {
  id: number;
  parameter: string;
  unit: UnitId;
  lower: number | null;
  upper: number | null;
  target: number | null;
  method: string | null;
  rule: DecisionRule;
  severity: Severity;
  stages: Stage[];
}

export interface ContractView {
  id: number;
  reference: string;
  startsOn: string;
  endsOn: string | null;
  /** When the producer's admin accepted the contract; null while it waits for them. */
  producerAcceptedAt: string | null;
  retailer: { id: number; name: string };
  producer: { id: number; name: string };
  wine: {
    id: number;
    name: string;
    colour: Colour;
    category: WineCategory;
    region: string;
    markets: MarketId[];
    nominalSugarGPerL: number | null;
    nominalAlcoholPercentVol: number | null;
    lawFacts: WineLawFacts | null;
  };
}

export interface VersionSummary {
  id: number;
  number: number;
  status: SpecStatus;
  title: string | null;
  vintageFrom: number;
  vintageTo: number | null;
  stages: Stage[];
  lockVersion: number;
  basedOnVersionId: number | null;
  sentAt: string | null;
  decidedAt: string | null;
  updatedAt: string;
}

/** What the caller may do with a version, decided on the server and shown by the client. */
export interface VersionActions {
  edit: boolean;
  send: boolean;
  withdraw: boolean;
  decide: boolean;
  comment: boolean;
  newVersion: boolean;
}

export interface SpecListItem extends VersionSummary {
  requirementCount: number;
  contract: ContractView;
}

export interface ContractWithVersions extends ContractView {
  versions: VersionSummary[];
}

export interface ContractDetail extends ContractWithVersions {
  side: "buyer" | "producer";
  canCreateVersion: boolean;
  /** The producer's admin may accept the contract (it waits for them). */
  canAccept: boolean;
}

export interface SpecCommentView {
  id: number;
  requirementId: number | null;
  author: string;
  organisation: string;
  side: "buyer" | "producer";
  body: string;
  createdAt: string;
}

export interface SpecVersionDetail extends VersionSummary {
  side: "buyer" | "producer";
  contract: ContractView;
  requirements: RequirementView[];
  comments: SpecCommentView[];
  otherVersions: { id: number; number: number; status: SpecStatus }[];
  actions: VersionActions;
}

export interface SpecDiff {
  from: VersionSummary;
  to: VersionSummary;
  parameters: ParameterDiff[];
}

/** The past results a backtest reads: the window's rows, how many lots it covers, and whether the row cap cut it short. */
export interface PastResults {
  rows: PastResultRow[];
  lots: number;
  truncated: boolean;
}

export interface PastResultRow {
  lotId: string;
  lotCode: string;
  vintage: number;
  stage: string;
  sampleDate: string;
  parameter: string;
  reading: Reading;
  unit: UnitId;
  uncertainty: ReportedUncertainty | null;
}
