import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { ExamMove, ExamMoveInput } from '../../shared/api/changes';
import { NotFoundError, Refusal, ValidationError } from '../errors';
import { examColumnsForMove } from './exams';
import { recordChange } from './plan-changes';
import { readSettings } from './settings';

function hhmm(iso: string, zone: string): string {
  return DateTime.fromISO(iso, { zone }).toFormat('HH:mm');
}

/**
 * The 409 for a change made at an exam's old version: names who changed it last (from the day's
 * history), or an import when no hand change touched it.
 */
export async function staleVersion(trx: Knex, exam: { id: number; day: string; accession: string; version: number }, timezone: string): Promise<Refusal<'stale_version'>> {
  const last = await trx('plan_changes')
    .join('users', 'users.id', 'plan_changes.user_id')
    .where('plan_changes.day', exam.day)
    .andWhereRaw('plan_changes.changes like ?', [`%"examId":${exam.id},%`])
    .orderBy('plan_changes.id', 'desc')
    .first('users.display_name', 'users.username', 'plan_changes.created_at', 'plan_changes.summary');
  const who = last ? `${last.display_name || last.username} changed it at ${hhmm(last.created_at, timezone)} (${last.summary})` : 'it was changed by an import';
  const changedBy = last ? { username: last.username, displayName: last.display_name || last.username, at: last.created_at, summary: last.summary } : null;
  return new Refusal('stale_version', `Exam ${exam.accession} was changed meanwhile: ${who}. The day has been reloaded.`, { currentVersion: exam.version, changedBy });
}

/**
 * Writes (or, with `null`, deletes) an exam only while its version is still the one read. On
 * PostgreSQL two transactions may read the same version at once; the second writer waits for the
 * first's row lock and then finds the version moved, so exactly one wins and the other gets the
 * same 409 as a stale read. (SQLite runs one write transaction at a time, where this never fires.)
 */
export async function writeAtVersion(
  trx: Knex,
  exam: { id: number; day: string; accession: string; version: number },
  changes: Record<string, unknown> | null,
  timezone: string,
): Promise<void> {
  const row = trx('exams').where({ id: exam.id, version: exam.version });
  const written = changes ? await row.update({ ...changes, version: exam.version + 1 }) : await row.delete();
  if (written === 0) throw await staleVersion(trx, (await trx('exams').where({ id: exam.id }).first()) ?? exam, timezone);
}

/**
 * Moves an exam along its lane or to another room of the same modality on the same day.
 * Optimistic locking: a stale `version` is a 409 that names who moved the exam last.
 * Returns the exam's day.
 */
export async function moveExam(
  db: Knex,
  examId: number,
  input: Required<Pick<ExamMoveInput, 'version'>> & Omit<ExamMoveInput, 'version'>,
  userId: number,
  now: Date,
): Promise<string> {
  const { timezone } = await readSettings(db);
  return db.transaction(async (trx) => {
    const exam = await trx('exams').where({ id: examId }).first();
    if (!exam) throw new NotFoundError(`No exam ${examId}.`);
    if (exam.version !== input.version) throw await staleVersion(trx, exam, timezone);
    await refuseFinished(trx, exam, 'moved');
    const fromRoom = await trx('rooms').where({ id: exam.room_id }).first();
    const toRoomId = input.roomId ?? exam.room_id;
    const toRoom = toRoomId === exam.room_id ? fromRoom : await trx('rooms').where({ id: toRoomId, active: true }).first();
    if (!toRoom) throw new ValidationError(`Room ${toRoomId} does not exist.`, { problems: [{ field: 'roomId', message: 'no such room' }] });
    if (toRoom.modality !== fromRoom.modality) {
      throw new Refusal('other_modality', `${exam.accession} is a ${fromRoom.modality} exam; ${toRoom.name} is a ${toRoom.modality} room.`, {
        examModality: fromRoom.modality,
        roomModality: toRoom.modality,
      });
    }
    const start = input.start ? DateTime.fromISO(input.start, { setZone: true }).setZone(timezone) : DateTime.fromISO(exam.start_at, { zone: timezone });
    if (!start.isValid) throw new ValidationError('start must be ISO 8601 with an offset.', { problems: [{ field: 'start', message: 'not ISO 8601 with an offset' }] });
    const end = start.plus({ minutes: exam.duration_minutes });
    if (start.toISODate() !== exam.day || end.minus({ minutes: 1 }).toISODate() !== exam.day) {
      throw new Refusal('outside_day', `A move must keep ${exam.accession} within ${exam.day} (site time, ${timezone}).`, { day: exam.day, timezone });
    }
    const to = { roomId: toRoomId, start: start.toISO({ suppressMilliseconds: true })! };
    const move: ExamMove = { type: 'move', examId, accession: exam.accession, from: { roomId: exam.room_id, start: exam.start_at }, to };
    await writeAtVersion(trx, exam, { ...examColumnsForMove(to.roomId, to.start), updated_at: now.toISOString() }, timezone);
    const where = toRoomId === exam.room_id ? '' : ` to ${toRoom.name}`;
    await recordChange(
      trx,
      { day: exam.day, userId, reason: input.reason ?? 'api', summary: `Moved ${exam.accession} from ${fromRoom.name} ${hhmm(exam.start_at, timezone)}${where} ${hhmm(to.start, timezone)}`, changes: [move] },
      now,
    );
    return exam.day as string;
  });
}

/**
 * An exam whose end is recorded has a turnover under way or done, and its cleaning is being
 * logged against it: moving, editing or removing it would take that turnover along (and put the
 * plan at odds with the log), so it is refused.
 */
export async function refuseFinished(trx: Knex, exam: { id: number; accession: string }, what: 'edited' | 'cancelled' | 'moved'): Promise<void> {
  const turnover = await trx('turnovers').where({ from_exam_id: exam.id }).first('exam_ended_at');
  if (!turnover) return;
  throw new Refusal(
    'exam_finished',
    `${exam.accession} has finished (its end was recorded at ${turnover.exam_ended_at}) and its turnover has begun, so it cannot be ${what}.`,
    { endedAt: turnover.exam_ended_at },
  );
}
