/** Who may read or write a deviation: the contract's two parties, and the laboratory whose audit opened it (read only). */
import { type Transaction } from "sequelize";
import { Deviation } from "../../models/deviation.ts";
import { Membership } from "../../models/membership.ts";
import { User } from "../../models/user.ts";
import { Contract } from "../../models/contract.ts";
import { forbidden, notFound } from "../../errors.ts";
import { contractFor, contractInclude, type ContractWithParties, type Side } from "../specs/spec-access.ts";
import { AuditOrder } from "../../models/audit-order.ts";
import { type DeviationStatus } from "../../../shared/deviations/vocabulary.ts";

export const CLOSED: DeviationStatus[] = ["decided", "closed"];
export const isOverdue = (d: Deviation, now = Date.now()) =>
  !CLOSED.includes(d.status) && d.respondBy !== null && d.respondBy.getTime() < now;

export async function deviationFor(
  orgId: number,
  id: number,
  t?: Transaction,
  lock = false,
): Promise<{ deviation: Deviation; contract: ContractWithParties; side: Side | "laboratory" }> {
  const deviation = await Deviation.findByPk(id, { transaction: t, lock: lock && t ? t.LOCK.UPDATE : undefined });
  if (!deviation) throw notFound("The deviation");
  const party = await contractFor(orgId, deviation.contractId, t).catch(() => null);
  if (party) return { deviation, ...party };
  // The laboratory of a paid audit reads the deviations its results opened, and only those.
  const order = deviation.auditOrderId ? await AuditOrder.findByPk(deviation.auditOrderId, { transaction: t }) : null;
  if (order?.laboratoryOrgId !== orgId) throw notFound("The deviation");
  const contract = (await Contract.findByPk(deviation.contractId, { include: contractInclude, transaction: t })) as ContractWithParties;
  return { deviation, contract, side: "laboratory" };
}

/** Writes belong to the two parties of the contract. */
export async function partyDeviationFor(orgId: number, id: number, t?: Transaction, lock = false) {
  const found = await deviationFor(orgId, id, t, lock);
  if (found.side === "laboratory") throw forbidden("The laboratory reads this deviation; the buyer and the producer discuss it.");
  return found as typeof found & { side: Side };
}

/** Everyone who can take part: handles are the local part of their e-mail address (@tessa.marlow). */
export async function participants(c: ContractWithParties, t?: Transaction) {
  const rows = await Membership.findAll({
    where: { organisationId: [c.retailerOrgId, c.producerOrgId] },
    include: [{ model: User, as: "user" }],
    transaction: t,
  });
  return rows.map((m) => {
    const u = (m as Membership & { user: User }).user;
    return {
      userId: u.id,
      handle: u.email.split("@")[0]!.toLowerCase(),
      name: u.name,
      organisation: m.organisationId === c.retailerOrgId ? c.retailer.name : c.producer.name,
    };
  });
}
