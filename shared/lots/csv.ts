/**
 * Turning a laboratory's CSV export into samples: mapping columns to roles, reading units from
 * headers or from their own column, "value ± U" cells, and row-by-row errors. Parsing the file
 * itself is papaparse's job; this module only sees rows of strings.
 */
import {
  acceptsUnit,
  findParameter,
  implausibility,
  isUnit,
  parseDecimal,
  parseReading,
  PARAMETERS,
  type NumberFormat,
  type UnitId,
} from "../engine/index.ts";
import { foldHeader, parameterForHeaderName } from "./header-synonyms.ts";
import { resultEntrySchema, type ResultEntry } from "./schemas.ts";

export type ColumnRole =
  | { kind: "ignore" }
  | { kind: "lot" }
  | { kind: "vintage" }
  | { kind: "date" }
  /** Wide layout: the column holds one parameter, in this unit; null until the file or the user says which. */
  | { kind: "parameter"; parameter: string; unit: UnitId | null; headerUnit?: string | null }
  /** Long layout: one result per row, in these columns. */
  | { kind: "parameter-name" }
  | { kind: "value" }
  | { kind: "unit" }
  | { kind: "uncertainty" }
  | { kind: "method" };

export interface ImportSample {
  lotCode: string;
  vintage: number | null;
  sampleDate: string;
  results: ResultEntry[];
  /** 1-based data row numbers the sample came from. */
  rows: number[];
}

export interface RowError {
  row: number;
  column: string | null;
  message: string;
}

const UNIT_ALIASES: Record<string, UnitId> = {
  "mg/l": "mg/L",
  "mg/dm3": "mg/L",
  "g/l": "g/L",
  "g/dm3": "g/L",
  "ug/l": "µg/L",
  "µg/l": "µg/L",
  "mcg/l": "µg/L",
  "ng/l": "ng/L",
  ppm: "ppm",
  "mg/kg": "mg/kg",
  "µg/kg": "µg/kg",
  "ug/kg": "µg/kg",
  "%vol": "% vol",
  "% vol": "% vol",
  "% vol.": "% vol",
  "%v/v": "% vol",
  "% v/v": "% vol",
  "vol%": "% vol",
  "vol.%": "% vol",
  "% vol%": "% vol",
  "%abv": "% vol",
  "% abv": "% vol",
  "meq/l": "meq/L",
  "mequiv/l": "meq/L",
  ntu: "NTU",
  "cfu/ml": "CFU/mL",
  "ufc/ml": "CFU/mL",
  "kbe/ml": "CFU/mL",
  "cfu/100ml": "CFU/100 mL",
  "cfu/100 ml": "CFU/100 mL",
  "ufc/100ml": "CFU/100 mL",
  "cfu/l": "CFU/L",
  ph: "pH",
  "g/ml": "g/mL",
  "g/cm3": "g/mL",
  "kg/m3": "kg/m³",
  "%": "%",
  "g/l ethanol": "g/L ethanol",
};

/** Words for the acid an acidity is expressed as, in the usual spellings of the six languages. */
const ACID_EXPRESSIONS: [RegExp, "tartaric" | "sulfuric" | "acetic"][] = [
  [/h2so4|sul(f|ph)ur|sulfuri|solforic|schwefel/, "sulfuric"],
  [/tartar|tartri|wein/, "tartaric"],
  [/acet|essig/, "acetic"],
];

const squash = (s: string) => foldHeader(s).replace(/\s*\/\s*/g, "/");

/**
 * The unit a laboratory wrote, in its usual spellings ("g/L H2SO4", "g/l as sulfuric", "g/L tartaric",
 * "meq/L", "mg/l", "ppm", "% vol", "% v/v"); null when it cannot be read. An acid expression is
 * read only when the text names the acid: "g/L" alone stays plain g/L.
 */
export function normaliseUnit(text: string): UnitId | null {
  const t = text.trim();
  if (isUnit(t)) return t;
  const plain = squash(t)
    .replace(/[()[\]]/g, "")
    .trim();
  if (UNIT_ALIASES[plain]) return UNIT_ALIASES[plain];
  const acid = ACID_EXPRESSIONS.find(([re]) => re.test(plain))?.[1];
  if (acid) {
    if (/^g\/100 ?ml/.test(plain)) return acid === "acetic" ? "g/100 mL as acetic acid" : null;
    if (/^g\/(l|dm3)\b/.test(plain)) return `g/L as ${acid} acid` as UnitId;
  }
  return null;
}

export function findParameterByName(text: string): string | null {
  const t = foldHeader(text);
  const byId = findParameter(t.replace(/[ -]/g, "_"));
  if (byId) return byId.id;
  const byName = PARAMETERS.find((p) => foldHeader(p.name) === t);
  return byName?.id ?? parameterForHeaderName(t);
}

/**
 * "Free SO2 (mg/L)", "VA [g/L acetic]", "Acidité volatile (g/L H2SO4)", "SO2 libre, mg/l" →
 * parameter and unit. `unitText` is what the header said about the unit, read or not.
 */
export function parseHeader(header: string): { parameter: string | null; unit: UnitId | null; unitText: string | null } {
  const bracket = header.match(/^(.*?)\s*[([]\s*([^)\]]+)\s*[)\]]\s*$/);
  const comma = bracket ? null : header.match(/^(.*?)\s*(?:,|;| - | in | en )\s*(\S.*)$/i);
  const m = bracket ?? comma;
  if (m) {
    const parameter = findParameterByName(m[1]!);
    if (parameter || bracket) return { parameter, unit: normaliseUnit(m[2]!), unitText: m[2]!.trim() };
  }
  return { parameter: findParameterByName(header), unit: null, unitText: null };
}

/**
 * The unit a parameter's values are read in: the one the file states, if the parameter can be
 * reported in it; the parameter's only unit when it has just one (pH, NTU); otherwise null, and
 * the mapping step asks. Never a guess.
 */
export function statedUnit(parameterId: string, unit: UnitId | null): UnitId | null {
  const p = findParameter(parameterId);
  if (!p) return null;
  if (unit) return acceptsUnit(p, unit) ? unit : null;
  return p.units.length === 1 ? (p.units[0] as UnitId) : null;
}

export function guessMapping(headers: readonly string[]): ColumnRole[] {
  const roles = headers.map((h): ColumnRole => {
    const t = foldHeader(h);
    // The usual column names in English, French, Italian, Spanish, German and Portuguese (folded: no accents).
    if (/^(lot|lot code|lot no\.?|lot number|batch|sample id|sample|lotto|lote|partie|charge|numero de lot|n° lot)$/.test(t))
      return { kind: "lot" };
    if (/^(vintage|harvest|harvest year|millesime|annata|vendemmia|cosecha|anada|jahrgang|colheita)$/.test(t)) return { kind: "vintage" };
    if (
      /^(date|sample date|sampling date|sampled|date de prelevement|date d'analyse|data|data prelievo|data di campionamento|fecha|fecha de muestreo|datum|probenahmedatum|data de amostragem|data da colheita da amostra)$/.test(
        t,
      )
    )
      return { kind: "date" };
    if (/^(parameter|analyte|determinand|test|parametre|parametro|parameter name|analyse|analisi|analisis|analise)$/.test(t))
      return { kind: "parameter-name" };
    if (/^(value|result|valeur|resultat|valore|risultato|valor|resultado|wert|ergebnis)$/.test(t)) return { kind: "value" };
    if (/^(unit|units|unite|unita|unidad|einheit|unidade)$/.test(t)) return { kind: "unit" };
    if (/^(uncertainty|u|expanded uncertainty|±|\+\/-|incertitude|incertezza|incertidumbre|messunsicherheit|incerteza)$/.test(t))
      return { kind: "uncertainty" };
    if (/^(method|method ref(erence)?|methode|metodo|methode ref)$/.test(t)) return { kind: "method" };
    const { parameter, unit, unitText } = parseHeader(h);
    if (parameter) return { kind: "parameter", parameter, unit: statedUnit(parameter, unit), headerUnit: unitText };
    return { kind: "ignore" };
  });
  return roles;
}

/** dd/mm/yyyy, dd.mm.yyyy or yyyy-mm-dd → yyyy-mm-dd; null when unreadable. */
export function normaliseDate(text: string): string | null {
  const t = text.trim();
  let m = t.match(/^(\d{4})-(\d{1,2})-(\d{1,2})$/);
  if (m) return iso(+m[1]!, +m[2]!, +m[3]!);
  m = t.match(/^(\d{1,2})[./](\d{1,2})[./](\d{4})$/);
  if (m) return iso(+m[3]!, +m[2]!, +m[1]!);
  return null;
}

function iso(y: number, mo: number, d: number): string | null {
  const date = new Date(Date.UTC(y, mo - 1, d));
  if (date.getUTCFullYear() !== y || date.getUTCMonth() !== mo - 1 || date.getUTCDate() !== d) return null;
  return date.toISOString().slice(0, 10);
}

/** "0,45 ± 0,03" → raw "0,45" and an expanded uncertainty of 0.03 (k = 2). */
export function splitPlusMinus(cell: string): { raw: string; uncertainty: number | null } {
  const m = cell.match(/^(.*?)\s*(?:±|\+\/-|\+-)\s*(.+)$/);
  if (!m) return { raw: cell.trim(), uncertainty: null };
  return { raw: m[1]!.trim(), uncertainty: parseDecimal(m[2]!) };
}

function entry(
  parameter: string,
  cell: string,
  unit: UnitId,
  extra: { uncertainty?: string; method?: string },
): { ok: true; value: ResultEntry } | { ok: false; message: string } {
  const { raw, uncertainty } = splitPlusMinus(cell);
  const u = extra.uncertainty?.trim() ? parseDecimal(extra.uncertainty) : uncertainty;
  if ((extra.uncertainty?.trim() && u === null) || (uncertainty === null && /±|\+\/-/.test(cell)))
    return { ok: false, message: `"${cell}": the uncertainty is not a number.` };
  const parsed = resultEntrySchema.safeParse({
    parameter,
    raw,
    unit,
    uncertainty: u === null ? null : { kind: "expanded", value: u, k: 2 },
    method: extra.method?.trim() || null,
  });
  if (!parsed.success) return { ok: false, message: parsed.error.issues.map((i) => i.message).join(" ") };
  return { ok: true, value: parsed.data };
}

/**
 * Rows (without the header) → samples, plus every problem with its row number (1-based, as a
 * spreadsheet shows data rows) and column. Rows with errors are left out, never half-imported.
 */
export function buildSamples(
  headers: readonly string[],
  rows: readonly (readonly string[])[],
  mapping: readonly ColumnRole[],
  defaults: { sampleDate: string; numberFormat?: NumberFormat | null },
): { samples: ImportSample[]; errors: RowError[]; implausible: RowError[] } {
  const errors: RowError[] = [];
  // Values read fine but outside what wine can be: held back until someone confirms them.
  const implausible: RowError[] = [];
  let rowFlags: RowError[] = [];
  const check = (r: ResultEntry, rowNo: number, column: string | null) => {
    const parsed = parseReading(r.raw, {
      presence: findParameter(r.parameter)?.kind === "presence",
      ...(defaults.numberFormat ? { numberFormat: defaults.numberFormat } : {}),
    });
    const why = parsed.ok ? implausibility(r.parameter, parsed.reading, r.unit) : null;
    if (why) rowFlags.push({ row: rowNo, column, message: why });
  };
  const col = (kind: ColumnRole["kind"]) => mapping.findIndex((m) => m.kind === kind);
  const lotCol = col("lot");
  if (lotCol < 0) return { samples: [], implausible, errors: [{ row: 0, column: null, message: "Map one column to the lot code." }] };
  const long = col("parameter-name") >= 0;
  if (long && col("value") < 0)
    return { samples: [], implausible, errors: [{ row: 0, column: null, message: "Map one column to the result value." }] };
  if (!long && !mapping.some((m) => m.kind === "parameter"))
    return { samples: [], implausible, errors: [{ row: 0, column: null, message: "Map at least one column to a parameter." }] };
  const unitless = mapping.flatMap((m, c) => (m.kind === "parameter" && m.unit === null ? [c] : []));
  if (unitless.length) {
    return {
      samples: [],
      implausible,
      errors: unitless.map((c) => {
        const m = mapping[c] as Extract<ColumnRole, { kind: "parameter" }>;
        const said = m.headerUnit
          ? `the header says "${m.headerUnit}", which is not a unit ${findParameter(m.parameter)!.name} can be read in`
          : "the header does not say";
        return {
          row: 0,
          column: headers[c] ?? null,
          message: `Choose the unit of column "${headers[c]}": ${said}. Cellarpact never guesses a unit.`,
        };
      }),
    };
  }

  const vintageCol = col("vintage");
  const dateCol = col("date");
  const byKey = new Map<string, ImportSample>();

  rows.forEach((cells, i) => {
    const rowNo = i + 1;
    rowFlags = [];
    if (cells.every((c) => !c || !c.trim())) return;
    const lotCode = (cells[lotCol] ?? "").trim();
    if (!lotCode) return errors.push({ row: rowNo, column: headers[lotCol] ?? null, message: "The lot code is empty." });
    const vintageText = vintageCol >= 0 ? (cells[vintageCol] ?? "").trim() : "";
    const vintage = vintageText ? Number(vintageText) : null;
    if (vintageText && !(Number.isInteger(vintage) && vintage! >= 1950 && vintage! <= 2100))
      return errors.push({ row: rowNo, column: headers[vintageCol] ?? null, message: `"${vintageText}" is not a vintage.` });
    const dateText = dateCol >= 0 ? (cells[dateCol] ?? "").trim() : "";
    const sampleDate = dateText ? normaliseDate(dateText) : defaults.sampleDate;
    if (!sampleDate)
      return errors.push({
        row: rowNo,
        column: headers[dateCol] ?? null,
        message: `"${dateText}" is not a date; use 2026-03-31 or 31/03/2026.`,
      });

    const results: ResultEntry[] = [];
    let bad = false;
    if (long) {
      const name = (cells[col("parameter-name")] ?? "").trim();
      const parameter = findParameterByName(name);
      const unitText = col("unit") >= 0 ? (cells[col("unit")] ?? "").trim() : "";
      const unit = parameter ? statedUnit(parameter, unitText ? normaliseUnit(unitText) : null) : null;
      if (!parameter) {
        errors.push({
          row: rowNo,
          column: headers[col("parameter-name")] ?? null,
          message: `"${name}" is not a parameter Cellarpact knows.`,
        });
        bad = true;
      } else if (!unit) {
        const name = findParameter(parameter)!.name;
        errors.push({
          row: rowNo,
          column: headers[col("unit")] ?? null,
          message: unitText
            ? `"${unitText}" is not a unit ${name} can be read in.`
            : `No unit for ${name}: map the column that holds each result's unit.`,
        });
        bad = true;
      } else {
        const r = entry(parameter, cells[col("value")] ?? "", unit, {
          uncertainty: col("uncertainty") >= 0 ? cells[col("uncertainty")] : undefined,
          method: col("method") >= 0 ? cells[col("method")] : undefined,
        });
        if (r.ok) {
          results.push(r.value);
          check(r.value, rowNo, headers[col("value")] ?? null);
        } else {
          errors.push({ row: rowNo, column: headers[col("value")] ?? null, message: r.message });
          bad = true;
        }
      }
    } else {
      mapping.forEach((m, c) => {
        if (m.kind !== "parameter") return;
        const cell = (cells[c] ?? "").trim();
        if (!cell) return;
        const r = entry(m.parameter, cell, m.unit!, {});
        if (r.ok) {
          results.push(r.value);
          check(r.value, rowNo, headers[c] ?? null);
        } else {
          errors.push({ row: rowNo, column: headers[c] ?? null, message: r.message });
          bad = true;
        }
      });
      if (!bad && results.length === 0) {
        errors.push({ row: rowNo, column: null, message: "The row has no result." });
        bad = true;
      }
    }
    if (bad) return;
    const key = `${lotCode}|${sampleDate}`;
    const sample = byKey.get(key) ?? { lotCode, vintage, sampleDate, results: [], rows: [] };
    for (const r of results) {
      if (sample.results.some((x) => x.parameter === r.parameter)) {
        errors.push({
          row: rowNo,
          column: null,
          message: `${findParameter(r.parameter)!.name} appears twice for lot ${lotCode} on ${sampleDate}.`,
        });
        return;
      }
    }
    sample.results.push(...results);
    sample.rows.push(rowNo);
    implausible.push(...rowFlags);
    sample.vintage ??= vintage;
    byKey.set(key, sample);
  });
  return { samples: [...byKey.values()], errors, implausible };
}

/** A number with one mark followed by exactly three digits ("1.234", "12,500") reads two ways. */
const TWO_WAYS = /^[+-]?[1-9]\d{0,2}[.,]\d{3}$/;

/**
 * Result cells that read two ways unless the laboratory's number format is known; the import asks
 * for the format once per file when there is any. Returns up to `max` examples.
 */
export function ambiguousNumbers(rows: readonly (readonly string[])[], mapping: readonly ColumnRole[], max = 5): string[] {
  const cols = mapping.flatMap((m, c) => (m.kind === "parameter" || m.kind === "value" ? [c] : []));
  const found: string[] = [];
  for (const row of rows) {
    for (const c of cols) {
      const cell = splitPlusMinus((row[c] ?? "").trim()).raw.replace(/^[<>≤≥]=?\s*/, "");
      if (TWO_WAYS.test(cell) && !found.includes(cell)) found.push(cell);
      if (found.length >= max) return found;
    }
  }
  return found;
}
