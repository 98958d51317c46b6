import { createHash, randomBytes } from "node:crypto";

export const sha256 = (text: string | Buffer): string => createHash("sha256").update(text).digest("hex");

/** A URL-safe random token for mailed links; only its SHA-256 is stored. */
export const randomToken = (): string => randomBytes(32).toString("base64url");

/**
 * JSON with object keys sorted at every level (by UTF-16 code unit), so equal content always
 * hashes the same. Built as a sorted copy written by the native JSON.stringify, which is twice as
 * fast as writing it piece by piece on an import's thousands of results. JavaScript puts
 * integer-like keys ("7", "10") first in number order whatever the insertion order, and a copy
 * cannot hold an own "__proto__" key, so a value with either goes the piece-by-piece way instead.
 */
export function canonicalJson(value: unknown): string {
  try {
    return JSON.stringify(sortedCopy(value)) ?? "null";
  } catch (err) {
    if (err instanceof NeedsPieces) return canonicalJsonByPieces(value);
    throw err;
  }
}

class NeedsPieces extends Error {}
const INTEGER_LIKE = /^(?:0|[1-9]\d*)$/;

function sortedCopy(v: unknown): unknown {
  if (v === null || typeof v !== "object" || v instanceof Date) return v;
  if (Array.isArray(v)) return v.map(sortedCopy);
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(v).sort()) {
    if (k === "__proto__" || INTEGER_LIKE.test(k)) throw new NeedsPieces();
    out[k] = sortedCopy((v as Record<string, unknown>)[k]);
  }
  return out;
}

function canonicalJsonByPieces(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value ?? null);
  if (value instanceof Date) return JSON.stringify(value.toISOString());
  if (Array.isArray(value)) return `[${value.map(canonicalJsonByPieces).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJsonByPieces(v)}`).join(",")}}`;
}
