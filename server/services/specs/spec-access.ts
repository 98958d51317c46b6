/** Which contracts and versions an organisation may see, and in which capacity. */
import type { Transaction } from "sequelize";
import { Contract } from "../../models/contract.ts";
import { Wine } from "../../models/wine.ts";
import { Organisation } from "../../models/organisation.ts";
import { SpecVersion } from "../../models/spec-version.ts";
import { notFound } from "../../errors.ts";

export type Side = "buyer" | "producer";

export type ContractWithParties = Contract & { wine: Wine; retailer: Organisation; producer: Organisation };

export const contractInclude = [
  { model: Wine, as: "wine" },
  { model: Organisation, as: "retailer" },
  { model: Organisation, as: "producer" },
];

export function sideOf(contract: Contract, orgId: number): Side | null {
  if (contract.retailerOrgId === orgId) return "buyer";
  if (contract.producerOrgId === orgId) return "producer";
  return null;
}

/** The contract if this organisation is a party to it; otherwise 404, so other tenants stay invisible. */
export async function contractFor(
  orgId: number,
  contractId: number,
  t?: Transaction,
): Promise<{ contract: ContractWithParties; side: Side }> {
  const contract = (await Contract.findByPk(contractId, { include: contractInclude, transaction: t })) as ContractWithParties | null;
  const side = contract ? sideOf(contract, orgId) : null;
  if (!contract || !side) throw notFound("The contract");
  return { contract, side };
}

/**
 * The version if the organisation may see it: the buyer sees every version, the producer every
 * version that has been sent (drafts are the buyer's own work).
 */
export async function versionFor(orgId: number, specId: number, t?: Transaction, lock = false) {
  const version = await SpecVersion.findByPk(specId, { transaction: t, lock: lock && t ? t.LOCK.UPDATE : undefined });
  if (!version) throw notFound("The spec version");
  const { contract, side } = await contractFor(orgId, version.contractId, t).catch(() => {
    throw notFound("The spec version");
  });
  if (side === "producer" && version.status === "draft") throw notFound("The spec version");
  return { version, contract, side };
}
