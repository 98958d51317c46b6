/**
 * How every CSV download is written, so the server's and the browser's exports agree: papaparse's
 * unparse with these options, after a byte-order mark so spreadsheet programs read UTF-8. Every text
 * cell that starts with =, +, -, @, a tab or a carriage return gets a single quote before it, so that
 * no cell is run as a formula (OWASP, "CSV Injection"); numbers stay numbers.
 */
export const CSV_EXPORT_OPTIONS = { escapeFormulae: true } as const;
export const CSV_BOM = "\uFEFF";
