/** Registering lots and submitting analyses (one by form, many by CSV import), idempotently. */
import { Lot } from "../../models/lot.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { idempotent } from "../idempotency.ts";
import { conflict, notFound, validationFailed } from "../../errors.ts";
import { inTransaction } from "../../db/database.ts";
import type { AnalysisSubmission, ImportBatch, LotInput, LotUpdate } from "../../../shared/lots/schemas.ts";
import { contractFor, type ContractWithParties } from "../specs/spec-access.ts";
import type { MarketId } from "../../../shared/engine/index.ts";
import { lotFor } from "./lot-access.ts";
import { storeAnalyses, type StoredLot } from "./store-analyses.ts";
import { insertRows } from "../../db/bulk-insert.ts";
import { sqlTime } from "../../db/keyset.ts";
import type { SessionUser } from "../session-service.ts";

/** A lot goes only to a market its contract names: the spec and the law were agreed for those. */
function assertContractMarket(contract: ContractWithParties, market: string) {
  if (!contract.wine.markets.includes(market as MarketId)) {
    throw validationFailed([
      {
        path: "market",
        message: `Contract ${contract.reference} covers ${contract.wine.markets.join(", ")}; choose one of those markets.`,
      },
    ]);
  }
}

export async function registerLot(orgId: number, user: SessionUser, input: LotInput): Promise<{ id: number }> {
  return inTransaction(async (t) => {
    const { contract, side } = await contractFor(orgId, input.contractId, t);
    if (side !== "producer") throw notFound("The contract");
    assertContractMarket(contract, input.market);
    if (await Lot.findOne({ where: { contractId: contract.id, lotCode: input.lotCode }, transaction: t })) {
      throw validationFailed([{ path: "lotCode", message: `Lot ${input.lotCode} is already registered under this contract.` }]);
    }
    const lot = await Lot.create(
      {
        ...input,
        volumeLitres: String(input.volumeLitres),
        plannedDate: input.plannedDate ?? null,
        labelledAlcoholPercentVol: input.labelledAlcoholPercentVol == null ? null : String(input.labelledAlcoholPercentVol),
      },
      { transaction: t },
    );
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: orgId,
      action: "lot.registered",
      entityType: "lot",
      entityId: lot.id,
      after: input,
      details: { lotCode: input.lotCode, contractId: contract.id },
    });
    return { id: lot.id };
  });
}

export async function updateLot(orgId: number, lotId: number, user: SessionUser, input: LotUpdate): Promise<void> {
  await inTransaction(async (t) => {
    const { lot, contract, side } = await lotFor(orgId, lotId, t);
    if (side !== "producer") throw notFound("The lot");
    assertContractMarket(contract, input.market);
    const before = {
      volumeLitres: Number(lot.volumeLitres),
      container: lot.container,
      plannedDate: lot.plannedDate,
      market: lot.market,
      labelledAlcoholPercentVol: lot.labelledAlcoholPercentVol === null ? null : Number(lot.labelledAlcoholPercentVol),
    };
    await lot.update(
      {
        volumeLitres: String(input.volumeLitres),
        container: input.container,
        plannedDate: input.plannedDate ?? null,
        market: input.market,
        labelledAlcoholPercentVol: input.labelledAlcoholPercentVol == null ? null : String(input.labelledAlcoholPercentVol),
      },
      { transaction: t },
    );
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: orgId,
      action: "lot.updated",
      entityType: "lot",
      entityId: lot.id,
      before,
      after: input,
      details: { lotCode: lot.lotCode },
    });
  });
}

export async function submitAnalysis(orgId: number, lotId: number, user: SessionUser, input: AnalysisSubmission) {
  const { idempotencyKey, ...body } = input;
  return idempotent(orgId, idempotencyKey, { lotId, ...body }, async (t) => {
    const { lot, contract, side } = await lotFor(orgId, lotId, t);
    if (side !== "producer") throw notFound("The lot");
    const stored = await storeAnalyses(t, contract, user.id, body, [{ lot, sampleDate: body.sampleDate, results: body.results }]);
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: orgId,
      action: "analysis.submitted",
      entityType: "analysis",
      entityId: stored.analysisIds[0]!,
      after: body,
      details: {
        lotId,
        stage: body.stage,
        results: body.results.length,
        failing: stored.failing[0]?.parameters ?? [],
        deviations: stored.deviationIds,
      },
    });
    return {
      analysisId: stored.analysisIds[0]!,
      counts: stored.samples[0]!.counts,
      failing: stored.failing[0]?.parameters ?? [],
      deviationIds: stored.deviationIds,
    };
  });
}

/** A batch from the CSV import: unknown lot codes become lots when the row gives a vintage. */
export async function importAnalyses(orgId: number, contractId: number, user: SessionUser, batch: ImportBatch) {
  const { idempotencyKey, samples, market, ...header } = batch;
  const body = { contractId, ...batch, idempotencyKey: undefined };
  // A batch is thousands of results: it is hashed once, for the retry check and the trail alike.
  return idempotent(orgId, idempotencyKey, body, async (t, bodyDigest) => {
    const { contract, side } = await contractFor(orgId, contractId, t);
    if (side !== "producer") throw notFound("The contract");
    if (market) assertContractMarket(contract, market);
    const vintageOf = new Map<string, number | undefined>();
    for (const s of samples) if (!vintageOf.get(s.lotCode)) vintageOf.set(s.lotCode, s.vintage ?? undefined);
    const codes = [...vintageOf.keys()];
    const existing = new Map<string, StoredLot>(
      (
        await Lot.findAll({
          attributes: ["id", "vintage", "market", "lotCode", "container"],
          where: { contractId, lotCode: codes },
          raw: true,
          transaction: t,
        })
      ).map((l) => [l.lotCode, l]),
    );
    const missing = codes.filter((c) => !existing.has(c));
    const unknown = missing.filter((c) => !vintageOf.get(c));
    if (unknown.length) {
      throw validationFailed(
        unknown
          .slice(0, 20)
          .map((c) => ({ path: "samples", message: `Lot ${c} is not registered; add a vintage column so it can be created.` })),
      );
    }
    if (missing.length) {
      const lotMarket = market ?? contract.wine.markets[0]!;
      const now = sqlTime(new Date());
      // Created as the import finds them: no volume or date yet, bottles until the producer says otherwise.
      await insertRows(
        t,
        "lots",
        ["contract_id", "lot_code", "vintage", "volume_litres", "container", "planned_date", "market", "created_at", "updated_at"],
        missing.map((code) => [contractId, code, vintageOf.get(code)!, "0", "bottles", null, lotMarket, now, now]),
      );
      // Read back by the unique (contract, lot code) key: the ids are whatever the server gave.
      const created = await Lot.findAll({
        attributes: ["id", "vintage", "market", "lotCode", "container"],
        where: { contractId, lotCode: missing },
        raw: true,
        transaction: t,
      });
      for (const l of created) existing.set(l.lotCode, l);
    }
    for (const s of samples) {
      if (s.vintage && existing.get(s.lotCode)!.vintage !== s.vintage)
        throw conflict(`Lot ${s.lotCode} is registered as vintage ${existing.get(s.lotCode)!.vintage}, not ${s.vintage}.`);
    }
    const stored = await storeAnalyses(
      t,
      contract,
      user.id,
      header,
      samples.map((s) => ({ lot: existing.get(s.lotCode)!, sampleDate: s.sampleDate, results: s.results })),
    );
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: orgId,
      action: "analysis.imported",
      entityType: "contract",
      entityId: contractId,
      afterDigest: bodyDigest,
      details: {
        stage: header.stage,
        analyses: stored.analysisIds.length,
        lotsCreated: missing.length,
        failing: stored.failing.length,
        deviations: stored.deviationIds.length,
      },
    });
    return {
      analyses: stored.analysisIds.length,
      lotsCreated: missing.length,
      samples: stored.samples,
      failing: stored.failing,
      deviationIds: stored.deviationIds,
    };
  });
}
