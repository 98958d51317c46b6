/**
 * Sign-in throttling that an attacker cannot turn into a lock-out of the owner (OWASP ASVS 5.0 V6.3;
 * OWASP "Blocking Brute Force Attacks", device cookies). Failures count per subject: a browser that
 * signed in to the account before has a subject of its own, so failures from anywhere else never
 * slow it; every other client shares the account's subject. After a few free failures each further
 * one doubles the wait, from 30 seconds up to 15 minutes — a delay, not a lock — and a completed
 * password reset lifts every wait on the account.
 */
import { Op } from "sequelize";
import { SignInThrottle } from "../models/sign-in-throttle.ts";
import { tooManyRequests } from "../errors.ts";
import { database } from "../db/database.ts";

export const FIRST_WAIT_SECONDS = 30;
export const LONGEST_WAIT_SECONDS = 15 * 60;

export const throttleSubject = (email: string, knownDevice: string | null) =>
  knownDevice ? `device:${knownDevice}:${email}` : `account:${email}`;

/** Refuses the attempt while its subject waits; says how long in the error. */
export async function assertMayTry(subject: string): Promise<void> {
  const row = await SignInThrottle.findByPk(subject);
  const waitMs = row?.blockedUntil ? row.blockedUntil.getTime() - Date.now() : 0;
  if (waitMs > 0) {
    const seconds = Math.ceil(waitMs / 1000);
    throw tooManyRequests(
      `Too many failed sign-in attempts. Try again in ${seconds < 90 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`}, or reset your password.`,
      seconds,
    );
  }
}

/** Counts a failure; past `freeFailures` the wait doubles with each one (30 s, 1 min, 2 min … 15 min). */
export async function recordFailure(subject: string, freeFailures: number): Promise<void> {
  // Counted in one statement, so concurrent failures are all counted.
  await database().query(
    `INSERT INTO sign_in_throttles (subject, failures, updated_at) VALUES (:subject, 1, :now)
     ON DUPLICATE KEY UPDATE failures = failures + 1, updated_at = :now`,
    { replacements: { subject, now: new Date() } },
  );
  const row = (await SignInThrottle.findByPk(subject))!;
  const over = row.failures - freeFailures;
  if (over > 0)
    await row.update({ blockedUntil: new Date(Date.now() + Math.min(FIRST_WAIT_SECONDS * 2 ** (over - 1), LONGEST_WAIT_SECONDS) * 1000) });
}

export async function clearSubject(subject: string): Promise<void> {
  await SignInThrottle.destroy({ where: { subject } });
}

/** Lifts every wait on the account, from any client: its owner has just proven themselves by mail. */
export async function liftAccount(email: string): Promise<void> {
  await SignInThrottle.destroy({ where: { [Op.or]: [{ subject: `account:${email}` }, { subject: { [Op.like]: `device:%:${email}` } }] } });
}
