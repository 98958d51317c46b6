/** The periodic job that warns both parties of a deviation whose response deadline is near. */
import { Op } from "sequelize";
import { deviationPath } from "../../../shared/paths.ts";
import { Deviation } from "../../models/deviation.ts";
import { Lot } from "../../models/lot.ts";
import { Contract } from "../../models/contract.ts";
import { inTransaction } from "../../db/database.ts";
import { notify, usersWithRoles } from "../notification-service.ts";
import { contractInclude, type ContractWithParties } from "../specs/spec-access.ts";

/** Warns both parties once when a response deadline is less than a day away. */
export async function warnApproachingDeadlines(now = new Date()): Promise<number> {
  const soon = new Date(now.getTime() + 86_400_000);
  const due = await Deviation.findAll({
    where: { status: ["open", "in_discussion", "agreed"], deadlineWarnedAt: null, respondBy: { [Op.between]: [now, soon] } },
    include: [{ model: Lot, as: "lot" }],
  });
  for (const d of due) {
    await inTransaction(async (t) => {
      const c = (await Contract.findByPk(d.contractId, { include: contractInclude, transaction: t })) as ContractWithParties;
      const parties = await usersWithRoles([c.retailerOrgId, c.producerOrgId], ["buyer_technologist", "producer_quality"], t);
      await notify(t, parties, {
        kind: "deadline",
        title: `Deviation #${d.id} needs a response by ${d.respondBy!.toISOString().slice(0, 16).replace("T", " ")} UTC`,
        body: d.summary,
        link: deviationPath(d.id),
      });
      await d.update({ deadlineWarnedAt: now }, { transaction: t });
    });
  }
  return due.length;
}
