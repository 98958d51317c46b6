/**
 * Once a day the trail's signed head goes to every organisation's admins, so each party holds a
 * copy Cellarpact cannot take back: a later history that is not consistent with it was rewritten.
 */
import { Op } from "sequelize";
import { inTransaction } from "../../db/database.ts";
import { enqueueMail } from "../../integrations/mail/outbox.ts";
import { Membership } from "../../models/membership.ts";
import { User } from "../../models/user.ts";
import { publishDailyTreeHead } from "./tree-heads.ts";

export async function mailDailyTreeHead(now = new Date()): Promise<number> {
  const head = await publishDailyTreeHead(now);
  if (!head) return 0;
  const admins = await Membership.findAll({ where: { role: "org_admin" }, attributes: ["userId"] });
  const users = await User.findAll({ where: { id: { [Op.in]: [...new Set(admins.map((a) => a.userId))] } }, attributes: ["email"] });
  await inTransaction(async (t) => {
    for (const u of users)
      await enqueueMail(t, {
        to: u.email,
        subject: `Cellarpact trail, signed head of ${head.timestamp.slice(0, 10)}: ${head.treeSize} entries`,
        text: [
          "Keep this mail. It is Cellarpact's signed statement of its trail today; with it your organisation can later",
          "prove that no entry before it was changed or removed (the Trail page checks a kept head against the trail now).",
          "",
          JSON.stringify(head, null, 2),
        ].join("\n"),
        kind: "notification",
      });
  });
  return users.length;
}
