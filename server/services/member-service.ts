/** Organisation members: list, change a role, remove. Role changes revoke the member's sessions. */
import { Membership } from "../models/membership.ts";
import { User } from "../models/user.ts";
import { Organisation } from "../models/organisation.ts";
import { inTransaction } from "../db/database.ts";
import { recordTrail } from "./trail/trail-service.ts";
import { assertRoleFits } from "./invitation-service.ts";
import { conflict, notFound } from "../errors.ts";
import type { Role } from "../../shared/auth/roles.ts";
import type { Transaction } from "sequelize";
import type { MemberView } from "../../shared/auth/views.ts";

export async function listMembers(orgId: number): Promise<MemberView[]> {
  const rows = await Membership.findAll({
    where: { organisationId: orgId },
    include: [{ model: User, as: "user", attributes: ["id", "name", "email"] }],
    order: [["id", "ASC"]],
  });
  return rows.map((m) => {
    const u = (m as Membership & { user: User }).user;
    return { membershipId: m.id, userId: u.id, name: u.name, email: u.email, role: m.role, since: m.createdAt.toISOString() };
  });
}

async function lockMembership(t: Transaction, orgId: number, membershipId: number) {
  const m = await Membership.findOne({ where: { id: membershipId, organisationId: orgId }, transaction: t, lock: t.LOCK.UPDATE });
  if (!m) throw notFound("The member");
  return m;
}

/** An organisation must keep at least one admin, or nobody could manage it any more. */
async function assertNotLastAdmin(t: Transaction, orgId: number, m: Membership) {
  if (m.role !== "org_admin") return;
  const admins = await Membership.count({ where: { organisationId: orgId, role: "org_admin" }, transaction: t });
  if (admins <= 1) throw conflict("This is the organisation's last admin. Make someone else admin first.");
}

export async function changeRole(orgId: number, membershipId: number, role: Role, actorId: number): Promise<MemberView> {
  await inTransaction(async (t) => {
    const org = await Organisation.findByPk(orgId, { transaction: t });
    if (!org) throw notFound("The organisation");
    assertRoleFits(role, org);
    const m = await lockMembership(t, orgId, membershipId);
    if (m.role === role) return;
    if (role !== "org_admin") await assertNotLastAdmin(t, orgId, m);
    const before = { role: m.role };
    await m.update({ role }, { transaction: t });
    await User.increment("sessionVersion", { where: { id: m.userId }, transaction: t });
    await recordTrail(t, {
      actorUserId: actorId,
      organisationId: orgId,
      action: "membership.role_changed",
      entityType: "membership",
      entityId: m.id,
      before,
      after: { role },
      details: { userId: m.userId, from: before.role, to: role },
    });
  });
  const member = (await listMembers(orgId)).find((x) => x.membershipId === membershipId);
  if (!member) throw notFound("The member");
  return member;
}

export async function removeMember(orgId: number, membershipId: number, actorId: number): Promise<void> {
  await inTransaction(async (t) => {
    const m = await lockMembership(t, orgId, membershipId);
    await assertNotLastAdmin(t, orgId, m);
    await m.destroy({ transaction: t });
    await User.increment("sessionVersion", { where: { id: m.userId }, transaction: t });
    await recordTrail(t, {
      actorUserId: actorId,
      organisationId: orgId,
      action: "membership.removed",
      entityType: "membership",
      entityId: m.id,
      before: { userId: m.userId, role: m.role },
      details: { userId: m.userId, role: m.role },
    });
  });
}
