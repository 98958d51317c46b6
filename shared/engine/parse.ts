/**
 * Reads a result as laboratories write it: decimal commas or points, thousands separators,
 * "<0.5", "≤ 0.5", "<= 0.5", "< LOQ (0.5)", "n.d.", "n.q.", "tr.", "> 300", "0.82 ± 0.05",
 * a trailing unit, a Unicode minus. A censored result stays censored; it is never turned into a
 * number. Anything that cannot be read is refused with a message that names the text.
 */
import { UNITS, type UnitId } from "./units.ts";

export type Reading =
  | { kind: "value"; value: number }
  /** Below the limit of quantification (or detection). limit is null when the lab gave none ("n.d."). */
  | { kind: "below"; limit: number | null }
  /** Above the top of the working range, e.g. "> 300". */
  | { kind: "above"; limit: number }
  | { kind: "presence"; present: boolean };

/** How a laboratory writes numbers: "point" for 1,234.5, "comma" for 1.234,5 (or 1 234,5). */
export type NumberFormat = "point" | "comma";

export type ParseResult =
  | {
      ok: true;
      reading: Reading;
      /** An expanded uncertainty written in the cell ("0.82 ± 0.05"), taken with k = 2. */
      uncertainty?: { kind: "expanded"; value: number; k: number };
      /** A unit written after the number, when one was. */
      unit?: UnitId;
    }
  | { ok: false; error: string };

export interface ParseOptions {
  loq?: number | null;
  presence?: boolean;
  /** The laboratory's number format; without it a single mark is a decimal mark. */
  numberFormat?: NumberFormat;
  /** The unit the result is expected in; a different unit written after the number is refused. */
  unit?: UnitId | string;
}

const NOT_DETECTED =
  /^(n\.?\s?d\.?|not detected|non détecté|non rilevato|no detectado|nicht nachweisbar|not quantified|n\.?\s?q\.?|tr\.?|traces?|< ?loq|< ?lod|< ?lq|< ?ld|< ?l\.?o\.?q\.?)$/i;
/** "< LOQ (0.5)", "<LQ 0,5", "< LOD = 0.2": the reporting limit named, then given. */
const NAMED_LIMIT = /^(?:<|≤|<=)\s*(?:l\.?o\.?q\.?|l\.?o\.?d\.?|l\.?q\.?|l\.?d\.?)\s*[(=:]?\s*([^)]+?)\s*\)?$/i;
const PRESENT = /^(present|detected|positive|yes|crystals?|deposit)$/i;
const ABSENT = /^(absent|none|negative|no|no deposit|clear)$/i;
const MINUS = /[\u2212\u2012\u2013]/g;

const UNIT_BY_TEXT = new Map(
  Object.keys(UNITS).flatMap((id) => [
    [id.toLowerCase(), id as UnitId],
    [UNITS[id as UnitId].label.toLowerCase(), id as UnitId],
  ]),
);

/**
 * One number written with a point or a comma as decimal mark. Thousands may be grouped with spaces
 * (either format), commas (point format) or points (comma format). When both marks appear the last
 * is the decimal mark. A single mark followed by exactly three digits ("1.234") reads two ways: the
 * laboratory's stated format decides; without one, a single mark is a decimal mark, as a person
 * typing one result means it.
 */
export function readNumber(text: string, format?: NumberFormat): { value: number } | { error: "unreadable" } {
  let t = text
    .trim()
    .replace(MINUS, "-")
    .replace(/[\u00a0\u202f\u2009 ](?=\d{3}(\D|$))/g, "");
  if (!/^[+-]?[\d.,]+([eE][+-]?\d+)?$/.test(t) || !/\d/.test(t)) return { error: "unreadable" };
  const points = (t.match(/\./g) ?? []).length;
  const commas = (t.match(/,/g) ?? []).length;
  const grouped = (mark: string) => new RegExp(`^[+-]?\\d{1,3}(\\${mark}\\d{3})+$`).test(t);
  if (points && commas) {
    const decimal = t.lastIndexOf(".") > t.lastIndexOf(",") ? "." : ",";
    const thousands = decimal === "." ? "," : ".";
    const [whole, frac] = [t.slice(0, t.lastIndexOf(decimal)), t.slice(t.lastIndexOf(decimal) + 1)];
    if (!new RegExp(`^[+-]?\\d{1,3}(\\${thousands}\\d{3})*$`).test(whole) || !/^\d+([eE][+-]?\d+)?$/.test(frac))
      return { error: "unreadable" };
    t = `${whole.replaceAll(thousands, "")}.${frac}`;
  } else if (points + commas > 1) {
    const mark = points ? "." : ",";
    // Only thousands can repeat: "1.234.567" in the comma format, "1,234,567" in the point format.
    if (!grouped(mark) || (format && (mark === "." ? format === "point" : format === "comma"))) return { error: "unreadable" };
    t = t.replaceAll(mark, "");
  } else if (points + commas === 1) {
    const mark = points ? "." : ",";
    if (grouped(mark) && !/^[+-]?0[.,]/.test(t)) {
      // "1.234" or "12,500": a thousands group or three decimals.
      const isDecimal = !format || (mark === "." ? format === "point" : format === "comma");
      t = isDecimal ? t.replace(mark, ".") : t.replace(mark, "");
    } else {
      if (!/^[+-]?(\d+[.,]\d+|[.,]\d+)([eE][+-]?\d+)?$/.test(t)) return { error: "unreadable" };
      t = t.replace(",", ".");
    }
  }
  const n = Number(t);
  return Number.isFinite(n) ? { value: n } : { error: "unreadable" };
}

/** One number written with a point or a comma as decimal mark; null when it cannot be read. */
export function parseDecimal(text: string, format?: NumberFormat): number | null {
  const r = readNumber(text, format);
  return "value" in r ? r.value : null;
}

function numberError(whole: string): string {
  return `"${whole}" is not a number, "<" or ">" a number, or "n.d.".`;
}

/** Splits a trailing unit off ("0.82 g/L" → "0.82", g/L); a unit other than the expected one is an error. */
function trailingUnit(text: string, whole: string, expected: string | undefined): { rest: string; unit?: UnitId } | { error: string } {
  const m = text.match(/^(.*?\d)\s*([a-zA-Zµμ%°][^\d]*)$/);
  if (!m) return { rest: text };
  const unit = UNIT_BY_TEXT.get(m[2]!.trim().replace("μ", "µ").toLowerCase());
  if (!unit) return { error: `"${whole}": "${m[2]!.trim()}" is not a unit Cellarpact knows.` };
  if (expected && unit !== expected)
    return {
      error: `"${whole}" is in ${unit}, but this result is expected in ${UNITS[expected as UnitId]?.label ?? expected}; convert it or choose that unit.`,
    };
  return { rest: m[1]!, unit };
}

/**
 * Most cells are a plain number that reads one way only ("12,5", "0.350", "98"): no sign, no
 * group, and not one mark followed by exactly three digits unless the whole part is 0.
 */
const PLAIN = /^(?:\d+|\d+[.,](?:\d{1,2}|\d{4,})|0[.,]\d+)$/;

export function parseReading(raw: string, opts: ParseOptions = {}): ParseResult {
  // The common case read at import speed; it answers exactly what the general rules below would.
  if (!opts.presence && PLAIN.test(raw)) return { ok: true, reading: { kind: "value", value: Number(raw.replace(",", ".")) } };
  const text = raw.trim().replace(MINUS, "-");
  if (text === "") return { ok: false, error: "No result given." };
  if (opts.presence) {
    if (PRESENT.test(text)) return { ok: true, reading: { kind: "presence", present: true } };
    if (ABSENT.test(text)) return { ok: true, reading: { kind: "presence", present: false } };
    return { ok: false, error: `"${text}" is not a presence result; write "absent" or "present".` };
  }
  if (NOT_DETECTED.test(text)) return { ok: true, reading: { kind: "below", limit: opts.loq ?? null } };

  // "0.82 ± 0.05": the value with its expanded uncertainty.
  const pm = text.match(/^(.*?)\s*(?:±|\+\/-|\+-)\s*(.+)$/);
  if (pm) {
    const value = parseReading(pm[1]!, opts);
    if (!value.ok) return value;
    if (value.reading.kind !== "value")
      return { ok: false, error: `"${text}": an uncertainty goes with a measured value, not a censored one.` };
    const u = trailingUnit(pm[2]!, text, opts.unit ?? value.unit);
    if ("error" in u) return { ok: false, error: u.error };
    const n = readNumber(u.rest, opts.numberFormat);
    if (!("value" in n)) return { ok: false, error: `"${text}": the uncertainty "${pm[2]}" is not a number.` };
    if (n.value < 0) return { ok: false, error: `"${text}": an uncertainty cannot be negative.` };
    return { ...value, uncertainty: { kind: "expanded", value: n.value, k: 2 }, ...(u.unit ? { unit: u.unit } : {}) };
  }

  const named = text.match(NAMED_LIMIT);
  if (named) {
    const limit = readNumber(named[1]!, opts.numberFormat);
    if (!("value" in limit)) return { ok: false, error: numberError(text) };
    if (limit.value < 0) return { ok: false, error: `"${text}": a reporting limit cannot be negative.` };
    return { ok: true, reading: { kind: "below", limit: limit.value } };
  }

  const censored = text.match(/^(<=|>=|<|≤|>|≥)\s*(.+)$/);
  const body = censored ? censored[2]! : text;
  const u = trailingUnit(body, text, opts.unit);
  if ("error" in u) return { ok: false, error: u.error };
  const n = readNumber(u.rest, opts.numberFormat);
  if (!("value" in n)) return { ok: false, error: censored ? `"${text}" has no number after ${censored[1]}.` : numberError(text) };
  const unit = u.unit ? { unit: u.unit } : {};
  if (censored) {
    if (n.value < 0) return { ok: false, error: `"${text}": a reporting limit cannot be negative.` };
    const below = censored[1]!.startsWith("<") || censored[1] === "≤";
    return { ok: true, reading: below ? { kind: "below", limit: n.value } : { kind: "above", limit: n.value }, ...unit };
  }
  if (n.value < 0) return { ok: false, error: `"${text}": a measured result cannot be negative.` };
  return { ok: true, reading: { kind: "value", value: n.value }, ...unit };
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
