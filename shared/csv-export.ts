/**
 * CSV for download, the same way everywhere: a byte-order mark so spreadsheet programs read UTF-8,
 * and every text cell that starts with =, +, -, @, a tab or a carriage return prefixed with a single
 * quote, so that no cell is run as a formula (OWASP, "CSV Injection"). Numbers stay numbers.
 */
import Papa from "papaparse";

export const toCsv = (rows: readonly object[]): string => `\uFEFF${Papa.unparse(rows as object[], { escapeFormulae: true })}`;
