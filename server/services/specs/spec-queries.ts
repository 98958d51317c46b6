/** Reading spec sheets: lists with filters, one version in full, diffs, and past results for backtests. */
import { Op, QueryTypes, type WhereOptions } from "sequelize";
import type { Transaction } from "sequelize";
import { diffSpecs, type Reading, type ReportedUncertainty, type UnitId } from "../../../shared/engine/index.ts";
import type { PastResults, RequirementView, SpecListItem } from "../../../shared/specs/views.ts";
import { afterCursor, orderBy, sqlTime, toPage, type SortKey } from "../../db/keyset.ts";
import type { Page } from "../../../shared/paging.ts";
import type { BacktestQuery } from "../../../shared/specs/schemas.ts";
import { database } from "../../db/database.ts";
import { jsonColumn } from "../../db/json-column.ts";
import type { SpecStatus } from "../../../shared/specs/vocabulary.ts";
import { type Contract } from "../../models/contract.ts";
import { SpecVersion } from "../../models/spec-version.ts";
import { SpecRequirement } from "../../models/spec-requirement.ts";
import { SpecComment } from "../../models/spec-comment.ts";
import { User } from "../../models/user.ts";
import { Organisation } from "../../models/organisation.ts";
import { Lot } from "../../models/lot.ts";
import { contractFor, versionFor, sideOf } from "./spec-access.ts";
import { partyContracts } from "./party-contracts.ts";
import { actionsFor, contractView, requirementView, versionSummary } from "./spec-view.ts";
import { badRequest } from "../../errors.ts";
import { can } from "../../../shared/auth/permissions.ts";
import type { Role } from "../../../shared/auth/roles.ts";

export interface SpecListFilters {
  wine?: number;
  producer?: number;
  market?: string;
  status?: SpecStatus;
  q?: string;
}

// By column: Sequelize orders a timestamp attribute by its select alias, which no index serves.
const NEWEST_FIRST: SortKey[] = [
  { attribute: "updatedAt", sql: "`SpecVersion`.`updated_at`", direction: "DESC" },
  { attribute: "id", sql: "`SpecVersion`.`id`", direction: "DESC" },
];

/**
 * A page of the versions the organisation may see, newest change first, with contract and wine.
 * The contracts' filters (wine, producer, market, text) pick the contracts; status and paging are SQL
 * on the versions, and a producer never sees a draft.
 */
export async function listSpecs(orgId: number, f: SpecListFilters & { limit: number; cursor?: string }): Promise<Page<SpecListItem>> {
  const contracts = await partyContracts(orgId);
  const visible = contracts.filter(
    (c) =>
      (!f.wine || c.wineId === f.wine) &&
      (!f.producer || c.producerOrgId === f.producer) &&
      (!f.market || c.wine.markets.includes(f.market as never)) &&
      (!f.q || `${c.wine.name} ${c.reference} ${c.producer.name} ${c.wine.region}`.toLowerCase().includes(f.q.toLowerCase())),
  );
  if (!visible.length) return { items: [], nextCursor: null, total: 0 };
  const byId = new Map(visible.map((c) => [c.id, c]));
  const asBuyer = visible.filter((c) => sideOf(c as Contract, orgId) === "buyer").map((c) => c.id);
  const asProducer = visible.filter((c) => sideOf(c as Contract, orgId) === "producer").map((c) => c.id);
  const where: WhereOptions = {
    [Op.and]: [
      { [Op.or]: [{ contractId: asBuyer }, { contractId: asProducer, status: { [Op.ne]: "draft" } }] },
      f.status ? { status: f.status } : {},
    ],
  };
  const [versions, total] = await Promise.all([
    SpecVersion.findAll({
      where: { [Op.and]: [where, afterCursor(NEWEST_FIRST, f.cursor)] },
      order: orderBy(NEWEST_FIRST),
      limit: f.limit + 1,
      // Plain rows: the list only reads them into summaries.
      raw: true,
    }),
    SpecVersion.count({ where }),
  ]);
  return toPage(
    versions,
    f.limit,
    (v) => [sqlTime(v.updatedAt), v.id],
    async (shown) => {
      const counts = await SpecRequirement.count({ where: { specVersionId: shown.map((v) => v.id) }, group: ["specVersionId"] });
      const countOf = new Map(counts.map((c) => [Number(c.specVersionId), Number(c.count)]));
      return shown.map((v) => ({
        ...versionSummary(v),
        requirementCount: countOf.get(v.id) ?? 0,
        contract: contractView(byId.get(v.contractId)!),
      }));
    },
    total,
  );
}

/** Contracts of the organisation, with the versions it may see. */
export async function listContracts(orgId: number) {
  const contracts = await partyContracts(orgId);
  const versions = await SpecVersion.findAll({ where: { contractId: contracts.map((c) => c.id) }, order: [["number", "DESC"]] });
  return contracts.map((c) => ({
    ...contractView(c),
    versions: versions
      .filter((v) => v.contractId === c.id && !(sideOf(c, orgId) === "producer" && v.status === "draft"))
      .map(versionSummary),
  }));
}

export async function getContract(orgId: number, contractId: number, role: Role) {
  const { contract, side } = await contractFor(orgId, contractId);
  const versions = await SpecVersion.findAll({ where: { contractId }, order: [["number", "DESC"]] });
  return {
    ...contractView(contract),
    side,
    canCreateVersion: side === "buyer" && can(role, "specs.draft"),
    canAccept: side === "producer" && !contract.producerAcceptedAt && can(role, "contracts.accept"),
    versions: versions.filter((v) => !(side === "producer" && v.status === "draft")).map(versionSummary),
  };
}

export async function getVersion(orgId: number, specId: number, role: Role) {
  const { version, contract, side } = await versionFor(orgId, specId);
  const [requirements, comments] = await Promise.all([
    SpecRequirement.findAll({ where: { specVersionId: specId }, order: [["position", "ASC"]] }),
    SpecComment.findAll({
      where: { specVersionId: specId },
      include: [{ model: User, as: "author", attributes: ["id", "name"] }],
      order: [
        ["createdAt", "ASC"],
        ["id", "ASC"],
      ],
    }),
  ]);
  const orgNames = new Map(
    (await Organisation.findAll({ where: { id: [contract.retailerOrgId, contract.producerOrgId] } })).map((o) => [o.id, o.name]),
  );
  const siblings = await SpecVersion.findAll({
    where: { contractId: contract.id },
    attributes: ["id", "number", "status"],
    order: [["number", "ASC"]],
  });
  return {
    ...versionSummary(version),
    side,
    contract: contractView(contract),
    requirements: requirements.map(requirementView),
    comments: comments.map((c) => ({
      id: c.id,
      requirementId: c.requirementId,
      author: (c as SpecComment & { author: User }).author.name,
      organisation: orgNames.get(c.organisationId) ?? "",
      side: c.organisationId === contract.retailerOrgId ? "buyer" : "producer",
      body: c.body,
      createdAt: c.createdAt.toISOString(),
    })),
    otherVersions: siblings
      .filter((s) => s.id !== specId && !(side === "producer" && s.status === "draft"))
      .map((s) => ({ id: s.id, number: s.number, status: s.status })),
    actions: actionsFor(version, side, role),
  };
}

export async function requirementsOf(specId: number, t?: Transaction): Promise<RequirementView[]> {
  return (await SpecRequirement.findAll({ where: { specVersionId: specId }, order: [["position", "ASC"]], transaction: t })).map(
    requirementView,
  );
}

export async function diffVersions(orgId: number, specId: number, againstId: number) {
  const a = await versionFor(orgId, againstId);
  const b = await versionFor(orgId, specId);
  if (a.version.contractId !== b.version.contractId) throw badRequest("Both versions must belong to the same contract.");
  return {
    from: versionSummary(a.version),
    to: versionSummary(b.version),
    parameters: diffSpecs(await requirementsOf(againstId), await requirementsOf(specId)),
  };
}

/** A window's results past this many rows are left out, and the answer says so. */
export const BACKTEST_ROWS_MAX = 100_000;

/**
 * The contract's past results over a window (its last `lots` lots, only the named parameters), for a
 * backtest run in the browser by the engine. Two statements whatever the contract's size, and raw
 * rows: no model instance is built per result.
 */
export async function pastResults(orgId: number, contractId: number, q: BacktestQuery): Promise<PastResults> {
  await contractFor(orgId, contractId);
  const lots = await Lot.findAll({
    where: { contractId },
    attributes: ["id", "lotCode", "vintage"],
    order: [
      ["vintage", "DESC"],
      ["lotCode", "DESC"],
      ["id", "DESC"],
    ],
    limit: q.lots,
    raw: true,
  });
  if (!lots.length) return { rows: [], lots: 0, truncated: false };
  const byId = new Map(lots.map((l) => [l.id, l]));
  const results = await database().query<{
    lotId: number;
    stage: string;
    sampleDate: string;
    parameter: string;
    reading: string | Reading;
    unit: UnitId;
    uncertainty: string | ReportedUncertainty | null;
  }>(
    `SELECT a.lot_id AS lotId, a.stage, DATE_FORMAT(a.sample_date, '%Y-%m-%d') AS sampleDate, r.parameter, r.reading, r.unit, r.uncertainty
       FROM analyses a JOIN analysis_results r ON r.analysis_id = a.id
      WHERE a.lot_id IN (:lots) AND r.parameter IN (:parameters)
      ORDER BY a.lot_id DESC, a.sample_date, a.id, r.id
      LIMIT :cap`,
    { replacements: { lots: [...byId.keys()], parameters: q.parameters, cap: BACKTEST_ROWS_MAX + 1 }, type: QueryTypes.SELECT },
  );
  return {
    lots: lots.length,
    truncated: results.length > BACKTEST_ROWS_MAX,
    rows: results.slice(0, BACKTEST_ROWS_MAX).map((r) => {
      const lot = byId.get(r.lotId)!;
      return {
        lotId: String(lot.id),
        lotCode: lot.lotCode,
        vintage: lot.vintage,
        stage: r.stage,
        sampleDate: r.sampleDate,
        parameter: r.parameter,
        reading: jsonColumn<Reading>(r.reading),
        unit: r.unit,
        uncertainty: r.uncertainty === null ? null : jsonColumn<ReportedUncertainty>(r.uncertainty),
      };
    }),
  };
}
