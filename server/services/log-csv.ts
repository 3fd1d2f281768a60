import type { LogEntry } from '../../shared/api/board';

const COLUMNS: [header: string, value: (e: LogEntry) => string | number | null][] = [
  ['id', (e) => e.id],
  ['at', (e) => e.at],
  ['day', (e) => e.day],
  ['room', (e) => e.roomName],
  ['exam', (e) => e.examAccession],
  ['clean type', (e) => e.cleanType],
  ['entry', (e) => e.kind],
  ['step', (e) => e.stepLabel ?? e.stepKey],
  ['product', (e) => e.productName],
  ['contact required (min)', (e) => e.contactRequiredMinutes],
  ['contact achieved (min)', (e) => e.contactAchievedMinutes],
  ['early because', (e) => e.earlyReason],
  ['note', (e) => e.note],
  ['corrects', (e) => e.correctsId],
  ['username', (e) => e.username],
  ['name', (e) => e.displayName],
];

/**
 * A cell a spreadsheet will show as text: one starting with `=`, `+`, `-` or `@` (or a tab or
 * carriage return, which some spreadsheets strip before looking) would otherwise be evaluated
 * as a formula, so it gets a leading `'`.
 */
export function spreadsheetSafe(value: string): string {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** RFC 4180 quoting: a cell with a comma, quote or line break is quoted, quotes doubled. */
function quoted(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

/** The log as CSV: a header row, then one row per entry, CRLF line ends. */
export function logCsv(entries: readonly LogEntry[]): string {
  const lines = [COLUMNS.map(([header]) => header).join(',')];
  for (const entry of entries) {
    lines.push(COLUMNS.map(([, value]) => quoted(spreadsheetSafe(String(value(entry) ?? '')))).join(','));
  }
  return lines.join('\r\n') + '\r\n';
}
