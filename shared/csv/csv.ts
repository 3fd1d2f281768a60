/**
 * CSV the way a spreadsheet reads it safely, for the server's exports and the client's alike.
 * OWASP's CSV injection guidance: a cell starting with `=`, `+`, `-` or `@` (or a tab or carriage
 * return, which some spreadsheets strip before looking) would be evaluated as a formula.
 */

/** The cell as text a spreadsheet shows as text: a formula-like start gets a leading `'`. */
export function spreadsheetSafe(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** RFC 4180 quoting: a cell with a comma, quote or line break is quoted, quotes doubled. */
export function quoted(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

export type CsvCell = string | number | null | undefined;

/** Rows (the first the header) as CSV: every cell made safe and quoted, CRLF line ends. */
export function toCsv(rows: readonly (readonly CsvCell[])[]): string {
  return rows.map((row) => row.map((cell) => quoted(spreadsheetSafe(String(cell ?? '')))).join(',')).join('\r\n') + '\r\n';
}
