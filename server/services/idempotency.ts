/**
 * Idempotent writes: the key is claimed first, inside the caller's transaction, so a concurrent retry
 * waits on the unique index and then receives the first answer; a retry after success gets it too.
 */
import { UniqueConstraintError, type Transaction } from "sequelize";
import { IdempotencyKey } from "../models/idempotency-key.ts";
import { inTransaction } from "../db/database.ts";
import { canonicalJson, sha256 } from "../lib/crypto.ts";
import { conflict } from "../errors.ts";

export async function idempotent<T>(
  organisationId: number,
  key: string,
  body: unknown,
  /** Given the request's digest too, so a trail entry for the same body need not hash it again. */
  work: (t: Transaction, requestHash: string) => Promise<T>,
): Promise<{ replayed: boolean; response: T }> {
  const requestHash = sha256(canonicalJson(body));
  const replay = async () => {
    const stored = await IdempotencyKey.findOne({ where: { organisationId, key } });
    if (!stored) throw conflict("A submission with this idempotency key is still being processed; retry in a moment.");
    if (stored.requestHash !== requestHash) throw conflict("This idempotency key was already used for a different submission.");
    return { replayed: true, response: stored.response as T };
  };
  if (await IdempotencyKey.count({ where: { organisationId, key } })) return replay();
  try {
    return await inTransaction(async (t) => {
      const claim = await IdempotencyKey.create({ organisationId, key, requestHash, response: {} }, { transaction: t });
      const response = await work(t, requestHash);
      await claim.update({ response }, { transaction: t });
      return { replayed: false, response };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) return replay();
    throw err;
  }
}
