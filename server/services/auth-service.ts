/** Sign-in, sign-out, password reset and password change. */
import bcrypt from "bcryptjs";
import { Op, type Transaction } from "sequelize";
import { User } from "../models/user.ts";
import { PasswordReset } from "../models/password-reset.ts";
import { inTransaction } from "../db/database.ts";
import { recordTrail } from "./trail/trail-service.ts";
import { enqueueMail } from "../integrations/mail/outbox.ts";
import { passwordResetMail } from "../integrations/mail/templates.ts";
import { randomToken, sha256 } from "../lib/crypto.ts";
import { serviceSettings } from "../settings.ts";
import { gone, unauthorized, validationFailed } from "../errors.ts";
import { toSessionUser, type SessionUser } from "./session-service.ts";
import { assertStrongPassword } from "./password-policy.ts";
import { assertMayTry, clearSubject, liftAccount, recordFailure, throttleSubject } from "./sign-in-throttle.ts";

export const SIGN_IN_FAILED = "The e-mail address or the password is not right.";
const RESET_MINUTES = 60;
/**
 * Compared against when the account does not exist or has no password yet, so that failure costs
 * what a wrong password costs: the same bcrypt work factor as real hashes (OWASP ASVS 5.0 V6.3).
 */
const dummyHashes = new Map<number, string>();
export function dummyHash(): string {
  const cost = serviceSettings().bcryptCost;
  let hash = dummyHashes.get(cost);
  if (!hash) dummyHashes.set(cost, (hash = bcrypt.hashSync(randomToken(), cost)));
  return hash;
}

/** Hashes a password someone is setting, once it passes the policy for that person. */
export function hashNewPassword(password: string, owner: { email: string; name?: string | null }, field: string): Promise<string> {
  assertStrongPassword(password, owner, field);
  return bcrypt.hash(password, serviceSettings().bcryptCost);
}

/**
 * `knownDevice` is the id of a browser that signed in to this account before (its cookie checked by
 * the caller); its failures are counted apart from everyone else's.
 */
export async function signIn(
  email: string,
  password: string,
  knownDevice: string | null = null,
): Promise<{ user: SessionUser; sessionVersion: number }> {
  const subject = throttleSubject(email, knownDevice);
  await assertMayTry(subject);
  const user = await User.findOne({ where: { email } });
  const ok = await bcrypt.compare(password, user?.passwordHash ?? dummyHash());
  if (!user || !user.passwordHash || !ok) {
    await recordFailure(subject, serviceSettings().signInFreeFailures);
    await inTransaction((t) =>
      recordTrail(t, {
        actorUserId: null,
        organisationId: null,
        action: "auth.sign_in_failed",
        entityType: "user",
        entityId: user?.id ?? null,
        details: { reason: "bad credentials" },
      }),
    );
    throw unauthorized(SIGN_IN_FAILED);
  }
  await clearSubject(subject);
  const sessionUser = await toSessionUser(user);
  await inTransaction((t) =>
    recordTrail(t, {
      actorUserId: user.id,
      organisationId: sessionUser.memberships[0]?.organisationId ?? null,
      action: "auth.sign_in",
      entityType: "user",
      entityId: user.id,
    }),
  );
  return { user: sessionUser, sessionVersion: user.sessionVersion };
}

/** Revokes every session of the user, not only the current cookie. */
export async function signOut(userId: number): Promise<void> {
  await inTransaction(async (t) => {
    await User.increment("sessionVersion", { where: { id: userId }, transaction: t });
    await recordTrail(t, { actorUserId: userId, organisationId: null, action: "auth.sign_out", entityType: "user", entityId: userId });
  });
}

/** Always succeeds from the caller's view, so the answer does not reveal which addresses have accounts. */
export async function requestPasswordReset(email: string): Promise<void> {
  const user = await User.findOne({ where: { email } });
  if (!user || !user.passwordHash) return;
  const token = randomToken();
  await inTransaction(async (t) => {
    await PasswordReset.create(
      { userId: user.id, tokenHash: sha256(token), expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000) },
      { transaction: t },
    );
    await enqueueMail(
      t,
      passwordResetMail({
        to: user.email,
        name: user.name,
        link: `${serviceSettings().appUrl}/reset-password/${token}`,
        expiresMinutes: RESET_MINUTES,
      }),
    );
    await recordTrail(t, {
      actorUserId: null,
      organisationId: null,
      action: "auth.reset_requested",
      entityType: "user",
      entityId: user.id,
    });
  });
}

/** Once the password is set anew, every reset link still out for the account stops working (OWASP ASVS 5.0 V6.4). */
async function voidResetLinks(t: Transaction, userId: number) {
  await PasswordReset.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction: t });
}

export async function resetPassword(token: string, password: string): Promise<void> {
  // Read first, so the policy can weigh the account's own address; the transaction checks the link again.
  const pending = await PasswordReset.findOne({ where: { tokenHash: sha256(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } } });
  const owner = pending ? await User.findByPk(pending.userId) : null;
  if (!pending || !owner) throw gone("This reset link has expired or was already used. Ask for a new one.");
  const passwordHash = await hashNewPassword(password, owner, "password");
  await inTransaction(async (t) => {
    const reset = await PasswordReset.findOne({
      where: { tokenHash: sha256(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    if (!reset) throw gone("This reset link has expired or was already used. Ask for a new one.");
    await voidResetLinks(t, reset.userId);
    const user = await User.findByPk(reset.userId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!user) throw gone("The account no longer exists.");
    await user.update({ passwordHash, sessionVersion: user.sessionVersion + 1 }, { transaction: t });
    await recordTrail(t, {
      actorUserId: user.id,
      organisationId: null,
      action: "auth.password_reset",
      entityType: "user",
      entityId: user.id,
    });
  });
  await liftAccount(owner.email);
}

export async function changePassword(userId: number, current: string, next: string): Promise<number> {
  const user = await User.findByPk(userId);
  if (!user?.passwordHash || !(await bcrypt.compare(current, user.passwordHash))) {
    throw validationFailed([{ path: "currentPassword", message: "The current password is not right." }]);
  }
  const passwordHash = await hashNewPassword(next, user, "newPassword");
  return inTransaction(async (t) => {
    const sessionVersion = user.sessionVersion + 1;
    await user.update({ passwordHash, sessionVersion }, { transaction: t });
    await voidResetLinks(t, userId);
    await recordTrail(t, {
      actorUserId: userId,
      organisationId: null,
      action: "auth.password_changed",
      entityType: "user",
      entityId: userId,
    });
    return sessionVersion;
  });
}

export async function updateProfile(userId: number, name: string): Promise<SessionUser> {
  return inTransaction(async (t) => {
    const user = await User.findByPk(userId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!user) throw unauthorized();
    const before = { name: user.name };
    await user.update({ name }, { transaction: t });
    await recordTrail(t, {
      actorUserId: userId,
      organisationId: null,
      action: "user.profile_updated",
      entityType: "user",
      entityId: userId,
      before,
      after: { name },
    });
    return toSessionUser(user);
  });
}
