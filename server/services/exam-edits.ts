import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { ChangeReason, ExamEdit, ExamFields, ExamFormInput } from '../../shared/api/changes';
import { EXAM_LIST_COLUMNS, parseExamTable, type ExamListRow } from '../../shared/exam-list';
import { NotFoundError, Refusal, ValidationError } from '../errors';
import { examColumns, storedFields, type ExamRow } from './exams';
import { refuseFinished, staleVersion, writeAtVersion } from './exam-moves';
import { recordChange } from './plan-changes';
import { listRooms } from './rooms';
import { readSettings } from './settings';

type Exam = ExamFields & { accession: string };

/**
 * One exam added, edited or cancelled by hand: each is one transaction with one history entry
 * (an `exam` change that undo and redo can revert). Cells are read by the import's own rules,
 * so a form shows the same messages a file would. Each returns the exam's day.
 */
export interface ExamEditRequest {
  userId: number;
  now: Date;
  /** The history's reason; a hand edit's own by default (the HL7 feed says `hl7`). */
  reason?: ChangeReason;
  /** Added to the history entry's summary (the HL7 feed's "after a manual change" flag). */
  note?: string;
}

/** Adds one exam to `day`. 422 for a bad cell (the import's message) or an accession the day already has. */
export async function addExam(db: Knex, day: string, input: ExamFormInput, req: ExamEditRequest): Promise<string> {
  const { row, roomId, timezone } = await readExamForm(db, day, input);
  return db.transaction(async (trx) => {
    await refuseTakenAccession(trx, day, row.accession, null);
    const stamp = req.now.toISOString();
    const [{ id }] = await trx('exams').insert({ ...examColumns(row, roomId), day, version: 1, updated_at: stamp }).returning('id');
    const to = fieldsOf(row, roomId);
    const change: ExamEdit = { type: 'exam', examId: id as number, accession: row.accession, from: null, to };
    await recordChange(trx, { day, userId: req.userId, reason: req.reason ?? 'exam added', summary: `Added ${row.accession}: ${row.room} ${hhmm(row.start, timezone)}, ${row.durationMinutes} min${req.note ?? ''}`, changes: [change] }, req.now);
    return day;
  });
}

/** Replaces an exam's fields; 409 `stale_version` when `version` is not the exam's. */
export async function editExam(db: Knex, examId: number, input: ExamFormInput & { version: number }, req: ExamEditRequest): Promise<string> {
  const current = await db<ExamRow>('exams').where({ id: examId }).first();
  if (!current) throw new NotFoundError(`No exam ${examId}.`);
  const { row, roomId, timezone } = await readExamForm(db, current.day, input);
  return db.transaction(async (trx) => {
    const exam = await trx<ExamRow>('exams').where({ id: examId }).first();
    if (!exam) throw new NotFoundError(`No exam ${examId}.`);
    if (exam.version !== input.version) throw await staleVersion(trx, exam, timezone);
    await refuseFinished(trx, exam, 'edited');
    await refuseTakenAccession(trx, exam.day, row.accession, examId);
    await writeAtVersion(trx, exam, { ...examColumns(row, roomId), updated_at: req.now.toISOString() }, timezone);
    const change: ExamEdit = { type: 'exam', examId, accession: row.accession, from: storedFields(exam), to: fieldsOf(row, roomId) };
    const renamed = exam.accession === row.accession ? '' : ` (was ${exam.accession})`;
    await recordChange(trx, { day: exam.day, userId: req.userId, reason: req.reason ?? 'exam edited', summary: `Edited ${row.accession}${renamed}: ${row.room} ${hhmm(row.start, timezone)}, ${row.durationMinutes} min${req.note ?? ''}`, changes: [change] }, req.now);
    return exam.day;
  });
}

/** Cancels (removes) an exam from its day; 409 `stale_version` when `version` is not the exam's. */
export async function cancelExam(db: Knex, examId: number, version: number, req: ExamEditRequest): Promise<string> {
  const { timezone } = await readSettings(db);
  return db.transaction(async (trx) => {
    const exam = await trx<ExamRow>('exams').where({ id: examId }).first();
    if (!exam) throw new NotFoundError(`No exam ${examId}.`);
    if (exam.version !== version) throw await staleVersion(trx, exam, timezone);
    await refuseFinished(trx, exam, 'cancelled');
    const room = await trx('rooms').where({ id: exam.room_id }).first('name');
    await writeAtVersion(trx, exam, null, timezone);
    const change: ExamEdit = { type: 'exam', examId, accession: exam.accession, from: storedFields(exam), to: null };
    await recordChange(trx, { day: exam.day, userId: req.userId, reason: req.reason ?? 'exam cancelled', summary: `Cancelled ${exam.accession}: ${room?.name ?? `room ${exam.room_id}`} ${hhmm(exam.start_at, timezone)}${req.note ?? ''}`, changes: [change] }, req.now);
    return exam.day;
  });
}

/**
 * Reads the form as a one-row import table with `parseExamTable`, so every cell gets the
 * import's check and message. Problems come back as `{field: column, message}`.
 */
async function readExamForm(db: Knex, day: string, input: ExamFormInput): Promise<{ row: ExamListRow; roomId: number; timezone: string }> {
  const [{ timezone }, rooms] = await Promise.all([readSettings(db), listRooms(db)]);
  const header = EXAM_LIST_COLUMNS.map((c) => c.name);
  const cells = header.map((name) => cellText(input[name as keyof ExamFormInput]));
  const parsed = parseExamTable([header, cells], { date: day, timezone, roomNames: rooms.map((r) => r.name) });
  if (parsed.errors.length > 0 || parsed.rows.length !== 1) {
    const problems = parsed.errors.map((e) => ({ field: e.column || 'exam', message: e.message }));
    throw new ValidationError(`The exam was not saved: ${problems.map((p) => p.message).join(' ')}`, { problems });
  }
  const row = parsed.rows[0]!;
  const roomId = rooms.find((r) => r.name === row.room)!.id;
  return { row, roomId, timezone };
}

function cellText(value: string | number | boolean | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return String(value);
}

async function refuseTakenAccession(trx: Knex, day: string, accession: string, exceptId: number | null): Promise<void> {
  const taken = await trx('exams').where({ day, accession }).modify((q) => (exceptId === null ? q : q.whereNot({ id: exceptId }))).first('id');
  if (taken) {
    const message = `Accession "${accession}" is already on the list for ${day}.`;
    throw new ValidationError(message, { problems: [{ field: 'accession', message }] });
  }
}

function fieldsOf(row: ExamListRow, roomId: number): Exam {
  return {
    accession: row.accession,
    roomId,
    start: row.start,
    durationMinutes: row.durationMinutes,
    procedure: row.procedure,
    coil: row.coil,
    precaution: row.precaution,
    mobility: row.mobility,
    contrast: row.contrast,
    notes: row.notes,
  };
}

function hhmm(iso: string, zone: string): string {
  return DateTime.fromISO(iso, { zone }).toFormat('HH:mm');
}
