import type { LogEntry } from '../../shared/api/board';
import { toCsv } from '../../shared/csv/csv';

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

/** The log as CSV: a header row, then one row per entry (formula-like cells escaped, CRLF line ends). */
export function logCsv(entries: readonly LogEntry[]): string {
  return toCsv([COLUMNS.map(([header]) => header), ...entries.map((entry) => COLUMNS.map(([, value]) => value(entry)))]);
}
