import type { Knex } from 'knex';
import { diffExamLists, type ExamListRow } from '../../shared/exam-list';
import type { ImportResult } from '../../shared/api/import';
import type { DayPlanExam } from '../../shared/turnover';
import { HttpError, Refusal, ValidationError } from '../errors';
import type { WorkerPool } from '../workers/pool';
import { examColumns, examsOfDay, toListed } from './exams';
import type { UploadedExamFile } from './exam-file';
import { summaryFor } from './day-plan';
import { rosterForPlan } from './roster';
import { setupSnapshot } from './site-setup';
import { dayVersion } from './day-version';
import { roomsOnDay } from './room-hours';
import { listRooms } from './rooms';
import { readSettings } from './settings';
// 14 columns × 500 rows = 7,000 bindings a statement, well under SQLite's 32,766.
const INSERT_CHUNK_ROWS = 500;

export interface ImportRequest {
  day: string;
  file: UploadedExamFile;
  userId: number;
  dryRun: boolean;
  now: Date;
  /** The day version the preview was made at; a commit refuses (409) when the day moved on since. */
  expectedDayVersion?: number;
}

/**
 * Reads, validates and (unless a dry run) stores a day list. Any bad row refuses the whole file
 * with every error; a good file replaces the day's list in one transaction, keeping the id and
 * version of exams whose accession stays so open screens and later moves still match.
 */
export async function importExamList(db: Knex, workers: WorkerPool, req: ImportRequest): Promise<ImportResult> {
  const [settings, rooms] = await Promise.all([readSettings(db), listRooms(db)]);
  const read = await workers.readExamList({
    bytes: req.file.buffer,
    originalname: req.file.originalname,
    mimetype: req.file.mimetype,
    date: req.day,
    timezone: settings.timezone,
    roomNames: rooms.map((r) => r.name),
  });
  if (!read.ok) {
    const { status, code, message, details, extra } = read.refusal;
    throw new HttpError(status, code, message, details, extra);
  }
  const { parsed, table } = read;
  if (parsed.errors.length > 0) {
    const n = parsed.errorCount;
    const listed = n > parsed.errors.length ? ` (the first ${parsed.errors.length} are listed)` : '';
    throw new ValidationError(
      `The file was not imported: ${n.toLocaleString('en-US')} problem${n === 1 ? '' : 's'} to fix${listed}. Nothing on ${req.day} was changed.`,
      parsed.errors,
      { warnings: parsed.warnings, table, errorCount: n },
    );
  }

  const roomIdByName = new Map(rooms.map((r) => [r.name, r.id]));
  const roomNameById = new Map(rooms.map((r) => [r.id, r.name]));
  // Read before the list, so a change landing in between makes the commit's check fail, not pass.
  const version = await dayVersion(db, req.day);
  const current = await examsOfDay(db, req.day);
  const diff = diffExamLists(
    current.map((row) => toListed(row, roomNameById)),
    parsed.rows,
  );
  const wouldBe = parsed.rows.map((row, i) => wouldBeExam(row, -(i + 1), roomIdByName.get(row.room)!));
  const summary = summaryFor(req.day, settings, await roomsOnDay(db, req.day), wouldBe, await setupSnapshot(db), await rosterForPlan(db, req.day));
  const result: ImportResult = {
    dryRun: req.dryRun,
    date: req.day,
    fileName: req.file.originalname,
    imported: parsed.rows.length,
    added: diff.added,
    changed: diff.changed,
    removed: diff.removed,
    unchanged: diff.unchanged,
    warnings: parsed.warnings,
    rows: parsed.rows,
    summary,
    dayVersion: version,
  };
  if (req.dryRun) return result;

  await db.transaction(async (trx) => {
    const now = await dayVersion(trx, req.day);
    if (now !== version || (req.expectedDayVersion !== undefined && now !== req.expectedDayVersion)) {
      throw dayChanged(req.day, req.expectedDayVersion ?? version, now);
    }
    const existing = new Map(current.map((row) => [row.accession, row]));
    const changed = new Set(diff.changed.map((c) => c.accession));
    const stamp = req.now.toISOString();
    if (diff.removed.length > 0) await trx('exams').where({ day: req.day }).whereIn('accession', diff.removed).delete();
    const added: Record<string, Knex.Value>[] = [];
    for (const row of parsed.rows) {
      const columns = examColumns(row, roomIdByName.get(row.room)!);
      const old = existing.get(row.accession);
      if (!old) added.push({ ...columns, day: req.day, version: 1, updated_at: stamp });
      else if (changed.has(row.accession)) {
        await trx('exams').where({ id: old.id }).update({ ...columns, version: old.version + 1, updated_at: stamp });
      }
    }
    await insertExams(trx, added);
    await trx('imports').insert({
      day: req.day,
      user_id: req.userId,
      file_name: req.file.originalname.slice(0, 255),
      rows: parsed.rows.length,
      added: diff.added.length,
      changed: diff.changed.length,
      removed: diff.removed.length,
      created_at: stamp,
    });
  });
  return result;
}

function dayChanged(day: string, previewed: number, now: number): Refusal<'day_changed'> {
  return new Refusal(
    'day_changed',
    `The list for ${day} changed after your preview (a slot was moved, staffed or re-imported), so nothing was imported. Preview the file again to see what it would change now.`,
    { previewedVersion: previewed, currentVersion: now },
  );
}

/**
 * Adds rows to `exams`, many per statement and in the order given, so new ids follow the file.
 * Written as `values (…), (…)`: knex's own multi-row insert for SQLite is a compound SELECT,
 * which SQLite is slow to prepare and limits to 500 rows by default.
 */
async function insertExams(trx: Knex.Transaction, rows: Record<string, Knex.Value>[]): Promise<void> {
  if (rows.length === 0) return;
  const columns = Object.keys(rows[0]);
  const tuple = `(${columns.map(() => '?').join(', ')})`;
  for (let i = 0; i < rows.length; i += INSERT_CHUNK_ROWS) {
    const chunk = rows.slice(i, i + INSERT_CHUNK_ROWS);
    const values = chunk.flatMap((row) => columns.map((column) => row[column]));
    const sql = `insert into exams (${columns.map(() => '??').join(', ')}) values ${chunk.map(() => tuple).join(', ')}`;
    await trx.raw(sql, [...columns, ...values]);
  }
}

/** A file row as the day plan reads it, built field by field: a spread copy is slower to plan. */
function wouldBeExam(row: ExamListRow, id: number, roomId: number): DayPlanExam {
  return {
    id,
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
    version: 0,
  };
}

export type { ExamListRow };
