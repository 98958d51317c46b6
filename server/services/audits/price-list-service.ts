/** Laboratories' price lists: each laboratory sets its own; buyers see every laboratory's when they order. */
import { LabPrice } from "../../models/lab-price.ts";
import { Organisation } from "../../models/organisation.ts";
import { inTransaction } from "../../db/database.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { forbidden } from "../../errors.ts";
import { CURRENCY } from "../../../shared/audits/vocabulary.ts";
import type { PriceListInput } from "../../../shared/audits/schemas.ts";
import type { LaboratoryOffer } from "../../../shared/audits/views.ts";
import type { SessionUser } from "../session-service.ts";

const itemsOf = (rows: LabPrice[]) =>
  rows.map((r) => ({ parameter: r.parameter, priceCents: r.priceCents })).sort((a, b) => a.parameter.localeCompare(b.parameter));

export async function listLaboratories(): Promise<LaboratoryOffer[]> {
  const labs = await Organisation.findAll({ where: { kind: "laboratory" }, order: [["name", "ASC"]] });
  const prices = await LabPrice.findAll({ where: { organisationId: labs.map((l) => l.id) } });
  return labs.map((l) => ({ id: l.id, name: l.name, items: itemsOf(prices.filter((p) => p.organisationId === l.id)) }));
}

export async function priceList(labOrgId: number) {
  return { currency: CURRENCY, items: itemsOf(await LabPrice.findAll({ where: { organisationId: labOrgId } })) };
}

/** Replaces the whole list; orders already placed keep the prices they were placed at. */
export async function setPriceList(labOrgId: number, user: SessionUser, input: PriceListInput) {
  return inTransaction(async (t) => {
    const lab = await Organisation.findByPk(labOrgId, { transaction: t });
    if (lab?.kind !== "laboratory") throw forbidden("Only a laboratory keeps a price list.");
    const before = itemsOf(await LabPrice.findAll({ where: { organisationId: labOrgId }, transaction: t }));
    await LabPrice.destroy({ where: { organisationId: labOrgId }, transaction: t });
    await LabPrice.bulkCreate(
      input.items.map((i) => ({ organisationId: labOrgId, parameter: i.parameter, priceCents: i.priceCents, currency: CURRENCY })),
      { transaction: t },
    );
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: labOrgId,
      action: "price_list.updated",
      entityType: "organisation",
      entityId: labOrgId,
      before,
      after: input.items,
      details: { items: input.items.length },
    });
    return { currency: CURRENCY, items: itemsOf(await LabPrice.findAll({ where: { organisationId: labOrgId }, transaction: t })) };
  });
}
