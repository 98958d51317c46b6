/**
 * The trail's Merkle tree against the Certificate Transparency reference vectors (the eight test
 * leaves and roots of the RFC 6962 reference test data, which RFC 9162 §2.1 keeps: same leaf and
 * node hashing), with their audit paths and consistency proofs, and every proof for trees up to
 * eight leaves verified by the RFC 9162 §2.1.3.2 and §2.1.4.2 algorithms.
 */
import { describe, expect, it } from "vitest";
import { consistencyPath, inclusionPath, leafHash, rootOf, verifyConsistency, verifyInclusion } from "../../server/lib/merkle.ts";

const LEAVES = ["", "00", "10", "2021", "3031", "40414243", "5051525354555657", "606162636465666768696a6b6c6d6e6f"].map((h) =>
  leafHash(Buffer.from(h, "hex")),
);
const ROOTS = [
  "6e340b9cffb37a989ca544e6bb780a2c78901d3fb33738768511a30617afa01d",
  "fac54203e7cc696cf0dfcb42c92a1d9dbaf70ad9e621f4bd8d98662f00e3c125",
  "aeb6bcfe274b70a14fb067a5e5578264db0fa9b51af5e0ba159158f329e06e77",
  "d37ee418976dd95753c1c73862b9398fa2a2cf9b4ff0fdfe8b30cd95209614b7",
  "4e3bbb1f7b478dcfe71fb631631519a3bca12c9aefca1612bfce4c13a86264d4",
  "76e67dadbcdf1e10e1b74ddc608abd2f98dfb16fbce75277b5232a127f2087ef",
  "ddb89be403809e325750d3d263cd78929c2942b7942a34b77e122c9594a74c8c",
  "5dc9da79a70659a9ad559cb701ded9a2ab9d823aad2f4960cfe370eff4604328",
];
const hex = (b: Buffer[]) => b.map((x) => x.toString("hex"));

describe("the Merkle tree (RFC 9162 §2.1)", () => {
  it("when the reference leaves are hashed, then each prefix has the reference root; the empty tree is SHA-256 of nothing", () => {
    for (let n = 1; n <= 8; n++) expect(rootOf(LEAVES.slice(0, n)).toString("hex")).toBe(ROOTS[n - 1]);
    expect(rootOf([]).toString("hex")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });

  it("when audit paths are built, then they are the reference paths", () => {
    expect(hex(inclusionPath(LEAVES, 0, 8))).toEqual([
      "96a296d224f285c67bee93c30f8a309157f0daa35dc5b87e410b78630a09cfc7",
      "5f083f0a1a33ca076a95279832580db3e0ef4584bdff1f54c8a360f50de3031e",
      "6b47aaf29ee3c2af9af889bc1fb9254dabd31177f16232dd6aab035ca39bf6e4",
    ]);
    expect(hex(inclusionPath(LEAVES, 5, 8))).toEqual([
      "bc1a0643b12e4d2d7c77918f44e0f4f79a838b6cf9ec5b5c283e1f4d88599e6b",
      "ca854ea128ed050b41b35ffc1b87b8eb2bde461e9e3b5596ece6b9d5975a0ae0",
      "d37ee418976dd95753c1c73862b9398fa2a2cf9b4ff0fdfe8b30cd95209614b7",
    ]);
    expect(inclusionPath(LEAVES, 0, 1)).toEqual([]);
  });

  it("when consistency proofs are built, then they are the reference proofs", () => {
    expect(hex(consistencyPath(LEAVES, 1, 8))).toEqual([
      "96a296d224f285c67bee93c30f8a309157f0daa35dc5b87e410b78630a09cfc7",
      "5f083f0a1a33ca076a95279832580db3e0ef4584bdff1f54c8a360f50de3031e",
      "6b47aaf29ee3c2af9af889bc1fb9254dabd31177f16232dd6aab035ca39bf6e4",
    ]);
    expect(hex(consistencyPath(LEAVES, 6, 8))).toEqual([
      "0ebc5d3437fbe2db158b9f126a1d118e308181031d0a949f8dededebc558ef6a",
      "ca854ea128ed050b41b35ffc1b87b8eb2bde461e9e3b5596ece6b9d5975a0ae0",
      "d37ee418976dd95753c1c73862b9398fa2a2cf9b4ff0fdfe8b30cd95209614b7",
    ]);
    expect(hex(consistencyPath(LEAVES, 2, 5))).toEqual([
      "5f083f0a1a33ca076a95279832580db3e0ef4584bdff1f54c8a360f50de3031e",
      "bc1a0643b12e4d2d7c77918f44e0f4f79a838b6cf9ec5b5c283e1f4d88599e6b",
    ]);
  });

  it("when every proof up to eight leaves is verified, then all hold, and a changed leaf, root or size fails", () => {
    for (let n = 1; n <= 8; n++) {
      const tree = LEAVES.slice(0, n);
      const root = rootOf(tree);
      for (let i = 0; i < n; i++) {
        const path = inclusionPath(tree, i);
        expect(verifyInclusion(i, n, tree[i]!, path, root), `inclusion ${i} of ${n}`).toBe(true);
        expect(verifyInclusion(i, n, leafHash(Buffer.from("forged")), path, root)).toBe(false);
      }
      for (let m = 1; m <= n; m++) {
        const proof = consistencyPath(tree, m);
        expect(verifyConsistency(m, n, rootOf(tree.slice(0, m)), root, proof), `consistency ${m} → ${n}`).toBe(true);
        if (m < n) expect(verifyConsistency(m, n, rootOf(tree.slice(0, m)), rootOf(LEAVES.slice(0, n - 1)), proof)).toBe(false);
      }
    }
    // A history rewritten at leaf 2 cannot be shown consistent with the tree a party kept.
    const rewritten = [...LEAVES];
    rewritten[2] = leafHash(Buffer.from("rewritten"));
    expect(verifyConsistency(4, 8, rootOf(LEAVES.slice(0, 4)), rootOf(rewritten), consistencyPath(rewritten, 4))).toBe(false);
  });
});
