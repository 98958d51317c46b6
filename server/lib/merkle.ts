/**
 * The Merkle tree of RFC 9162 §2.1 (Certificate Transparency v2) over the trail's entries: leaf
 * hashes SHA-256(0x00 ‖ leaf), interior nodes SHA-256(0x01 ‖ left ‖ right), a tree of n leaves
 * split at the largest power of two below n. Inclusion proofs (§2.1.3) show that an entry is in a
 * tree of a given size; consistency proofs (§2.1.4) show that a later tree extends an earlier one
 * without rewriting it. Verification follows the algorithms of §2.1.3.2 and §2.1.4.2.
 */
import { createHash } from "node:crypto";

const sha = (...parts: Buffer[]) => {
  const h = createHash("sha256");
  for (const p of parts) h.update(p);
  return h.digest();
};
const LEAF = Buffer.from([0]);
const NODE = Buffer.from([1]);

export const leafHash = (leaf: Buffer) => sha(LEAF, leaf);
export const nodeHash = (left: Buffer, right: Buffer) => sha(NODE, left, right);

/** The largest power of two smaller than n (n ≥ 2). */
const split = (n: number) => 2 ** Math.floor(Math.log2(n - 1));

/** MTH(D[n]) from the leaves' hashes; the hash of the empty string for no leaves. */
export function rootOf(leaves: readonly Buffer[], from = 0, to = leaves.length): Buffer {
  const n = to - from;
  if (n === 0) return sha();
  if (n === 1) return leaves[from]!;
  const k = split(n);
  return nodeHash(rootOf(leaves, from, from + k), rootOf(leaves, from + k, to));
}

/** PATH(m, D[n]): the audit path of leaf m in the tree of the first `size` leaves. */
export function inclusionPath(leaves: readonly Buffer[], m: number, size = leaves.length, from = 0): Buffer[] {
  const n = size;
  if (n <= 1) return [];
  const k = split(n);
  return m < k
    ? [...inclusionPath(leaves, m, k, from), rootOf(leaves, from + k, from + n)]
    : [...inclusionPath(leaves, m - k, n - k, from + k), rootOf(leaves, from, from + k)];
}

/** PROOF(m, D[n]): that the tree of the first m leaves is a prefix of the tree of the first `size`. */
export function consistencyPath(leaves: readonly Buffer[], m: number, size = leaves.length): Buffer[] {
  const sub = (m: number, from: number, n: number, whole: boolean): Buffer[] => {
    if (m === n) return whole ? [] : [rootOf(leaves, from, from + n)];
    const k = split(n);
    return m <= k
      ? [...sub(m, from, k, whole), rootOf(leaves, from + k, from + n)]
      : [...sub(m - k, from + k, n - k, false), rootOf(leaves, from, from + k)];
  };
  return m === 0 || m === size ? [] : sub(m, 0, size, true);
}

/** §2.1.3.2: does this audit path take the leaf hash at `index` to `root` in a tree of `size`? */
export function verifyInclusion(index: number, size: number, leaf: Buffer, path: readonly Buffer[], root: Buffer): boolean {
  if (index >= size) return false;
  let fn = index;
  let sn = size - 1;
  let r = leaf;
  for (const p of path) {
    if (sn === 0) return false;
    if (fn % 2 === 1 || fn === sn) {
      r = nodeHash(p, r);
      if (fn % 2 === 0) while (fn % 2 === 0 && fn !== 0) [fn, sn] = [fn >> 1, sn >> 1];
    } else r = nodeHash(r, p);
    [fn, sn] = [fn >> 1, sn >> 1];
  }
  return sn === 0 && r.equals(root);
}

/** §2.1.4.2: does this proof show that the tree of size `first` (root `firstRoot`) is a prefix of the one of size `second`? */
export function verifyConsistency(first: number, second: number, firstRoot: Buffer, secondRoot: Buffer, proof: readonly Buffer[]): boolean {
  if (first > second) return false;
  if (first === second) return proof.length === 0 && firstRoot.equals(secondRoot);
  if (first === 0) return proof.length === 0;
  if (proof.length === 0) return false;
  const path = [...proof];
  // A power-of-two first tree is itself a node of the second: its root starts the proof.
  if (Number.isInteger(Math.log2(first))) path.unshift(firstRoot);
  let fn = first - 1;
  let sn = second - 1;
  while (fn % 2 === 1) [fn, sn] = [fn >> 1, sn >> 1];
  let fr = path[0]!;
  let sr = path[0]!;
  for (const c of path.slice(1)) {
    if (sn === 0) return false;
    if (fn % 2 === 1 || fn === sn) {
      fr = nodeHash(c, fr);
      sr = nodeHash(c, sr);
      if (fn % 2 === 0) while (fn % 2 === 0 && fn !== 0) [fn, sn] = [fn >> 1, sn >> 1];
    } else sr = nodeHash(sr, c);
    [fn, sn] = [fn >> 1, sn >> 1];
  }
  return sn === 0 && fr.equals(firstRoot) && sr.equals(secondRoot);
}
