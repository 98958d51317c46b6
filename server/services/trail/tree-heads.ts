/**
 * Signed tree heads over the trail, so a party can keep what it has seen and later prove that the
 * history was neither rewritten nor cut (RFC 9162 §4.10 signed tree heads, §2.1 Merkle proofs).
 * The leaves are the entries' hashes in sequence order. A head is signed with an Ed25519 key kept
 * in a file outside the database: whoever can rewrite the tables still cannot sign a head for the
 * rewritten history, and a head a party kept will not be consistent with it.
 */
import { createHash, createPrivateKey, createPublicKey, generateKeyPairSync, sign, verify, type KeyObject } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { database } from "../../db/database.ts";
import { consistencyPath, inclusionPath, leafHash, rootOf, verifyConsistency } from "../../lib/merkle.ts";
import { TrailEntry } from "../../models/trail-entry.ts";
import { TrailTreeHead } from "../../models/trail-tree-head.ts";
import { serviceSettings } from "../../settings.ts";
import { badRequest, notFound } from "../../errors.ts";
import type { InclusionProof, ConsistencyProof, KeptHeadCheck, SignedTreeHead } from "../../../shared/trail/views.ts";

const VERSION = "cellarpact-tree-head-v1";

interface SigningKey {
  privateKey: KeyObject;
  publicKeyPem: string;
  keyId: string;
}
const keys = new Map<string, SigningKey>();

/** The signing key in its file, made (readable by its owner only) the first time it is needed. */
export function signingKey(file = serviceSettings().trailSigningKeyFile): SigningKey {
  let key = keys.get(file);
  if (key) return key;
  if (!existsSync(file)) {
    mkdirSync(path.dirname(file), { recursive: true });
    const { privateKey } = generateKeyPairSync("ed25519");
    writeFileSync(file, privateKey.export({ type: "pkcs8", format: "pem" }), { mode: 0o600, flag: "wx" });
  }
  const privateKey = createPrivateKey(readFileSync(file));
  const publicKey = createPublicKey(privateKey);
  const der = publicKey.export({ type: "spki", format: "der" });
  key = {
    privateKey,
    publicKeyPem: publicKey.export({ type: "spki", format: "pem" }).toString(),
    keyId: createHash("sha256").update(der).digest("hex"),
  };
  keys.set(file, key);
  return key;
}

/** The exact text a head's signature covers. */
export const signedText = (h: Pick<SignedTreeHead, "treeSize" | "timestamp" | "rootHash">) =>
  `${VERSION}\n${h.treeSize}\n${h.timestamp}\n${h.rootHash}\n`;

export function verifyTreeHead(h: SignedTreeHead, publicKeyPem: string): boolean {
  return verify(null, Buffer.from(signedText(h)), createPublicKey(publicKeyPem), Buffer.from(h.signature, "base64"));
}

/** The leaf hashes of the first `size` entries (all when not given), in sequence order. */
async function leaves(size?: number): Promise<Buffer[]> {
  const rows = await database().query<{ hash: string }>(
    `SELECT hash FROM trail_entries ORDER BY seq${size === undefined ? "" : " LIMIT :size"}`,
    { replacements: { size }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => leafHash(Buffer.from(r.hash, "hex")));
}

/** A head for the trail as it stands now, signed. */
export async function currentTreeHead(): Promise<SignedTreeHead> {
  const all = await leaves();
  const unsigned = { treeSize: all.length, timestamp: new Date().toISOString(), rootHash: rootOf(all).toString("hex") };
  const key = signingKey();
  return {
    ...unsigned,
    algorithm: "Ed25519",
    keyId: key.keyId,
    signature: sign(null, Buffer.from(signedText(unsigned)), key.privateKey).toString("base64"),
  };
}

/** That entry `seq`, about this organisation, is in the tree of `treeSize` entries. */
export async function inclusionProof(organisationId: number, seq: number, treeSize: number): Promise<InclusionProof> {
  const entry = await TrailEntry.findOne({ where: { seq, organisationId }, attributes: ["seq", "hash"] });
  if (!entry) throw notFound("The trail entry");
  const tree = await leaves(treeSize);
  if (seq > tree.length || treeSize > tree.length)
    throw badRequest(`The trail has ${tree.length} entries; ask for a tree of at most that size that holds entry ${seq}.`);
  return {
    seq,
    leafIndex: seq - 1,
    treeSize,
    leafHash: tree[seq - 1]!.toString("hex"),
    path: inclusionPath(tree, seq - 1).map((h) => h.toString("hex")),
    rootHash: rootOf(tree).toString("hex"),
  };
}

/** That the tree of `to` entries extends the one of `from` entries without changing it. */
export async function consistencyProof(from: number, to: number): Promise<ConsistencyProof> {
  const tree = await leaves(to);
  if (from < 1 || from > to || to > tree.length) throw badRequest(`Give 1 ≤ from ≤ to ≤ ${tree.length}, the trail's size now.`);
  return {
    from,
    to,
    fromRoot: rootOf(tree.slice(0, from)).toString("hex"),
    toRoot: rootOf(tree).toString("hex"),
    path: consistencyPath(tree, from).map((h) => h.toString("hex")),
  };
}

/** Signs and keeps today's head, unless one was published today already; answers it when new. */
export async function publishDailyTreeHead(now = new Date()): Promise<SignedTreeHead | null> {
  const latest = await TrailTreeHead.findOne({ order: [["id", "DESC"]] });
  if (latest && latest.signedAt.slice(0, 10) === now.toISOString().slice(0, 10)) return null;
  const head = await currentTreeHead();
  await TrailTreeHead.create({
    treeSize: head.treeSize,
    rootHash: head.rootHash,
    signedAt: head.timestamp,
    keyId: head.keyId,
    signature: head.signature,
  });
  return head;
}

/**
 * Checks a head a party kept against the trail now: that Cellarpact's key signed it, and that the
 * trail today extends that tree unchanged — a rewritten or cut history fails here, however well its
 * hashes and checkpoint were recomputed.
 */
export async function checkKeptHead(kept: SignedTreeHead): Promise<KeptHeadCheck> {
  const key = signingKey();
  const tree = await leaves();
  const result = (signatureValid: boolean, consistent: boolean, reason: string | null): KeptHeadCheck => ({
    signatureValid,
    consistent,
    keptSize: kept.treeSize,
    currentSize: tree.length,
    reason,
  });
  if (kept.keyId !== key.keyId || !verifyTreeHead(kept, key.publicKeyPem))
    return result(false, false, "Cellarpact's key did not sign this head as it stands; it was altered or is not Cellarpact's.");
  if (kept.treeSize > tree.length)
    return result(
      true,
      false,
      `The trail holds ${tree.length} entries, fewer than the ${kept.treeSize} of the head you kept: entries were removed.`,
    );
  const proof = consistencyPath(tree, kept.treeSize);
  const ok =
    kept.treeSize === 0 ||
    (kept.treeSize === tree.length
      ? rootOf(tree).toString("hex") === kept.rootHash
      : verifyConsistency(kept.treeSize, tree.length, Buffer.from(kept.rootHash, "hex"), rootOf(tree), proof));
  return result(
    true,
    ok,
    ok ? null : `The first ${kept.treeSize} entries are no longer the ones the head you kept was signed over: the history was rewritten.`,
  );
}
