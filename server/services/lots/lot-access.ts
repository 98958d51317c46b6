import type { Transaction } from "sequelize";
import { Lot } from "../../models/lot.ts";
import { notFound } from "../../errors.ts";
import { contractFor } from "../specs/spec-access.ts";

/** The lot if the organisation is a party to its contract; otherwise 404. */
export async function lotFor(orgId: number, lotId: number, t?: Transaction) {
  const lot = await Lot.findByPk(lotId, { transaction: t });
  if (!lot) throw notFound("The lot");
  const { contract, side } = await contractFor(orgId, lot.contractId, t).catch(() => {
    throw notFound("The lot");
  });
  return { lot, contract, side };
}
