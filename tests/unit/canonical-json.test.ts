/**
 * Canonical JSON: the form every trail digest and idempotency hash is taken of. Keys sorted by
 * UTF-16 code unit at every level, no insignificant white space, undefined members dropped, as in
 * RFC 8785 §3.2.3 (sorting) for the JSON values Cellarpact hashes.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { canonicalJson } from "../../server/lib/crypto.ts";

/** The definition, written plainly: what the fast path must always equal. */
function reference(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value ?? null);
  if (value instanceof Date) return JSON.stringify(value.toISOString());
  if (Array.isArray(value)) return `[${value.map(reference).join(",")}]`;
  const keys = Object.keys(value).filter((k) => (value as Record<string, unknown>)[k] !== undefined);
  keys.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${keys.map((k) => `${JSON.stringify(k)}:${reference((value as Record<string, unknown>)[k])}`).join(",")}}`;
}

describe("canonical JSON", () => {
  it("when keys come in any order, with integer-like keys or nested arrays, then the text is the sorted one (RFC 8785 §3.2.3 ordering)", () => {
    const value = JSON.parse('{"b":[{"z":1,"a":null}],"10":"x","9":true,"a":{"__proto__":1,"é":2,"e":3},"":0}');
    expect(canonicalJson(value)).toBe('{"":0,"10":"x","9":true,"a":{"__proto__":1,"e":3,"é":2},"b":[{"a":null,"z":1}]}');
    expect(canonicalJson({ when: new Date("2026-12-04T03:00:00Z"), skipped: undefined, list: [undefined, 1] })).toBe(
      '{"list":[null,1],"when":"2026-12-04T03:00:00.000Z"}',
    );
  });

  it("when any JSON value is written, then it is the definition's text (fast-check)", () => {
    const key = fc.oneof(fc.string({ maxLength: 6 }), fc.constantFrom("0", "7", "10", "__proto__", "a", "B"));
    const value = fc.letrec((tie) => ({
      node: fc.oneof(
        { depthSize: "small" },
        fc.oneof(fc.string({ maxLength: 8 }), fc.double({ noNaN: true }), fc.integer(), fc.boolean(), fc.constant(null)),
        fc.array(tie("node"), { maxLength: 4 }),
        fc.dictionary(key, tie("node"), { maxKeys: 5 }),
      ),
    })).node;
    fc.assert(
      fc.property(value, (v) => {
        expect(canonicalJson(v)).toBe(reference(v));
      }),
      { numRuns: 3000 },
    );
  });
});
