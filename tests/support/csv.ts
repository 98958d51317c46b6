/** Reads a CSV the way the client does: papaparse detects the delimiter and drops the BOM. */
import Papa from "papaparse";
import { buildSamples, guessMapping } from "../../shared/lots/csv.ts";

export function readCsv(text: string, sampleDate = "2026-03-01") {
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: "greedy" });
  const [headers = [], ...rows] = parsed.data;
  const mapping = guessMapping(headers);
  return { headers, mapping, ...buildSamples(headers, rows, mapping, { sampleDate }) };
}
