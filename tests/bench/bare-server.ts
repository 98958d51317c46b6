/**
 * The bench's floor: a bare Express 5 + mariadb server answering the lots, lot, readiness, deviations and specs pages with
 * the same JSON as Cellarpact, from hand-written SQL and the same pure status code in shared/. No
 * session, no ORM, no validation layer: what the answer costs at the least.
 */
import express from "express";
import * as mariadb from "mariadb";
import type { AddressInfo } from "node:net";
import type { Config } from "../../server/config.ts";
import { requirementView } from "../../server/services/specs/spec-view.ts";
import type { SpecRequirement } from "../../server/models/spec-requirement.ts";
import { compareTransit, findParameter, type WineProfile } from "../../shared/engine/index.ts";
import { lotStatus, type StatusAnalysis, type StatusDeviation } from "../../shared/lots/lot-status.ts";
import { isFailing, transitValues } from "../../shared/lots/judge.ts";
import { isBulk } from "../../shared/lots/vocabulary.ts";
import { profileDiffers, wineProfile, type WineFacts } from "../../shared/specs/profile.ts";
import { orderReference } from "../../shared/audits/vocabulary.ts";
import { READINESS_HORIZON_DEFAULT } from "../../shared/lots/schemas.ts";
import type { Outcome } from "../../shared/engine/index.ts";

interface LotRow {
  id: number;
  contract_id: number;
  vintage: number;
  lot_code: string;
  volume_litres: number;
  container: string;
  planned_date: string | null;
  market: string;
  labelled_alcohol_percent_vol: number | null;
}
interface DeviationRow {
  id: number;
  kind: string;
  status: string;
  parameters: string;
  summary: string;
  lot_id: number;
  lot_code: string;
  vintage: number;
  contract_id: number;
  respond_by: string | null;
  decision: string | null;
  created_at: string;
  updated_at: string;
}

const json = <T>(v: unknown): T => (typeof v === "string" ? (JSON.parse(v) as T) : (v as T));
const name = (p: string) => findParameter(p)?.name ?? p;

export async function startBareServer(config: Config) {
  const pool = mariadb.createPool({
    host: config.DB_HOST,
    port: config.DB_PORT,
    user: config.DB_USER,
    password: config.DB_PASSWORD,
    database: config.DB_NAME,
    connectionLimit: 5,
    dateStrings: true,
    bigIntAsNumber: true,
    decimalAsNumber: true,
  });
  const app = express();

  const contractsOf = async (orgId: number) => {
    const rows: { id: number; reference: string; wineName: string; producerName: string }[] = await pool.query(
      `SELECT c.id, c.reference, w.name AS wineName, p.name AS producerName
         FROM contracts c JOIN wines w ON w.id = c.wine_id JOIN organisations p ON p.id = c.producer_org_id
        WHERE c.retailer_org_id = ? OR c.producer_org_id = ?`,
      [orgId, orgId],
    );
    return new Map(rows.map((c) => [c.id, c]));
  };

  /** Contracts with wine and parties, as the spec and lot pages show them. */
  const contractRows = (where: string, values: unknown[]): Promise<Record<string, unknown>[]> =>
    pool.query(
      `SELECT c.id, c.reference, c.starts_on, c.ends_on, c.producer_accepted_at, c.retailer_org_id, r.name AS retailer_name, c.producer_org_id, p.name AS producer_name,
              w.id AS wine_id, w.name AS wine_name, w.colour, w.category, w.region, w.markets, w.nominal_sugar_g_per_l,
              w.nominal_alcohol_percent_vol, w.law_facts
         FROM contracts c JOIN wines w ON w.id = c.wine_id JOIN organisations r ON r.id = c.retailer_org_id
         JOIN organisations p ON p.id = c.producer_org_id
        WHERE ${where}`,
      values,
    );
  const contractView = (c: Record<string, unknown>) => ({
    id: c.id,
    reference: c.reference,
    startsOn: c.starts_on,
    endsOn: c.ends_on,
    producerAcceptedAt: iso(c.producer_accepted_at),
    retailer: { id: c.retailer_org_id, name: c.retailer_name },
    producer: { id: c.producer_org_id, name: c.producer_name },
    wine: {
      id: c.wine_id,
      name: c.wine_name,
      colour: c.colour,
      category: c.category,
      region: c.region,
      markets: json(c.markets),
      nominalSugarGPerL: c.nominal_sugar_g_per_l,
      nominalAlcoholPercentVol: c.nominal_alcohol_percent_vol,
      lawFacts: json(c.law_facts) ?? null,
    },
  });
  const iso = (v: unknown) => (v === null || v === undefined ? null : `${String(v).replace(" ", "T")}Z`);
  const versionView = (v: Record<string, unknown>) => ({
    id: v.id,
    number: v.number,
    status: v.status,
    title: v.title,
    vintageFrom: v.vintage_from,
    vintageTo: v.vintage_to,
    stages: json(v.stages),
    lockVersion: v.lock_version,
    basedOnVersionId: v.based_on_version_id,
    sentAt: iso(v.sent_at),
    decidedAt: iso(v.decided_at),
    updatedAt: iso(v.updated_at),
  });
  const VERSION_COLUMNS =
    "id, contract_id, number, status, title, vintage_from, vintage_to, stages, lock_version, based_on_version_id, sent_at, decided_at, updated_at";

  /** The lots list's rows for a page of lots, and each lot's analyses (the readiness board reads them too). */
  const lotItems = async (page: LotRow[], contracts: Awaited<ReturnType<typeof contractsOf>>) => {
    const lotIds = page.length ? page.map((l) => l.id) : [0];
    const [analyses, deviations] = await Promise.all([
      pool.query(
        `SELECT a.id, a.lot_id, a.stage, a.audit_order_id, e.spec_version_id, e.verdicts
           FROM analyses a LEFT JOIN analysis_evaluations e ON e.analysis_id = a.id
          WHERE a.lot_id IN (?) ORDER BY a.sample_date, a.id`,
        [lotIds],
      ),
      pool.query("SELECT id, lot_id, kind, status, parameters, decision FROM deviations WHERE lot_id IN (?)", [lotIds]),
    ]);
    const analysesOf = new Map<number, (StatusAnalysis & { stage: string })[]>();
    for (const a of analyses) {
      const list = analysesOf.get(a.lot_id) ?? [];
      list.push({
        id: a.id,
        stage: a.stage,
        auditOrderId: a.audit_order_id,
        evaluation: a.verdicts === null ? null : { specVersionId: a.spec_version_id, verdicts: json(a.verdicts) },
      });
      analysesOf.set(a.lot_id, list);
    }
    const deviationsOf = new Map<number, StatusDeviation[]>();
    for (const d of deviations) {
      const list = deviationsOf.get(d.lot_id) ?? [];
      list.push({ id: d.id, kind: d.kind, status: d.status, parameters: json(d.parameters), decision: json(d.decision) });
      deviationsOf.set(d.lot_id, list);
    }
    const items = page.map((l) => {
      const c = contracts.get(l.contract_id)!;
      const mine = analysesOf.get(l.id) ?? [];
      const ofLot = deviationsOf.get(l.id) ?? [];
      return {
        id: l.id,
        contractId: l.contract_id,
        contractReference: c.reference,
        wineName: c.wineName,
        producerName: c.producerName,
        vintage: l.vintage,
        lotCode: l.lot_code,
        volumeLitres: Number(l.volume_litres),
        container: l.container,
        plannedDate: l.planned_date,
        market: l.market,
        labelledAlcoholPercentVol: l.labelled_alcohol_percent_vol === null ? null : Number(l.labelled_alcohol_percent_vol),
        latestStage: mine.at(-1)?.stage ?? null,
        status: lotStatus(mine as StatusAnalysis[], ofLot, name),
        decidedDeviations: ofLot.filter((d) => d.decision).map((d) => ({ id: d.id, outcome: d.decision!.outcome })),
      };
    });
    return { items, analysesOf };
  };

  const LOT_COLUMNS = "id, contract_id, vintage, lot_code, volume_litres, container, planned_date, market, labelled_alcohol_percent_vol";

  app.get("/api/orgs/:orgId/lots", async (req, res) => {
    const limit = Number(req.query.limit ?? 50);
    const contracts = await contractsOf(Number(req.params.orgId));
    const ids = [...contracts.keys()];
    const [lots, [{ n }]] = await Promise.all([
      pool.query(`SELECT ${LOT_COLUMNS} FROM lots WHERE contract_id IN (?) ORDER BY vintage DESC, lot_code, id LIMIT ?`, [ids, limit + 1]),
      pool.query("SELECT COUNT(*) AS n FROM lots WHERE contract_id IN (?)", [ids]),
    ]);
    const page = (lots as LotRow[]).slice(0, limit);
    const { items } = await lotItems(page, contracts);
    const last = page.at(-1);
    res.json({
      items,
      nextCursor: lots.length > limit ? Buffer.from(JSON.stringify([last!.vintage, last!.lot_code, last!.id])).toString("base64url") : null,
      total: n,
    });
  });

  app.get("/api/orgs/:orgId/lots/:lotId", async (req, res) => {
    const orgId = Number(req.params.orgId);
    const lotId = Number(req.params.lotId);
    const [lot] = (await pool.query(`SELECT ${LOT_COLUMNS} FROM lots WHERE id = ?`, [lotId])) as LotRow[];
    const [c] = lot
      ? await contractRows("c.id = ? AND (c.retailer_org_id = ? OR c.producer_org_id = ?)", [lot.contract_id, orgId, orgId])
      : [];
    if (!lot || !c) return void res.status(404).end();
    const side = c.retailer_org_id === orgId ? "buyer" : "producer";
    const contracts = new Map([
      [
        lot.contract_id,
        { id: lot.contract_id, reference: c.reference as string, wineName: c.wine_name as string, producerName: c.producer_name as string },
      ],
    ]);
    const [{ items }, analyses, results, certificates, [governing], deviations, audits] = await Promise.all([
      lotItems([lot], contracts),
      pool.query(
        `SELECT a.id, a.stage, a.laboratory_name, a.accreditation, a.audit_order_id, a.rejudged_from_id, a.sample_date, a.created_at,
                e.spec_version_id, e.engine_version, e.market_versions, e.worst_outcome, e.verdicts, e.profile, e.analysis_id AS judged,
                v.number AS version_number
           FROM analyses a LEFT JOIN analysis_evaluations e ON e.analysis_id = a.id LEFT JOIN spec_versions v ON v.id = e.spec_version_id
          WHERE a.lot_id = ? ORDER BY a.sample_date, a.id`,
        [lotId],
      ),
      pool.query(
        `SELECT r.analysis_id, r.parameter, r.raw_text, r.reading, r.unit, r.uncertainty, r.method
           FROM analysis_results r JOIN analyses a ON a.id = r.analysis_id WHERE a.lot_id = ? ORDER BY r.id`,
        [lotId],
      ),
      pool.query(
        `SELECT f.id, f.analysis_id, f.original_name, f.mime, f.size_bytes, f.sha256, f.created_at
           FROM certificates f JOIN analyses a ON a.id = f.analysis_id WHERE a.lot_id = ? ORDER BY f.id`,
        [lotId],
      ),
      pool.query(
        `SELECT ${VERSION_COLUMNS} FROM spec_versions
          WHERE contract_id = ? AND status = 'agreed' AND vintage_from <= ? AND (vintage_to IS NULL OR vintage_to >= ?) ORDER BY number DESC LIMIT 1`,
        [lot.contract_id, lot.vintage, lot.vintage],
      ),
      pool.query(
        "SELECT id, kind, status, parameters, summary, analysis_id, decision, created_at FROM deviations WHERE lot_id = ? ORDER BY created_at DESC",
        [lotId],
      ),
      pool.query(
        `SELECT ol.audit_order_id, ol.analysis_id, ol.comparisons, o.status, o.report_reference, o.results_submitted_at, lab.name AS laboratory_name
           FROM audit_order_lots ol JOIN audit_orders o ON o.id = ol.audit_order_id JOIN organisations lab ON lab.id = o.laboratory_org_id
          WHERE ol.lot_id = ? AND ${side === "buyer" ? "o.paid_at" : "o.results_submitted_at"} IS NOT NULL ORDER BY ol.id DESC`,
        [lotId],
      ),
    ]);
    const requirements = governing
      ? await pool.query(
          "SELECT id, parameter, unit, lower, upper, target, method, rule, severity, stages FROM spec_requirements WHERE spec_version_id = ? ORDER BY position",
          [governing.id],
        )
      : [];
    const resultsOf = new Map<number, Record<string, unknown>[]>();
    for (const r of results) {
      const view = {
        parameter: r.parameter,
        rawText: r.raw_text,
        reading: json(r.reading),
        unit: r.unit,
        uncertainty: json(r.uncertainty),
        method: r.method,
      };
      resultsOf.set(r.analysis_id, [...(resultsOf.get(r.analysis_id) ?? []), view]);
    }
    const certificatesOf = new Map<number, Record<string, unknown>[]>();
    for (const f of certificates) {
      const view = {
        id: f.id,
        originalName: f.original_name,
        mime: f.mime,
        sizeBytes: f.size_bytes,
        sha256: f.sha256,
        createdAt: iso(f.created_at),
      };
      certificatesOf.set(f.analysis_id, [...(certificatesOf.get(f.analysis_id) ?? []), view]);
    }
    const wine = contractView(c).wine as unknown as WineFacts;
    const profileNow = wineProfile(wine, lot.vintage);
    const analysisViews = (analyses as Record<string, unknown>[]).map((a) => ({
      id: a.id,
      stage: a.stage,
      laboratoryName: a.laboratory_name,
      accreditation: a.accreditation,
      auditOrderId: a.audit_order_id ?? null,
      rejudgedFromId: a.rejudged_from_id ?? null,
      sampleDate: a.sample_date,
      createdAt: iso(a.created_at),
      results: resultsOf.get(a.id as number) ?? [],
      evaluation:
        a.judged === null
          ? null
          : {
              specVersionId: a.spec_version_id,
              specVersion: a.spec_version_id ? { id: a.spec_version_id, number: a.version_number ?? 0 } : null,
              engineVersion: a.engine_version,
              marketVersions: json(a.market_versions),
              worstOutcome: a.worst_outcome,
              verdicts: json(a.verdicts),
              factsChanged: profileDiffers(json<WineProfile | null>(a.profile) ?? null, profileNow),
            },
      certificates: certificatesOf.get(a.id as number) ?? [],
    }));
    const latest = (stage: string) => analysisViews.findLast((a) => a.stage === stage);
    const [pre, arrival] = [latest("pre_shipment"), latest("on_arrival")];
    type TransitRow = Parameters<typeof transitValues>[0][number];
    res.json({
      ...items[0]!,
      side,
      // The bench reads as the buyer; only a producer's quality staff may submit.
      canSubmit: false,
      contract: contractView(c),
      governing: governing
        ? {
            ...versionView(governing),
            // The columns bear the view's names; only the JSON ones need reading.
            requirements: requirements.map((r: Record<string, unknown>) =>
              requirementView({ ...r, rule: json(r.rule), stages: json(r.stages) } as unknown as SpecRequirement),
            ),
          }
        : null,
      analyses: analysisViews,
      transit:
        isBulk(lot.container as never) && pre && arrival
          ? compareTransit(transitValues(pre.results as unknown as TransitRow[]), transitValues(arrival.results as unknown as TransitRow[]))
          : null,
      deviations: deviations.map((d: Record<string, unknown>) => ({
        id: d.id,
        kind: d.kind,
        status: d.status,
        parameters: json(d.parameters),
        summary: d.summary,
        analysisId: d.analysis_id,
        decision: json(d.decision) ?? null,
        createdAt: iso(d.created_at),
      })),
      audits: audits.map((o: Record<string, unknown>) => ({
        orderId: o.audit_order_id,
        reference: orderReference(o.audit_order_id as number),
        laboratoryName: o.laboratory_name,
        status: o.status,
        reportReference: o.report_reference,
        resultsSubmittedAt: iso(o.results_submitted_at),
        analysisId: o.analysis_id,
        comparisons: json(o.comparisons) ?? [],
      })),
    });
  });

  app.get("/api/orgs/:orgId/readiness", async (req, res) => {
    const limit = Number(req.query.limit ?? 50);
    const horizonDays = Number(req.query.horizon ?? READINESS_HORIZON_DEFAULT);
    const contracts = await contractsOf(Number(req.params.orgId));
    const ids = [...contracts.keys()];
    const today = new Date().toISOString().slice(0, 10);
    const horizon = new Date(Date.now() + horizonDays * 86_400_000).toISOString().slice(0, 10);
    const within = "contract_id IN (?) AND (due_on BETWEEN ? AND ? OR due_on = '9999-12-31')";
    const [lots, [{ n }]] = await Promise.all([
      pool.query(`SELECT ${LOT_COLUMNS} FROM lots WHERE ${within} ORDER BY due_on, lot_code, id LIMIT ?`, [ids, today, horizon, limit + 1]),
      pool.query(`SELECT COUNT(*) AS n FROM lots WHERE ${within}`, [ids, today, horizon]),
    ]);
    const page = (lots as LotRow[]).slice(0, limit);
    const lotIds = page.length ? page.map((l) => l.id) : [0];
    const [{ items, analysesOf }, measuredRows, versions] = await Promise.all([
      lotItems(page, contracts),
      pool.query(
        "SELECT r.analysis_id, r.parameter FROM analysis_results r JOIN analyses a ON a.id = r.analysis_id WHERE a.lot_id IN (?)",
        [lotIds],
      ),
      pool.query(
        "SELECT id, contract_id, vintage_from, vintage_to, stages FROM spec_versions WHERE contract_id IN (?) AND status = 'agreed' ORDER BY number DESC",
        [ids],
      ),
    ]);
    const measuredBy = new Map<number, string[]>();
    for (const m of measuredRows) measuredBy.set(m.analysis_id, [...(measuredBy.get(m.analysis_id) ?? []), m.parameter]);
    const governingOf = (l: LotRow) =>
      (versions as { id: number; contract_id: number; vintage_from: number; vintage_to: number | null; stages: string }[]).find(
        (v) => v.contract_id === l.contract_id && v.vintage_from <= l.vintage && (v.vintage_to === null || v.vintage_to >= l.vintage),
      );
    const chosen = [
      ...new Set(
        page
          .map(governingOf)
          .filter((v) => v)
          .map((v) => v!.id),
      ),
    ];
    const requirements: { spec_version_id: number; parameter: string; stages: string }[] = chosen.length
      ? await pool.query(
          "SELECT spec_version_id, parameter, stages FROM spec_requirements WHERE spec_version_id IN (?) ORDER BY position",
          [chosen],
        )
      : [];
    const rows = page.map((l, i) => {
      const g = governingOf(l);
      const mine = analysesOf.get(l.id) ?? [];
      const stages = (g ? json<string[]>(g.stages) : []).map((stage) => {
        const atStage = mine.filter((a) => a.stage === stage || (stage === "pre_filling" && a.stage === "retest"));
        const measured = new Set(atStage.flatMap((a) => measuredBy.get(a.id) ?? []));
        const required = requirements
          .filter((r) => r.spec_version_id === g!.id && json<string[]>(r.stages).includes(stage))
          .map((r) => r.parameter);
        const latest = (atStage.at(-1)?.evaluation?.verdicts ?? []) as { parameter: string; outcome: Outcome }[];
        return {
          stage,
          analysed: atStage.length > 0,
          missing: required.filter((p) => !measured.has(p)),
          failing: latest.filter((v) => isFailing(v.outcome)).map((v) => v.parameter),
        };
      });
      return { ...items[i]!, stages, hasAgreedSpec: g !== undefined };
    });
    const last = page.at(-1);
    res.json({
      items: rows,
      nextCursor:
        lots.length > limit
          ? Buffer.from(JSON.stringify([last!.planned_date ?? "9999-12-31", last!.lot_code, last!.id])).toString("base64url")
          : null,
      total: n,
    });
  });

  app.get("/api/orgs/:orgId/deviations", async (req, res) => {
    const limit = Number(req.query.limit ?? 50);
    const contracts = await contractsOf(Number(req.params.orgId));
    const ids = [...contracts.keys()];
    const [rows, [{ n }]] = await Promise.all([
      pool.query(
        `SELECT d.id, d.kind, d.status, d.parameters, d.summary, d.lot_id, l.lot_code, l.vintage, d.contract_id, d.respond_by, d.decision,
                d.created_at, d.updated_at
           FROM deviations d JOIN lots l ON l.id = d.lot_id
          WHERE d.contract_id IN (?) ORDER BY d.created_at DESC, d.id DESC LIMIT ?`,
        [ids, limit + 1],
      ),
      pool.query("SELECT COUNT(*) AS n FROM deviations WHERE contract_id IN (?)", [ids]),
    ]);
    const page = (rows as DeviationRow[]).slice(0, limit);
    const items = (page as DeviationRow[]).map((d) => {
      const c = contracts.get(d.contract_id)!;
      const decision = json<{ outcome: string } | null>(d.decision);
      const open = !["decided", "closed"].includes(d.status);
      return {
        id: d.id,
        kind: d.kind,
        status: d.status,
        parameters: json(d.parameters),
        summary: d.summary,
        lotId: d.lot_id,
        lotCode: d.lot_code,
        vintage: d.vintage,
        contractId: c.id,
        contractReference: c.reference,
        wineName: c.wineName,
        producerName: c.producerName,
        respondBy: iso(d.respond_by),
        overdue: open && d.respond_by !== null && Date.parse(iso(d.respond_by)!) < Date.now(),
        outcome: decision?.outcome ?? null,
        createdAt: iso(d.created_at),
        updatedAt: iso(d.updated_at),
      };
    });
    const last = page.at(-1);
    res.json({
      items,
      nextCursor: rows.length > limit ? Buffer.from(JSON.stringify([last!.created_at, last!.id])).toString("base64url") : null,
      total: n,
    });
  });

  app.get("/api/orgs/:orgId/specs", async (req, res) => {
    const limit = Number(req.query.limit ?? 50);
    const orgId = Number(req.params.orgId);
    const contracts = await contractRows("c.retailer_org_id = ? OR c.producer_org_id = ?", [orgId, orgId]);
    const byId = new Map(contracts.map((c) => [c.id as number, c]));
    const asBuyer = contracts.filter((c) => c.retailer_org_id === orgId).map((c) => c.id);
    const asProducer = contracts.filter((c) => c.retailer_org_id !== orgId).map((c) => c.id);
    const visible = `(contract_id IN (?) OR (contract_id IN (?) AND status <> 'draft'))`;
    const [versions, [{ n }]] = await Promise.all([
      pool.query(`SELECT ${VERSION_COLUMNS} FROM spec_versions WHERE ${visible} ORDER BY updated_at DESC, id DESC LIMIT ?`, [
        asBuyer.length ? asBuyer : [0],
        asProducer.length ? asProducer : [0],
        limit + 1,
      ]),
      pool.query(`SELECT COUNT(*) AS n FROM spec_versions WHERE ${visible}`, [
        asBuyer.length ? asBuyer : [0],
        asProducer.length ? asProducer : [0],
      ]),
    ]);
    const page = (versions as Record<string, unknown>[]).slice(0, limit);
    const counts: { id: number; n: number }[] = page.length
      ? await pool.query(
          "SELECT spec_version_id AS id, COUNT(*) AS n FROM spec_requirements WHERE spec_version_id IN (?) GROUP BY spec_version_id",
          [page.map((v) => v.id)],
        )
      : [];
    const countOf = new Map(counts.map((c) => [c.id, c.n]));
    const items = page.map((v) => {
      const c = byId.get(v.contract_id as number)!;
      return {
        ...versionView(v),
        requirementCount: countOf.get(v.id as number) ?? 0,
        contract: contractView(c),
      };
    });
    const last = page.at(-1);
    res.json({
      items,
      nextCursor: versions.length > limit ? Buffer.from(JSON.stringify([last!.updated_at, last!.id])).toString("base64url") : null,
      total: n,
    });
  });

  const server = app.listen(0, "127.0.0.1");
  await new Promise((r) => server.once("listening", r));
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: async () => {
      server.close();
      await pool.end();
    },
  };
}
