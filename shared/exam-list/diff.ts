import { DateTime } from 'luxon';
import { canonicalInstant } from '../turnover/zoned-time';
import type { ExamListColumn } from './columns';
import type { ExamListRow } from './model';

/**
 * The fields of an exam that a re-import compares, whether the exam comes from the file or
 * from the stored day list.
 *
 * @example
 * const stored: ExamListKeyed = { accession: 'A1', room: 'MR 1', start: '2027-03-15T08:00:00-05:00',
 *   durationMinutes: 30, procedure: 'MR knee', coil: 'knee', precaution: 'none',
 *   mobility: 'ambulatory', contrast: false, notes: null };
 */
export type ExamListKeyed = Omit<ExamListRow, 'row'>;

/**
 * What a re-import would do to the stored day list.
 *
 * @example
 * const diff: ExamListDiff = { added: ['A4'], changed: [{ accession: 'A3', fields: ['room'], values: [{ column: 'room', from: 'MR 1', to: 'MR 2' }] }], removed: ['A2'], unchanged: 7 };
 */
export interface ExamListDiff {
  /** Accessions only in the file, in file order. */
  added: string[];
  /**
   * Accessions in both whose fields differ, in file order, naming the changed file columns, and
   * each change as the day has it and as the file has it (`values`, in `fields` order).
   */
  changed: { accession: string; fields: string[]; values: ExamListFieldChange[] }[];
  /** Accessions only in the stored list, in stored order. */
  removed: string[];
  unchanged: number;
}

/**
 * One field a re-import changes: as the stored day has it (`from`) and as the file has it (`to`),
 * as text (a start as its ISO time, contrast as yes or no, a missing value as '').
 */
export interface ExamListFieldChange {
  column: ExamListColumn;
  from: string;
  to: string;
}

// Named by the file's columns, since the preview shows them next to the file the user edited.
const COMPARED: { column: ExamListColumn; same: (a: ExamListKeyed, b: ExamListKeyed) => boolean }[] = [
  { column: 'room', same: (a, b) => a.room === b.room },
  // Compared as instants, so 08:00-05:00 and 13:00Z are the same start.
  { column: 'start', same: (a, b) => instant(a.start) === instant(b.start) },
  { column: 'duration_min', same: (a, b) => a.durationMinutes === b.durationMinutes },
  { column: 'procedure', same: (a, b) => a.procedure === b.procedure },
  // A missing value may be stored as null or as an empty string; both mean "none".
  { column: 'coil', same: (a, b) => (a.coil ?? '') === (b.coil ?? '') },
  { column: 'precaution', same: (a, b) => a.precaution === b.precaution },
  { column: 'mobility', same: (a, b) => a.mobility === b.mobility },
  { column: 'contrast', same: (a, b) => a.contrast === b.contrast },
  { column: 'notes', same: (a, b) => (a.notes ?? '') === (b.notes ?? '') },
];

/** A field of an exam as text, by its file column. */
function asText(exam: ExamListKeyed, column: ExamListColumn): string {
  switch (column) {
    case 'room': return exam.room;
    case 'start': return exam.start;
    case 'duration_min': return String(exam.durationMinutes);
    case 'procedure': return exam.procedure;
    case 'coil': return exam.coil ?? '';
    case 'precaution': return exam.precaution;
    case 'mobility': return exam.mobility;
    case 'contrast': return exam.contrast ? 'yes' : 'no';
    case 'notes': return exam.notes ?? '';
    default: return '';
  }
}

// Stored and imported starts are nearly always the canonical form, read without luxon's cost.
function instant(iso: string): number {
  const ms = canonicalInstant(iso);
  return Number.isNaN(ms) ? DateTime.fromISO(iso).toMillis() : ms;
}

/**
 * Compares the stored day list with an incoming one, keyed by accession (unique within each
 * list, which {@link parseExamTable} guarantees for the file). An unparseable start never
 * compares equal, so it shows as changed rather than hiding a difference.
 *
 * @example
 * const a = { accession: 'A1', room: 'MR 1', start: '2027-03-15T08:00:00-05:00', durationMinutes: 30,
 *   procedure: 'MR knee', coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null } as const;
 * diffExamLists([a], [{ ...a, start: '2027-03-15T13:00:00Z' }, { ...a, accession: 'A2', durationMinutes: 45 }]);
 * // { added: ['A2'], changed: [], removed: [], unchanged: 1 }
 */
export function diffExamLists(current: ExamListKeyed[], incoming: ExamListKeyed[]): ExamListDiff {
  const stored = new Map(current.map((exam) => [exam.accession, exam]));
  const incomingAccessions = new Set(incoming.map((exam) => exam.accession));
  const diff: ExamListDiff = { added: [], changed: [], removed: [], unchanged: 0 };

  for (const exam of incoming) {
    const before = stored.get(exam.accession);
    if (!before) {
      diff.added.push(exam.accession);
      continue;
    }
    const fields = COMPARED.filter(({ same }) => !same(before, exam)).map(({ column }) => column);
    if (fields.length > 0) diff.changed.push({ accession: exam.accession, fields, values: fields.map((column) => ({ column, from: asText(before, column), to: asText(exam, column) })) });
    else diff.unchanged += 1;
  }
  diff.removed = current.filter((exam) => !incomingAccessions.has(exam.accession)).map((exam) => exam.accession);
  return diff;
}
