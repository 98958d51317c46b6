/** Invitations: an organisation admin invites by e-mail; the invitee accepts by setting a password. */
import { Op, type Transaction } from "sequelize";
import { Invitation } from "../models/invitation.ts";
import { Organisation } from "../models/organisation.ts";
import { User } from "../models/user.ts";
import { Membership } from "../models/membership.ts";
import { inTransaction } from "../db/database.ts";
import { recordTrail } from "./trail/trail-service.ts";
import { enqueueMail } from "../integrations/mail/outbox.ts";
import { invitationMail } from "../integrations/mail/templates.ts";
import { randomToken, sha256 } from "../lib/crypto.ts";
import { serviceSettings } from "../settings.ts";
import { hashNewPassword } from "./auth-service.ts";
import { conflict, gone, notFound, validationFailed } from "../errors.ts";
import { ROLE_LABELS, roleFitsKind, type Role, ORGANISATION_KIND_LABELS } from "../../shared/auth/roles.ts";
import { toSessionUser, type SessionUser } from "./session-service.ts";
import type { InvitationView } from "../../shared/auth/views.ts";

export const INVITATION_DAYS = 7;

const view = (i: Invitation): InvitationView => ({
  id: i.id,
  email: i.email,
  role: i.role,
  expiresAt: i.expiresAt.toISOString(),
  createdAt: i.createdAt.toISOString(),
});

export function assertRoleFits(role: Role, org: Organisation): void {
  if (!roleFitsKind(role, org.kind)) {
    throw validationFailed([
      {
        path: "role",
        message: `${ROLE_LABELS[role]} is not a role in a ${ORGANISATION_KIND_LABELS[org.kind].toLowerCase()} organisation.`,
      },
    ]);
  }
}

/** Creates the invitation and queues its mail in one transaction. Also used when a platform admin opens an organisation. */
export async function createInvitation(
  t: Transaction,
  p: { organisation: Organisation; email: string; role: Role; invitedBy: { id: number; name: string } | null },
  mail: (link: string) => Parameters<typeof enqueueMail>[1],
): Promise<Invitation> {
  const token = randomToken();
  const invitation = await Invitation.create(
    {
      organisationId: p.organisation.id,
      email: p.email,
      role: p.role,
      tokenHash: sha256(token),
      invitedByUserId: p.invitedBy?.id ?? null,
      expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
    },
    { transaction: t },
  );
  await enqueueMail(t, mail(`${serviceSettings().appUrl}/accept-invitation/${token}`));
  await recordTrail(t, {
    actorUserId: p.invitedBy?.id ?? null,
    organisationId: p.organisation.id,
    action: "invitation.created",
    entityType: "invitation",
    entityId: invitation.id,
    after: { email: p.email, role: p.role },
    details: { email: p.email, role: p.role },
  });
  return invitation;
}

export async function invite(orgId: number, inviter: SessionUser, email: string, role: Role): Promise<InvitationView> {
  return inTransaction(async (t) => {
    const organisation = await Organisation.findByPk(orgId, { transaction: t });
    if (!organisation) throw notFound("The organisation");
    assertRoleFits(role, organisation);
    const existingUser = await User.findOne({ where: { email }, transaction: t });
    if (existingUser && (await Membership.count({ where: { userId: existingUser.id, organisationId: orgId }, transaction: t }))) {
      throw conflict(`${email} is already a member of ${organisation.name}.`);
    }
    const open = await Invitation.findOne({
      where: { organisationId: orgId, email, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction: t,
    });
    if (open) throw conflict(`${email} already has an open invitation; revoke it first to send a new one.`);
    const invitation = await createInvitation(t, { organisation, email, role, invitedBy: inviter }, (link) =>
      invitationMail({
        to: email,
        organisationName: organisation.name,
        role,
        inviterName: inviter.name,
        link,
        expiresDays: INVITATION_DAYS,
      }),
    );
    return view(invitation);
  });
}

export async function listOpenInvitations(orgId: number): Promise<InvitationView[]> {
  const rows = await Invitation.findAll({
    where: { organisationId: orgId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [["createdAt", "DESC"]],
  });
  return rows.map(view);
}

export async function revokeInvitation(orgId: number, invitationId: number, actorId: number): Promise<void> {
  await inTransaction(async (t) => {
    const inv = await Invitation.findOne({ where: { id: invitationId, organisationId: orgId }, transaction: t, lock: t.LOCK.UPDATE });
    if (!inv || inv.acceptedAt || inv.revokedAt) throw notFound("The invitation");
    await inv.update({ revokedAt: new Date() }, { transaction: t });
    await recordTrail(t, {
      actorUserId: actorId,
      organisationId: orgId,
      action: "invitation.revoked",
      entityType: "invitation",
      entityId: inv.id,
    });
  });
}

async function findUsable(token: string, t?: Transaction) {
  const inv = await Invitation.findOne({
    where: { tokenHash: sha256(token) },
    include: [{ model: Organisation, as: "organisation" }],
    transaction: t,
    lock: t ? t.LOCK.UPDATE : undefined,
  });
  if (!inv || inv.revokedAt) throw gone("This invitation is not valid. Ask your organisation's admin for a new one.");
  if (inv.acceptedAt) throw gone("This invitation was already accepted. Sign in instead.");
  if (inv.expiresAt.getTime() <= Date.now()) throw gone("This invitation has expired. Ask your organisation's admin for a new one.");
  return inv as Invitation & { organisation: Organisation };
}

export async function previewInvitation(token: string) {
  const inv = await findUsable(token);
  const existing = await User.findOne({ where: { email: inv.email } });
  return {
    email: inv.email,
    role: inv.role,
    organisationName: inv.organisation.name,
    organisationKind: inv.organisation.kind,
    hasAccount: Boolean(existing?.passwordHash),
  };
}

/**
 * Accepting creates the account and the membership in one transaction. A link never sets the
 * password of an account that already has one, so a leaked link cannot take an account over.
 */
export async function acceptInvitation(
  token: string,
  name: string,
  password: string,
): Promise<{ user: SessionUser; sessionVersion: number }> {
  // Read first, so the policy can weigh the invited address; the transaction checks the link again.
  const invited = await findUsable(token);
  const passwordHash = await hashNewPassword(password, { email: invited.email, name }, "password");
  const user = await inTransaction(async (t) => {
    const inv = await findUsable(token, t);
    let user = await User.findOne({ where: { email: inv.email }, transaction: t, lock: t.LOCK.UPDATE });
    if (user?.passwordHash) throw conflict("An account with this e-mail address exists already. Sign in, then ask the admin to add you.");
    if (user) await user.update({ name, passwordHash }, { transaction: t });
    else user = await User.create({ email: inv.email, name, passwordHash }, { transaction: t });
    await Membership.create({ userId: user.id, organisationId: inv.organisationId, role: inv.role }, { transaction: t });
    await inv.update({ acceptedAt: new Date() }, { transaction: t });
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: inv.organisationId,
      action: "invitation.accepted",
      entityType: "membership",
      entityId: user.id,
      after: { email: inv.email, role: inv.role },
      details: { email: inv.email, role: inv.role },
    });
    return user;
  });
  return { user: await toSessionUser(user), sessionVersion: user.sessionVersion };
}
