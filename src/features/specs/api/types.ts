import type { DecisionRule, MarketId, ParameterDiff, Reading, ReportedUncertainty } from "../../../../shared/engine/index.ts";
import type { Severity, SpecStatus, Stage } from "../../../../shared/specs/vocabulary.ts";

export interface ContractSummary {
  id: number;
  reference: string;
  startsOn: string;
  endsOn: string | null;
  retailer: { id: number; name: string };
  producer: { id: number; name: string };
  wine: {
    id: number;
    name: string;
    colour: "red" | "white" | "rose";
    category: "still" | "sparkling" | "quality-sparkling" | "semi-sparkling" | "liqueur";
    region: string;
    markets: MarketId[];
    nominalSugarGPerL: number | null;
    nominalAlcoholPercentVol: number | null;
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

export interface SpecListItem extends VersionSummary {
  requirementCount: number;
  contract: ContractSummary;
}

export interface ContractDetail extends ContractSummary {
  side: "buyer" | "producer";
  canCreateVersion: boolean;
  versions: VersionSummary[];
}

export interface ContractWithVersions extends ContractSummary {
  versions: VersionSummary[];
}

export interface Requirement {
  id: number;
  parameter: string;
  unit: string;
  lower: number | null;
  upper: number | null;
  target: number | null;
  method: string | null;
  rule: DecisionRule;
  severity: Severity;
  stages: Stage[];
}

export interface SpecComment {
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
  contract: ContractSummary;
  requirements: Requirement[];
  comments: SpecComment[];
  otherVersions: { id: number; number: number; status: SpecStatus }[];
  actions: { edit: boolean; send: boolean; withdraw: boolean; decide: boolean; comment: boolean; newVersion: boolean };
}

export interface SpecDiff {
  from: VersionSummary;
  to: VersionSummary;
  parameters: ParameterDiff[];
}

export interface PastResultRow {
  lotId: string;
  lotCode: string;
  vintage: number;
  stage: string;
  sampleDate: string;
  parameter: string;
  reading: Reading;
  unit: string;
  uncertainty: ReportedUncertainty | null;
}
