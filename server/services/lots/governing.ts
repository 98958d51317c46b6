/** Only an agreed version governs lots: the latest agreed version whose vintages include the lot's. */
import { Op, type Transaction } from "sequelize";
import { SpecVersion } from "../../models/spec-version.ts";
import { requirementsOf } from "../specs/spec-queries.ts";
import { SpecRequirement } from "../../models/spec-requirement.ts";
import { requirementView } from "../specs/spec-view.ts";
import type { RequirementView } from "../../../shared/specs/views.ts";

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

export type Governing = Awaited<ReturnType<typeof governingVersion>>;

/**
 * The governing version of many (contract, vintage) pairs in two statements, whatever their number:
 * every agreed version of the contracts, then the requirements of those that govern. Keyed "contract|vintage".
 */
export async function governingVersions(pairs: { contractId: number; vintage: number }[]): Promise<Map<string, Governing>> {
  const found = new Map<string, Governing>();
  if (!pairs.length) return found;
  const versions = await SpecVersion.findAll({
    where: { contractId: [...new Set(pairs.map((p) => p.contractId))], status: "agreed" },
    order: [["number", "DESC"]],
  });
  const chosen = new Map<string, SpecVersion | undefined>();
  for (const { contractId, vintage } of pairs)
    chosen.set(
      `${contractId}|${vintage}`,
      versions.find((v) => v.contractId === contractId && v.vintageFrom <= vintage && (v.vintageTo === null || v.vintageTo >= vintage)),
    );
  const ids = [...new Set([...chosen.values()].filter((v) => v).map((v) => v!.id))];
  const rows = ids.length ? await SpecRequirement.findAll({ where: { specVersionId: ids }, order: [["position", "ASC"]] }) : [];
  const byVersion = new Map<number, RequirementView[]>();
  for (const r of rows) {
    const list = byVersion.get(r.specVersionId);
    if (list) list.push(requirementView(r));
    else byVersion.set(r.specVersionId, [requirementView(r)]);
  }
  for (const [key, version] of chosen) found.set(key, version ? { version, requirements: byVersion.get(version.id) ?? [] } : null);
  return found;
}
