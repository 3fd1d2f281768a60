import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { NotFoundError, Refusal } from '../errors';
import { appendLog, type NewLogEntry } from './cleaning-log';
import { loadRoomDays, type RoomDay, type TurnoverRecord } from './room-day';
import { readSettings } from './settings';
import { cleanTypeOf } from './turnover-plan';
import { setupSnapshot, versionFor } from './site-setup';
import type { UserRecord } from './users';

/** Where a turnover lives, for the caller to answer with its checklist and announce the change. */
export interface TurnoverRef {
  turnoverId: number;
  roomId: number;
  day: string;
}

/** The site-local ISO text of an instant. */
export function localIso(now: Date, zone: string): string {
  return DateTime.fromJSDate(now, { zone }).toISO({ suppressMilliseconds: true })!;
}

/**
 * "Exam finished": records the exam's actual end (now) and opens the turnover after it,
 * logged as an `exam finished` entry. A second call for the same exam is a conflict.
 *
 * Before the slot's start it is refused (422 `exam_not_started`) unless `earlyReason` says why:
 * a tap on the wrong room's tablet would otherwise open a turnover, and its air hold and
 * cleaning log, for a patient not yet scanned. The reason goes into the log entry.
 */
export async function finishExam(db: Knex, examId: number, user: UserRecord, now: Date, earlyReason?: string): Promise<TurnoverRef> {
  const [{ timezone: zone }, setup] = await Promise.all([readSettings(db), setupSnapshot(db)]);
  return db.transaction(async (trx) => {
    const exam = await trx('exams as e').join('rooms as r', 'r.id', 'e.room_id').where('e.id', examId).first('e.*', 'r.name as room_name', 'r.modality as room_modality');
    if (!exam) throw new NotFoundError(`No exam ${examId}.`);
    const recorded = await trx('turnovers').where({ from_exam_id: examId }).first();
    if (recorded) {
      throw new Refusal('already_done', `The end of ${exam.accession} was already recorded at ${DateTime.fromISO(recorded.exam_ended_at, { zone }).toFormat('HH:mm')}.`, { at: recorded.exam_ended_at });
    }
    const early = now.getTime() < Number(exam.start_ms);
    const reason = early ? earlyReason?.trim() || null : null;
    if (early && !reason) {
      const start = DateTime.fromMillis(Number(exam.start_ms), { zone });
      throw new Refusal('exam_not_started', `${exam.accession} in ${exam.room_name} is booked to start at ${start.toFormat('HH:mm')}; give a reason to record its end before then.`, {
        start: start.toISO({ suppressMilliseconds: true })!,
        problems: [{ field: 'earlyReason', message: 'needed before the slot starts' }],
      });
    }
    const next = await trx('exams')
      .where({ day: exam.day, room_id: exam.room_id })
      .andWhere((q) => q.where('start_ms', '>', exam.start_ms).orWhere((q2) => q2.where('start_ms', exam.start_ms).andWhere('id', '>', exam.id)))
      .first('id');
    const at = localIso(now, zone);
    const cleanType = cleanTypeOf(exam.precaution, Boolean(next));
    const [{ id: turnoverId }] = await trx('turnovers').insert({
      day: exam.day,
      room_id: exam.room_id,
      from_exam_id: examId,
      clean_type: cleanType,
      precaution: exam.precaution,
      exam_ended_at: at,
      exam_ended_ms: now.getTime(),
      ended_by: user.id,
      // the turnover keeps the protocol version it is planned with, even if a new one starts today
      protocol_version_id: (versionFor(setup, exam.room_modality, exam.day) ?? versionFor(setup, '*', exam.day))?.id ?? null,
    }).returning('id');
    await appendLog(
      trx,
      { at, atMs: now.getTime(), day: exam.day, roomId: exam.room_id, roomName: exam.room_name, turnoverId, examAccession: exam.accession, cleanType, kind: 'exam finished', earlyReason: reason },
      user,
    );
    return { turnoverId: turnoverId as number, roomId: exam.room_id as number, day: exam.day as string };
  });
}

/** A recorded turnover with its room's day, for checks against the plan and the ticks. */
export async function loadTurnover(db: Knex, turnoverId: number): Promise<{ roomDay: RoomDay; record: TurnoverRecord; leavingIndex: number; accession: string }> {
  const row = await db('turnovers').where({ id: turnoverId }).first('day', 'room_id');
  if (!row) throw new NotFoundError(`No turnover ${turnoverId}.`);
  const [roomDay] = await loadRoomDays(db, row.day, [row.room_id]);
  const record = roomDay && [...roomDay.turnovers.values()].find((t) => t.id === turnoverId);
  if (!roomDay || !record) throw new NotFoundError(`No turnover ${turnoverId}.`);
  const leavingIndex = roomDay.slots.findIndex((s) => s.exam.id === record.fromExamId);
  if (leavingIndex < 0) throw new Refusal('turnover_moved', `The exam before turnover ${turnoverId} has been moved out of ${roomDay.room.name}.`, undefined);
  return { roomDay, record, leavingIndex, accession: roomDay.slots[leavingIndex]!.exam.accession };
}

/** Refuses to change a turnover that is already complete. */
export function assertOpen(record: TurnoverRecord, zone: string): void {
  if (record.completedAt) {
    throw new Refusal('turnover_complete', `This turnover was completed at ${DateTime.fromISO(record.completedAt, { zone }).toFormat('HH:mm')}; add a correction to the log instead.`, {
      completedAt: record.completedAt,
    });
  }
}

/** The log fields every entry of a recorded turnover shares (where, which exam, which clean, when). */
export function turnoverLogFields(
  roomDay: RoomDay,
  record: TurnoverRecord,
  accession: string,
  at: string,
  atMs: number,
): Pick<NewLogEntry, 'at' | 'atMs' | 'day' | 'roomId' | 'roomName' | 'turnoverId' | 'examAccession' | 'cleanType'> {
  return { at, atMs, day: roomDay.day, roomId: roomDay.room.id, roomName: roomDay.room.name, turnoverId: record.id, examAccession: accession, cleanType: record.cleanType };
}
