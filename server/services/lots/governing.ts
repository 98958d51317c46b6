/** Only an agreed version governs lots: the latest agreed version whose vintages include the lot's. */
import { Op, type Transaction } from "sequelize";
import { SpecVersion } from "../../models/spec-version.ts";
import { requirementsOf } from "../specs/spec-queries.ts";

export async function governingVersion(contractId: number, vintage: number, t?: Transaction) {
  const version = await SpecVersion.findOne({
    where: {
      contractId,
      status: "agreed",
      vintageFrom: { [Op.lte]: vintage },
      [Op.or]: [{ vintageTo: null }, { vintageTo: { [Op.gte]: vintage } }],
    },
    order: [["number", "DESC"]],
    transaction: t,
  });
  if (!version) return null;
  return { version, requirements: await requirementsOf(version.id, t) };
}
