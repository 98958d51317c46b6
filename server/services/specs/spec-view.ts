/** Plain objects the API returns for spec versions. */
import type { ContractView, RequirementView, VersionActions, VersionSummary } from "../../../shared/specs/views.ts";
import type { SpecRequirement } from "../../models/spec-requirement.ts";
import type { SpecVersion } from "../../models/spec-version.ts";
import type { ContractWithParties, Side } from "./spec-access.ts";
import { can } from "../../../shared/auth/permissions.ts";
import type { Role } from "../../../shared/auth/roles.ts";

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
  producerAcceptedAt: c.producerAcceptedAt ? new Date(c.producerAcceptedAt).toISOString() : null,
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
    lawFacts: c.wine.lawFacts ?? null,
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

export function actionsFor(v: SpecVersion, side: Side, role: Role): VersionActions {
  const buyerTech = side === "buyer" && can(role, "specs.draft");
  const producerQuality = side === "producer" && can(role, "specs.decide");
  return {
    edit: buyerTech && v.status === "draft",
    send: buyerTech && v.status === "draft",
    withdraw: buyerTech && ["with_producer", "changes_requested", "agreed"].includes(v.status),
    decide: producerQuality && v.status === "with_producer",
    comment: v.status !== "draft" && v.status !== "withdrawn" && can(role, "specs.comment"),
    newVersion: buyerTech,
  };
}
