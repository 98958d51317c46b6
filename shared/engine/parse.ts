/**
 * Reads a result as laboratories write it: decimal commas, "<0.5", "n.d.", "> 300". A censored
 * result stays censored; it is never turned into a number.
 */

export type Reading =
  | { kind: "value"; value: number }
  /** Below the limit of quantification (or detection). limit is null when the lab gave none ("n.d."). */
  | { kind: "below"; limit: number | null }
  /** Above the top of the working range, e.g. "> 300". */
  | { kind: "above"; limit: number }
  | { kind: "presence"; present: boolean };

export type ParseResult = { ok: true; reading: Reading } | { ok: false; error: string };

const NOT_DETECTED = /^(n\.?\s?d\.?|not detected|non détecté|nicht nachweisbar|< ?loq|< ?lod|<\s*l\.?o\.?q\.?)$/i;
const PRESENT = /^(present|detected|positive|yes|crystals?|deposit)$/i;
const ABSENT = /^(absent|none|negative|no|no deposit|clear)$/i;

/** Parses one number written with a point or a comma as decimal mark; spaces may group thousands. */
export function parseDecimal(text: string): number | null {
  const t = text.trim().replace(/[\u00a0\u202f ](?=\d{3}\b)/g, "");
  if (!/^[+-]?(\d+([.,]\d+)?|[.,]\d+)([eE][+-]?\d+)?$/.test(t)) return null;
  const n = Number(t.replace(",", "."));
  return Number.isFinite(n) ? n : null;
}

export function parseReading(raw: string, opts: { loq?: number | null; presence?: boolean } = {}): ParseResult {
  const text = raw.trim();
  if (text === "") return { ok: false, error: "No result given." };
  if (opts.presence) {
    if (PRESENT.test(text)) return { ok: true, reading: { kind: "presence", present: true } };
    if (ABSENT.test(text)) return { ok: true, reading: { kind: "presence", present: false } };
    return { ok: false, error: `"${text}" is not a presence result; write "absent" or "present".` };
  }
  if (NOT_DETECTED.test(text)) return { ok: true, reading: { kind: "below", limit: opts.loq ?? null } };
  const censored = text.match(/^(<|≤|<=|>|≥|>=)\s*(.+)$/);
  if (censored) {
    const limit = parseDecimal(censored[2]!);
    if (limit === null) return { ok: false, error: `"${text}" has no number after ${censored[1]}.` };
    if (limit < 0) return { ok: false, error: `"${text}": a reporting limit cannot be negative.` };
    const below = censored[1]!.startsWith("<") || censored[1] === "≤";
    return { ok: true, reading: below ? { kind: "below", limit } : { kind: "above", limit } };
  }
  if (/\d[.,]\d{3}[.,]\d/.test(text) || (text.includes(",") && text.includes("."))) {
    return { ok: false, error: `"${text}" mixes decimal marks; use one decimal mark and no thousands separator.` };
  }
  const value = parseDecimal(text);
  if (value === null) return { ok: false, error: `"${text}" is not a number, "<" or ">" a number, or "n.d.".` };
  return { ok: true, reading: { kind: "value", value } };
}

export function formatReading(r: Reading, digits: number): string {
  switch (r.kind) {
    case "value":
      return r.value.toFixed(digits);
    case "below":
      return r.limit === null ? "n.d." : `< ${r.limit.toFixed(digits)}`;
    case "above":
      return `> ${r.limit.toFixed(digits)}`;
    case "presence":
      return r.present ? "present" : "absent";
  }
}
