/**
 * Turning a laboratory's CSV export into samples: mapping columns to roles, reading units from
 * headers or from their own column, "value ± U" cells, and row-by-row errors. Parsing the file
 * itself is papaparse's job; this module only sees rows of strings.
 */
import { findParameter, isUnit, parseDecimal, PARAMETERS, type UnitId } from "../engine/index.ts";
import { resultEntrySchema, type ResultEntry } from "./schemas.ts";

export type ColumnRole =
  | { kind: "ignore" }
  | { kind: "lot" }
  | { kind: "vintage" }
  | { kind: "date" }
  /** Wide layout: the column holds one parameter, in this unit. */
  | { kind: "parameter"; parameter: string; unit: UnitId }
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

const ALIASES: Record<string, string> = {
  "free so2": "free_so2", "so2 free": "free_so2", "so2 libre": "free_so2", "free sulphur dioxide": "free_so2", "free sulfur dioxide": "free_so2", fso2: "free_so2",
  "total so2": "total_so2", "so2 total": "total_so2", "total sulphur dioxide": "total_so2", "total sulfur dioxide": "total_so2", tso2: "total_so2",
  va: "volatile_acidity", "volatile acidity": "volatile_acidity", "volatile acid": "volatile_acidity",
  ta: "total_acidity", "total acidity": "total_acidity", "titratable acidity": "total_acidity",
  alcohol: "alcohol", abv: "alcohol", "alcoholic strength": "alcohol", "actual alcohol": "alcohol",
  "residual sugar": "residual_sugar", rs: "residual_sugar", "glucose+fructose": "residual_sugar", "glucose + fructose": "residual_sugar",
  ph: "ph", malic: "malic_acid", "malic acid": "malic_acid", lactic: "lactic_acid", "lactic acid": "lactic_acid", citric: "citric_acid", sorbic: "sorbic_acid",
  do: "dissolved_oxygen", "dissolved oxygen": "dissolved_oxygen", co2: "carbon_dioxide", "carbon dioxide": "carbon_dioxide",
  turbidity: "turbidity", cu: "copper", copper: "copper", fe: "iron", iron: "iron", pb: "lead", lead: "lead", tca: "tca",
  "heat test": "heat_test_haze", "heat stability": "heat_test_haze", "protein stability": "heat_test_haze",
  "4-ep": "ethylphenol_4", "4-eg": "ethylguaiacol_4", methanol: "methanol", ota: "ochratoxin_a", density: "density",
};

const UNIT_ALIASES: Record<string, UnitId> = {
  "mg/l": "mg/L", "g/l": "g/L", "ug/l": "µg/L", "µg/l": "µg/L", "ng/l": "ng/L", ppm: "ppm", "mg/kg": "mg/kg", "µg/kg": "µg/kg", "ug/kg": "µg/kg",
  "%vol": "% vol", "% vol": "% vol", "%v/v": "% vol", "% v/v": "% vol", "%abv": "% vol", "meq/l": "meq/L",
  "g/l tartaric": "g/L as tartaric acid", "g/l as tartaric": "g/L as tartaric acid", "g/l tartaric acid": "g/L as tartaric acid",
  "g/l acetic": "g/L as acetic acid", "g/l as acetic": "g/L as acetic acid", "g/l acetic acid": "g/L as acetic acid",
  "g/l sulfuric": "g/L as sulfuric acid", "g/l sulphuric": "g/L as sulfuric acid", "g/l h2so4": "g/L as sulfuric acid",
  ntu: "NTU", "cfu/ml": "CFU/mL", "cfu/100ml": "CFU/100 mL", "cfu/100 ml": "CFU/100 mL", "cfu/l": "CFU/L", ph: "pH", "g/ml": "g/mL", "%": "%",
};

const squash = (s: string) => s.toLowerCase().replace(/\s+/g, " ").trim();

export function normaliseUnit(text: string): UnitId | null {
  const t = text.trim();
  if (isUnit(t)) return t;
  return UNIT_ALIASES[squash(t).replace(/\s*\/\s*/g, "/").replace(/\(|\)/g, "")] ?? UNIT_ALIASES[squash(t)] ?? null;
}

export function findParameterByName(text: string): string | null {
  const t = squash(text);
  const byId = findParameter(t.replace(/[ -]/g, "_"));
  if (byId) return byId.id;
  const byName = PARAMETERS.find((p) => squash(p.name) === t);
  return byName?.id ?? ALIASES[t] ?? null;
}

/** "Free SO2 (mg/L)" or "VA [g/L acetic]" → parameter and unit. */
export function parseHeader(header: string): { parameter: string | null; unit: UnitId | null } {
  const m = header.match(/^(.*?)\s*[([]\s*([^)\]]+)\s*[)\]]\s*$/);
  const name = (m ? m[1]! : header).trim();
  return { parameter: findParameterByName(name), unit: m ? normaliseUnit(m[2]!) : null };
}

export function guessMapping(headers: readonly string[]): ColumnRole[] {
  const roles = headers.map((h): ColumnRole => {
    const t = squash(h);
    if (/^(lot|lot code|lot no\.?|lot number|batch|sample id|sample)$/.test(t)) return { kind: "lot" };
    if (/^(vintage|harvest|harvest year)$/.test(t)) return { kind: "vintage" };
    if (/^(date|sample date|sampling date|sampled)$/.test(t)) return { kind: "date" };
    if (/^(parameter|analyte|determinand|test)$/.test(t)) return { kind: "parameter-name" };
    if (/^(value|result)$/.test(t)) return { kind: "value" };
    if (/^(unit|units)$/.test(t)) return { kind: "unit" };
    if (/^(uncertainty|u|expanded uncertainty|±|\+\/-)$/.test(t)) return { kind: "uncertainty" };
    if (/^(method|method ref(erence)?)$/.test(t)) return { kind: "method" };
    const { parameter, unit } = parseHeader(h);
    if (parameter) return { kind: "parameter", parameter, unit: unit ?? (findParameter(parameter)!.unit as UnitId) };
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

function entry(parameter: string, cell: string, unit: UnitId, extra: { uncertainty?: string; method?: string }): { ok: true; value: ResultEntry } | { ok: false; message: string } {
  const { raw, uncertainty } = splitPlusMinus(cell);
  const u = extra.uncertainty?.trim() ? parseDecimal(extra.uncertainty) : uncertainty;
  if ((extra.uncertainty?.trim() && u === null) || (uncertainty === null && /±|\+\/-/.test(cell))) return { ok: false, message: `"${cell}": the uncertainty is not a number.` };
  const parsed = resultEntrySchema.safeParse({ parameter, raw, unit, uncertainty: u === null ? null : { kind: "expanded", value: u, k: 2 }, method: extra.method?.trim() || null });
  if (!parsed.success) return { ok: false, message: parsed.error.issues.map((i) => i.message).join(" ") };
  return { ok: true, value: parsed.data };
}

/**
 * Rows (without the header) → samples, plus every problem with its row number (1-based, as a
 * spreadsheet shows data rows) and column. Rows with errors are left out, never half-imported.
 */
export function buildSamples(headers: readonly string[], rows: readonly (readonly string[])[], mapping: readonly ColumnRole[], defaults: { sampleDate: string }): { samples: ImportSample[]; errors: RowError[] } {
  const errors: RowError[] = [];
  const col = (kind: ColumnRole["kind"]) => mapping.findIndex((m) => m.kind === kind);
  const lotCol = col("lot");
  if (lotCol < 0) return { samples: [], errors: [{ row: 0, column: null, message: "Map one column to the lot code." }] };
  const long = col("parameter-name") >= 0;
  if (long && col("value") < 0) return { samples: [], errors: [{ row: 0, column: null, message: "Map one column to the result value." }] };
  if (!long && !mapping.some((m) => m.kind === "parameter")) return { samples: [], errors: [{ row: 0, column: null, message: "Map at least one column to a parameter." }] };
  const vintageCol = col("vintage");
  const dateCol = col("date");
  const byKey = new Map<string, ImportSample>();

  rows.forEach((cells, i) => {
    const rowNo = i + 1;
    if (cells.every((c) => !c || !c.trim())) return;
    const lotCode = (cells[lotCol] ?? "").trim();
    if (!lotCode) return errors.push({ row: rowNo, column: headers[lotCol] ?? null, message: "The lot code is empty." });
    const vintageText = vintageCol >= 0 ? (cells[vintageCol] ?? "").trim() : "";
    const vintage = vintageText ? Number(vintageText) : null;
    if (vintageText && !(Number.isInteger(vintage) && vintage! >= 1950 && vintage! <= 2100)) return errors.push({ row: rowNo, column: headers[vintageCol] ?? null, message: `"${vintageText}" is not a vintage.` });
    const dateText = dateCol >= 0 ? (cells[dateCol] ?? "").trim() : "";
    const sampleDate = dateText ? normaliseDate(dateText) : defaults.sampleDate;
    if (!sampleDate) return errors.push({ row: rowNo, column: headers[dateCol] ?? null, message: `"${dateText}" is not a date; use 2026-03-31 or 31/03/2026.` });

    const results: ResultEntry[] = [];
    let bad = false;
    if (long) {
      const name = (cells[col("parameter-name")] ?? "").trim();
      const parameter = findParameterByName(name);
      const unitText = col("unit") >= 0 ? (cells[col("unit")] ?? "").trim() : "";
      const unit = unitText ? normaliseUnit(unitText) : parameter ? (findParameter(parameter)!.unit as UnitId) : null;
      if (!parameter) {
        errors.push({ row: rowNo, column: headers[col("parameter-name")] ?? null, message: `"${name}" is not a parameter Cellarpact knows.` });
        bad = true;
      } else if (!unit) {
        errors.push({ row: rowNo, column: headers[col("unit")] ?? null, message: `"${unitText}" is not a unit Cellarpact knows.` });
        bad = true;
      } else {
        const r = entry(parameter, cells[col("value")] ?? "", unit, { uncertainty: col("uncertainty") >= 0 ? cells[col("uncertainty")] : undefined, method: col("method") >= 0 ? cells[col("method")] : undefined });
        if (r.ok) results.push(r.value);
        else {
          errors.push({ row: rowNo, column: headers[col("value")] ?? null, message: r.message });
          bad = true;
        }
      }
    } else {
      mapping.forEach((m, c) => {
        if (m.kind !== "parameter") return;
        const cell = (cells[c] ?? "").trim();
        if (!cell) return;
        const r = entry(m.parameter, cell, m.unit, {});
        if (r.ok) results.push(r.value);
        else {
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
        errors.push({ row: rowNo, column: null, message: `${findParameter(r.parameter)!.name} appears twice for lot ${lotCode} on ${sampleDate}.` });
        return;
      }
    }
    sample.results.push(...results);
    sample.rows.push(rowNo);
    sample.vintage ??= vintage;
    byKey.set(key, sample);
  });
  return { samples: [...byKey.values()], errors };
}
