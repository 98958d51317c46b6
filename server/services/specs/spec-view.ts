/** Plain objects the API returns for spec versions. */
import type { DecisionRule, MarketId, WineProfile } from "../../../shared/engine/index.ts";
import type { Severity, SpecStatus, Stage } from "../../../shared/specs/vocabulary.ts";
import type { SpecRequirement } from "../../models/spec-requirement.ts";
import type { SpecVersion } from "../../models/spec-version.ts";
import type { ContractWithParties, Side } from "./spec-access.ts";

export interface RequirementView {
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

export interface ContractView {
  id: number;
  reference: string;
  startsOn: string;
  endsOn: string | null;
  retailer: { id: number; name: string };
  producer: { id: number; name: string };
  wine: { id: number; name: string; colour: WineProfile["colour"]; category: WineProfile["category"]; region: string; markets: MarketId[]; nominalSugarGPerL: number | null; nominalAlcoholPercentVol: number | null };
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

export const requirementView = (r: SpecRequirement): RequirementView => ({
  id: r.id,
  parameter: r.parameter,
  unit: r.unit,
  lower: r.lower,
  upper: r.upper,
  target: r.target,
  method: r.method,
  rule: r.rule,
  severity: r.severity,
  stages: r.stages,
});

export const contractView = (c: ContractWithParties): ContractView => ({
  id: c.id,
  reference: c.reference,
  startsOn: c.startsOn,
  endsOn: c.endsOn,
  retailer: { id: c.retailer.id, name: c.retailer.name },
  producer: { id: c.producer.id, name: c.producer.name },
  wine: {
    id: c.wine.id,
    name: c.wine.name,
    colour: c.wine.colour,
    category: c.wine.category,
    region: c.wine.region,
    markets: c.wine.markets,
    nominalSugarGPerL: c.wine.nominalSugarGPerL,
    nominalAlcoholPercentVol: c.wine.nominalAlcoholPercentVol,
  },
});

export const versionSummary = (v: SpecVersion): VersionSummary => ({
  id: v.id,
  number: v.number,
  status: v.status,
  title: v.title,
  vintageFrom: v.vintageFrom,
  vintageTo: v.vintageTo,
  stages: v.stages,
  lockVersion: v.lockVersion,
  basedOnVersionId: v.basedOnVersionId,
  sentAt: v.sentAt ? v.sentAt.toISOString() : null,
  decidedAt: v.decidedAt ? v.decidedAt.toISOString() : null,
  updatedAt: v.updatedAt.toISOString(),
});

/** What the caller may do with a version, decided once on the server and shown by the client. */
export interface VersionActions {
  edit: boolean;
  send: boolean;
  withdraw: boolean;
  decide: boolean;
  comment: boolean;
  newVersion: boolean;
}

export function actionsFor(v: SpecVersion, side: Side, role: string): VersionActions {
  const buyerTech = side === "buyer" && role === "buyer_technologist";
  const producerQuality = side === "producer" && role === "producer_quality";
  return {
    edit: buyerTech && v.status === "draft",
    send: buyerTech && v.status === "draft",
    withdraw: buyerTech && ["with_producer", "changes_requested", "agreed"].includes(v.status),
    decide: producerQuality && v.status === "with_producer",
    comment: v.status !== "draft" && v.status !== "withdrawn" && (buyerTech || producerQuality),
    newVersion: buyerTech,
  };
}
