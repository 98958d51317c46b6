/** Reading lots: lists, one lot in full, the readiness board and trends. */
import { literal, Op, QueryTypes, where, type WhereOptions } from "sequelize";
import { database } from "../../db/database.ts";
import { jsonColumn } from "../../db/json-column.ts";
import { afterCursor, orderBy, toPage, type SortKey } from "../../db/keyset.ts";
import type { Page } from "../../../shared/paging.ts";
import type { LotListQuery, ReadinessQuery, TrendQuery } from "../../../shared/lots/schemas.ts";
import {
  compareTransit,
  convert,
  displayDigits,
  displayValue,
  findParameter,
  formatReading,
  type GoverningBound,
  type MarketId,
  type Outcome,
  type Reading,
  type UnitId,
  type WineProfile,
} from "../../../shared/engine/index.ts";
import { isBulk, type AnalysisStage } from "../../../shared/lots/vocabulary.ts";
import type { AnalysisView, LotAuditView, LotDetail, LotSummary, ReadinessRow, TrendData } from "../../../shared/lots/views.ts";
import type { Stage } from "../../../shared/specs/vocabulary.ts";
import { Analysis } from "../../models/analysis.ts";
import { AnalysisResult } from "../../models/analysis-result.ts";
import { Lot } from "../../models/lot.ts";
import { AnalysisEvaluation } from "../../models/analysis-evaluation.ts";
import { Certificate } from "../../models/certificate.ts";
import { Deviation } from "../../models/deviation.ts";
import { SpecVersion } from "../../models/spec-version.ts";
import { contractFor, type ContractWithParties } from "../specs/spec-access.ts";
import { partyContracts } from "../specs/party-contracts.ts";
import { contractView, versionSummary } from "../specs/spec-view.ts";
import { lotFor } from "./lot-access.ts";
import { AuditOrder } from "../../models/audit-order.ts";
import { AuditOrderLot } from "../../models/audit-order-lot.ts";
import { Organisation } from "../../models/organisation.ts";
import { orderReference } from "../../../shared/audits/vocabulary.ts";
import { governingVersion, governingVersions } from "./governing.ts";
import { isFailing, judgeFor, transitValues } from "../../../shared/lots/judge.ts";
import { lotStatus, type StatusAnalysis } from "../../../shared/lots/lot-status.ts";
import { profileDiffers, wineProfile } from "../../../shared/specs/profile.ts";
import { can } from "../../../shared/auth/permissions.ts";
import type { Role } from "../../../shared/auth/roles.ts";

const parameterName = (p: string) => findParameter(p)?.name ?? p;

type LoadedAnalysis = Analysis & { results: AnalysisResult[]; evaluation: AnalysisEvaluation | null; certificates: Certificate[] };

/** What a lot's status rests on, for many lots at once: their analyses (oldest first) and deviations. */
async function statusInputs(ids: number[]) {
  const [analyses, deviations] = await Promise.all([
    Analysis.findAll({
      where: { lotId: ids },
      include: [{ model: AnalysisEvaluation, as: "evaluation", attributes: ["specVersionId", "verdicts"] }],
      attributes: ["id", "lotId", "stage", "sampleDate", "auditOrderId"],
      order: [
        ["sampleDate", "ASC"],
        ["id", "ASC"],
      ],
    }),
    Deviation.findAll({ where: { lotId: ids }, attributes: ["id", "lotId", "kind", "status", "parameters", "decision"] }),
  ]);
  // Grouped once, so a list of many lots does not scan every row per lot.
  const group = <T extends { lotId: number }>(rows: T[]) => {
    const by = new Map<number, T[]>();
    for (const r of rows) {
      const list = by.get(r.lotId);
      if (list) list.push(r);
      else by.set(r.lotId, [r]);
    }
    return by;
  };
  const analysesBy = group(analyses as (Analysis & StatusAnalysis)[]);
  const deviationsBy = group(deviations);
  return (lotId: number) => ({ analyses: analysesBy.get(lotId) ?? [], deviations: deviationsBy.get(lotId) ?? [] });
}

/** One lot's status, for a caller that has already checked who may see the lot (a deviation's record, for instance). */
export async function statusOfLot(lotId: number) {
  const { analyses, deviations } = (await statusInputs([lotId]))(lotId);
  return lotStatus(analyses, deviations, parameterName);
}

async function summaries(
  lots: Lot[],
  contracts: Map<number, ContractWithParties>,
  inputs?: Awaited<ReturnType<typeof statusInputs>>,
): Promise<LotSummary[]> {
  const inputsOf = inputs ?? (await statusInputs(lots.map((l) => l.id)));
  return lots.map((l) => {
    const c = contracts.get(l.contractId)!;
    const { analyses: mine, deviations: ofLot } = inputsOf(l.id);
    const last = mine.at(-1);
    return {
      id: l.id,
      contractId: l.contractId,
      contractReference: c.reference,
      wineName: c.wine.name,
      producerName: c.producer.name,
      vintage: l.vintage,
      lotCode: l.lotCode,
      volumeLitres: Number(l.volumeLitres),
      container: l.container,
      plannedDate: l.plannedDate,
      market: l.market as MarketId,
      labelledAlcoholPercentVol:
        l.labelledAlcoholPercentVol === null || l.labelledAlcoholPercentVol === undefined ? null : Number(l.labelledAlcoholPercentVol),
      latestStage: (last?.stage as AnalysisStage) ?? null,
      status: lotStatus(mine, ofLot, parameterName),
      decidedDeviations: ofLot.filter((d) => d.decision).map((d) => ({ id: d.id, outcome: d.decision!.outcome })),
    };
  });
}

const LOT_ORDER: SortKey[] = [
  { attribute: "vintage", direction: "DESC" },
  { attribute: "lotCode", direction: "ASC" },
  { attribute: "id", direction: "ASC" },
];

/** A page of the lots on the organisation's contracts, newest vintage first. */
export async function listLots(orgId: number, f: LotListQuery): Promise<Page<LotSummary>> {
  const contracts = await partyContracts(orgId);
  const byId = new Map(contracts.map((c) => [c.id, c]));
  const filter: WhereOptions<Lot> = {
    contractId: f.contract ? [f.contract].filter((id) => byId.has(id)) : [...byId.keys()],
    ...(f.q ? { lotCode: { [Op.like]: `%${f.q.replace(/[%_\\]/g, "")}%` } } : {}),
  };
  const [lots, total] = await Promise.all([
    Lot.findAll({ where: { [Op.and]: [filter, afterCursor(LOT_ORDER, f.cursor)] }, order: orderBy(LOT_ORDER), limit: f.limit + 1 }),
    Lot.count({ where: filter }),
  ]);
  return toPage(
    lots,
    f.limit,
    (l) => [l.vintage, l.lotCode, l.id],
    (page) => summaries(page, byId),
    total,
  );
}

function analysisView(a: LoadedAnalysis, versionNumbers: Map<number, number>, profileNow: WineProfile): AnalysisView {
  return {
    id: a.id,
    stage: a.stage,
    laboratoryName: a.laboratoryName,
    accreditation: a.accreditation,
    auditOrderId: a.auditOrderId ?? null,
    rejudgedFromId: a.rejudgedFromId ?? null,
    sampleDate: a.sampleDate,
    createdAt: a.createdAt.toISOString(),
    results: a.results.map((r) => ({
      parameter: r.parameter,
      rawText: r.rawText,
      reading: r.reading,
      unit: r.unit,
      uncertainty: r.uncertainty,
      method: r.method,
    })),
    evaluation: a.evaluation
      ? {
          specVersionId: a.evaluation.specVersionId,
          specVersion: a.evaluation.specVersionId
            ? { id: a.evaluation.specVersionId, number: versionNumbers.get(a.evaluation.specVersionId) ?? 0 }
            : null,
          engineVersion: a.evaluation.engineVersion,
          marketVersions: a.evaluation.marketVersions,
          worstOutcome: a.evaluation.worstOutcome as Outcome,
          verdicts: a.evaluation.verdicts,
          factsChanged: profileDiffers(a.evaluation.profile ?? null, profileNow),
        }
      : null,
    certificates: a.certificates.map((c) => ({
      id: c.id,
      originalName: c.originalName,
      mime: c.mime,
      sizeBytes: c.sizeBytes,
      sha256: c.sha256,
      createdAt: c.createdAt.toISOString(),
    })),
  };
}

export async function getLot(orgId: number, lotId: number, role: Role): Promise<LotDetail> {
  const { lot, contract, side } = await lotFor(orgId, lotId);
  const [analyses, deviations] = await Promise.all([
    Analysis.findAll({
      where: { lotId },
      // Results and certificates in their own queries: joined, every result row would carry a copy of the evaluation's verdicts.
      include: [
        { model: AnalysisResult, as: "results", separate: true, order: [["id", "ASC"]] },
        { model: AnalysisEvaluation, as: "evaluation" },
        { model: Certificate, as: "certificates", separate: true, order: [["id", "ASC"]] },
      ],
      order: [
        ["sampleDate", "ASC"],
        ["id", "ASC"],
      ],
    }) as Promise<LoadedAnalysis[]>,
    Deviation.findAll({ where: { lotId }, order: [["createdAt", "DESC"]] }),
  ]);
  // The status reads what the page has loaded anyway.
  const [summary] = await summaries([lot], new Map([[contract.id, contract]]), () => ({
    analyses: analyses as (LoadedAnalysis & StatusAnalysis)[],
    deviations,
  }));
  const judgedIds = [...new Set(analyses.map((a) => a.evaluation?.specVersionId).filter((id): id is number => !!id))];
  const profileNow = wineProfile(contract.wine, lot.vintage);
  const [governing, judgedBy, audits] = await Promise.all([
    governingVersion(contract.id, lot.vintage),
    SpecVersion.findAll({ where: { id: judgedIds }, attributes: ["id", "number"], raw: true }),
    lotAudits(lotId, side),
  ]);
  const versionNumbers = new Map(judgedBy.map((v) => [v.id, v.number]));
  const pre = [...analyses].reverse().find((a) => a.stage === "pre_shipment");
  const arrival = [...analyses].reverse().find((a) => a.stage === "on_arrival");
  return {
    ...summary!,
    side,
    canSubmit: side === "producer" && can(role, "lots.submit"),
    contract: contractView(contract),
    governing: governing ? { ...versionSummary(governing.version), requirements: governing.requirements } : null,
    analyses: analyses.map((a) => analysisView(a, versionNumbers, profileNow)),
    transit: isBulk(lot.container) && pre && arrival ? compareTransit(transitValues(pre.results), transitValues(arrival.results)) : null,
    deviations: deviations.map((d) => ({
      id: d.id,
      kind: d.kind,
      status: d.status,
      parameters: d.parameters,
      summary: d.summary,
      analysisId: d.analysisId,
      decision: d.decision ?? null,
      createdAt: d.createdAt.toISOString(),
    })),
    audits,
  };
}

/** Independent audits of the lot: the buyer sees them from payment on, the producer once results are in. */
export async function lotAudits(lotId: number, side: "buyer" | "producer"): Promise<LotAuditView[]> {
  const rows = (await AuditOrderLot.findAll({
    where: { lotId },
    include: [
      {
        model: AuditOrder,
        as: "order",
        where: side === "buyer" ? { paidAt: { [Op.ne]: null } } : { resultsSubmittedAt: { [Op.ne]: null } },
        include: [{ model: Organisation, as: "laboratory" }],
      },
    ],
    order: [["id", "DESC"]],
  })) as (AuditOrderLot & { order: AuditOrder & { laboratory: Organisation } })[];
  return rows.map((r) => ({
    orderId: r.auditOrderId,
    reference: orderReference(r.auditOrderId),
    laboratoryName: r.order.laboratory.name,
    status: r.order.status,
    reportReference: r.order.reportReference,
    resultsSubmittedAt: r.order.resultsSubmittedAt ? r.order.resultsSubmittedAt.toISOString() : null,
    analysisId: r.analysisId,
    comparisons: r.comparisons ?? [],
  }));
}

// `due_on` is the planned date, or 9999-12-31 for an undated lot, so undated lots sort last (a stored column with an index).
const UNDATED = "9999-12-31";
const DUE_ON = "`Lot`.`due_on`";
const DUE_ORDER: SortKey[] = [
  { attribute: "dueOn", sql: DUE_ON, direction: "ASC" },
  { attribute: "lotCode", direction: "ASC" },
  { attribute: "id", direction: "ASC" },
];

/** A page of the lots due within the horizon (soonest first, undated last), with what each required stage still lacks. */
export async function readiness(orgId: number, f: ReadinessQuery): Promise<Page<ReadinessRow>> {
  const contracts = await partyContracts(orgId);
  const byId = new Map(contracts.map((c) => [c.id, c]));
  const today = new Date().toISOString().slice(0, 10);
  const horizon = new Date(Date.now() + f.horizon * 86_400_000).toISOString().slice(0, 10);
  const filter: WhereOptions<Lot> = {
    contractId: [...byId.keys()],
    [Op.or]: [where(literal(DUE_ON), { [Op.between]: [today, horizon] }), where(literal(DUE_ON), UNDATED)],
  };
  const [lots, total] = await Promise.all([
    Lot.findAll({ where: { [Op.and]: [filter, afterCursor(DUE_ORDER, f.cursor)] }, order: orderBy(DUE_ORDER), limit: f.limit + 1 }),
    Lot.count({ where: filter }),
  ]);
  return toPage(
    lots,
    f.limit,
    (l) => [l.plannedDate ?? UNDATED, l.lotCode, l.id],
    (page) => readinessRows(page, byId),
    total,
  );
}

async function readinessRows(lots: Lot[], byId: Map<number, ContractWithParties>): Promise<ReadinessRow[]> {
  const ids = lots.map((l) => l.id);
  // The analyses and verdicts the status already reads serve the stages too; only the measured parameters are read besides.
  const [inputsOf, measuredRows] = await Promise.all([
    statusInputs(ids),
    database().query<{ analysisId: number; parameter: string }>(
      "SELECT r.analysis_id AS analysisId, r.parameter FROM analysis_results r JOIN analyses a ON a.id = r.analysis_id WHERE a.lot_id IN (:ids)",
      { replacements: { ids: ids.length ? ids : [0] }, type: QueryTypes.SELECT },
    ),
  ]);
  const measuredBy = new Map<number, string[]>();
  for (const m of measuredRows) {
    const list = measuredBy.get(m.analysisId);
    if (list) list.push(m.parameter);
    else measuredBy.set(m.analysisId, [m.parameter]);
  }
  const base = await summaries(lots, byId, inputsOf);
  const governing = await governingVersions(lots);
  const rows: ReadinessRow[] = [];
  for (const [i, lot] of lots.entries()) {
    const g = governing.get(`${lot.contractId}|${lot.vintage}`);
    const mine = inputsOf(lot.id).analyses;
    const stages = (g?.version.stages ?? []).map((stage: Stage) => {
      const atStage = mine.filter((a) => a.stage === stage || (stage === "pre_filling" && a.stage === "retest"));
      const measured = new Set(atStage.flatMap((a) => measuredBy.get(a.id) ?? []));
      const required = (g?.requirements ?? []).filter((r) => r.stages.includes(stage)).map((r) => r.parameter);
      const latest = atStage.at(-1)?.evaluation?.verdicts ?? [];
      return {
        stage,
        analysed: atStage.length > 0,
        missing: required.filter((p) => !measured.has(p)),
        failing: latest.filter((v) => isFailing(v.outcome)).map((v) => v.parameter),
      };
    });
    rows.push({ ...base[i]!, stages, hasAgreedSpec: g !== null });
  }
  return rows;
}

/** A trend draws at most this many points (the latest); the answer says when there were more. */
export const TREND_POINTS_MAX = 5000;

/**
 * One parameter across the contract's lots over its latest vintages, in the unit the governing spec
 * row uses (the parameter's canonical unit when no row names it), rounded to the parameter's precision.
 */
export async function trend(orgId: number, contractId: number, q: TrendQuery): Promise<TrendData> {
  const { contract } = await contractFor(orgId, contractId);
  const parameterId = q.parameter;
  const p = findParameter(parameterId)!;
  const vintages = await database().query<{ vintage: number; results: number }>(
    `SELECT l.vintage, COUNT(*) AS results
       FROM lots l JOIN analyses a ON a.lot_id = l.id JOIN analysis_results r ON r.analysis_id = a.id
      WHERE l.contract_id = :contractId AND r.parameter = :parameter
      GROUP BY l.vintage ORDER BY l.vintage DESC`,
    { replacements: { contractId, parameter: parameterId }, type: QueryTypes.SELECT },
  );
  const shown = vintages.slice(0, q.vintages).map((v) => Number(v.vintage));
  const rows = shown.length
    ? await database().query<{
        lotId: number;
        lotCode: string;
        vintage: number;
        stage: AnalysisStage;
        sampleDate: string;
        reading: string | Reading;
        unit: UnitId;
      }>(
        `SELECT l.id AS lotId, l.lot_code AS lotCode, l.vintage, a.stage, DATE_FORMAT(a.sample_date, '%Y-%m-%d') AS sampleDate, r.reading, r.unit
           FROM lots l JOIN analyses a ON a.lot_id = l.id JOIN analysis_results r ON r.analysis_id = a.id
          WHERE l.contract_id = :contractId AND l.vintage IN (:shown) AND r.parameter = :parameter
          ORDER BY a.sample_date DESC, l.lot_code DESC, a.id DESC
          LIMIT :cap`,
        { replacements: { contractId, shown, parameter: parameterId, cap: TREND_POINTS_MAX + 1 }, type: QueryTypes.SELECT },
      )
    : [];
  const latestVintage = shown[0] ?? 0;
  const governing = latestVintage ? await governingVersion(contract.id, latestVintage) : null;
  const row = governing?.requirements.find((r) => r.parameter === parameterId);
  const unit = (row?.unit ?? p.unit) as UnitId;
  // The limits drawn are the governing ones, buyer's and law's together, as the judge builds them.
  const built = row
    ? judgeFor({ wine: contract.wine, lot: { vintage: latestVintage, market: null }, requirements: [row] }).built.get(parameterId)
    : undefined;
  const bound = (b: GoverningBound | undefined) =>
    b
      ? { value: convert(b.value, built!.unit, unit), source: b.source.kind === "buyer" ? "buyer" : `law, ${b.source.limit.market}` }
      : null;
  const points = rows
    .slice(0, TREND_POINTS_MAX)
    .reverse()
    .map((r) => {
      const reading = jsonColumn<Reading>(r.reading);
      const value = reading.kind === "value" ? convert(reading.value, r.unit, unit) : null;
      const censored =
        reading.kind === "below" || reading.kind === "above"
          ? { ...reading, limit: reading.limit === null ? null : convert(reading.limit, r.unit, unit) }
          : reading;
      const text =
        value !== null ? displayValue(parameterId, value, unit) : formatReading(censored as Reading, displayDigits(parameterId, unit));
      return { lotId: r.lotId, lotCode: r.lotCode, vintage: r.vintage, stage: r.stage, sampleDate: r.sampleDate, value, text };
    });
  return {
    parameter: parameterId,
    unit,
    digits: displayDigits(parameterId, unit),
    lower: bound(built?.lower),
    upper: bound(built?.upper),
    points,
    truncated: rows.length > TREND_POINTS_MAX,
    vintages: vintages.map((v) => ({ vintage: Number(v.vintage), results: Number(v.results) })),
    vintagesShown: shown,
  };
}
