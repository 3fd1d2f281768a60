import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { DEFAULT_CLOSES_AT, DEFAULT_OPENS_AT, wallTimeToMillis, type DayPlanExam } from '../../shared/turnover';
import { examsOfDay, toPlanExam } from './exams';
import { roomsOnDay, type RoomOnDay } from './room-hours';
import { readSettings } from './settings';
import { setupSnapshot, type SetupSnapshot } from './site-setup';
import { cleanTypeOf } from './turnover-plan';

const MINUTE = 60_000;

/** An exam of the day list in real time, with its arrival mark. */
export interface ExamSlot {
  exam: DayPlanExam;
  startMs: number;
  endMs: number;
  arrivedAt: string | null;
}

/** A ticked step as recorded. */
export interface StepTick {
  key: string;
  doneAt: string;
  doneMs: number;
  by: string;
  productKey: string | null;
  waitMinutes: number;
  earlyReason: string | null;
}

/** A turnover as recorded: opened by "exam finished", closed by "turnover complete". */
export interface TurnoverRecord {
  id: number;
  day: string;
  roomId: number;
  fromExamId: number;
  cleanType: 'routine' | 'isolation' | 'terminal';
  precaution: string;
  examEndedAt: string;
  examEndedMs: number;
  completedAt: string | null;
  completedMs: number | null;
  overrideReason: string | null;
  /** The protocol version its turnover was planned with when the exam's end was recorded. */
  protocolVersionId: number | null;
  ticks: Map<string, StepTick>;
}

/** Everything the board and the checklist read about one room on one day. */
export interface RoomDay {
  day: string;
  zone: string;
  /** With its hours on this day (its weekday's), and whether it is closed all day. */
  room: RoomOnDay;
  openMs: number;
  closeMs: number;
  /** In start order. */
  slots: ExamSlot[];
  /** By the leaving exam's id. */
  turnovers: Map<number, TurnoverRecord>;
  /** People on the turnover before an exam, when not the room's. */
  staffOverrides: Map<number, number>;
  /** The site's products and protocol versions (the day's version is chosen from them). */
  setup: SetupSnapshot;
}

/** Loads the given rooms' day (every active room when `roomIds` is omitted). */
export async function loadRoomDays(db: Knex, day: string, roomIds?: number[]): Promise<RoomDay[]> {
  const [{ timezone: zone }, allRooms, examRows, setup] = await Promise.all([readSettings(db), roomsOnDay(db, day), examsOfDay(db, day), setupSnapshot(db)]);
  const rooms = roomIds ? allRooms.filter((r) => roomIds.includes(r.id)) : allRooms;
  const examIds = examRows.map((e) => e.id);
  const [arrivals, staffing, turnoverRows, tickRows] = await Promise.all([
    db('arrivals').whereIn('exam_id', examIds).select('exam_id', 'arrived_at'),
    db('gap_staffing').whereIn('to_exam_id', examIds).select('to_exam_id', 'staff'),
    db('turnovers').where({ day }).select('*'),
    db('turnover_steps as s')
      .join('turnovers as t', 't.id', 's.turnover_id')
      .join('users as u', 'u.id', 's.user_id')
      .where('t.day', day)
      .select('s.*', 'u.display_name', 'u.username'),
  ]);
  const arrivedAt = new Map<number, string>(arrivals.map((a) => [a.exam_id, a.arrived_at]));
  const turnovers = new Map<number, TurnoverRecord>(turnoverRows.map((t) => [t.from_exam_id, toRecord(t)]));
  const byId = new Map([...turnovers.values()].map((t) => [t.id, t]));
  for (const s of tickRows) {
    byId.get(s.turnover_id)?.ticks.set(s.step_key, {
      key: s.step_key,
      doneAt: s.done_at,
      doneMs: Number(s.done_ms),
      by: s.display_name || s.username,
      productKey: s.product_key,
      waitMinutes: s.wait_minutes,
      earlyReason: s.early_reason,
    });
  }
  const staffOverrides = new Map<number, number>(staffing.map((s) => [s.to_exam_id, s.staff]));
  return rooms.map((room) => {
    const openMs = wallTimeToMillis(day, room.opensAt ?? DEFAULT_OPENS_AT, zone);
    let closeMs = wallTimeToMillis(day, room.closesAt ?? DEFAULT_CLOSES_AT, zone);
    if (room.closed) closeMs = openMs;
    else if (closeMs <= openMs) closeMs = wallTimeToMillis(DateTime.fromISO(day, { zone: 'UTC' }).plus({ days: 1 }).toISODate()!, room.closesAt, zone);
    const slots = examRows
      .filter((e) => e.room_id === room.id)
      .map((row) => {
        const startMs = Number(row.start_ms);
        return { exam: toPlanExam(row), startMs, endMs: startMs + row.duration_minutes * MINUTE, arrivedAt: arrivedAt.get(row.id) ?? null };
      })
      .sort((a, b) => a.startMs - b.startMs || a.exam.id - b.exam.id);
    const roomTurnovers = new Map([...turnovers].filter(([, t]) => t.roomId === room.id));
    liveCleanTypes(roomTurnovers, slots);
    return { day, zone, room, openMs, closeMs, slots, turnovers: roomTurnovers, staffOverrides, setup };
  });
}

/** Index of the latest exam (in start order) whose end has been recorded; -1 if none. */
export function lastFinishedIndex(roomDay: RoomDay): number {
  for (let i = roomDay.slots.length - 1; i >= 0; i--) if (roomDay.turnovers.has(roomDay.slots[i]!.exam.id)) return i;
  return -1;
}

/**
 * An open turnover's clean type follows the day as it is now: the "terminal" clean after what
 * was the last exam becomes routine (or isolation) once another exam is booked behind it, and
 * the reverse when the next one is removed. A completed turnover keeps what it was closed as.
 */
function liveCleanTypes(turnovers: Map<number, TurnoverRecord>, slots: ExamSlot[]): void {
  for (const record of turnovers.values()) {
    if (record.completedMs !== null) continue;
    const index = slots.findIndex((s) => s.exam.id === record.fromExamId);
    if (index >= 0) record.cleanType = cleanTypeOf(record.precaution, index < slots.length - 1);
  }
}

function toRecord(row: Record<string, unknown>): TurnoverRecord {
  return {
    id: row['id'] as number,
    day: row['day'] as string,
    roomId: row['room_id'] as number,
    fromExamId: row['from_exam_id'] as number,
    cleanType: row['clean_type'] as TurnoverRecord['cleanType'],
    precaution: row['precaution'] as string,
    examEndedAt: row['exam_ended_at'] as string,
    examEndedMs: Number(row['exam_ended_ms']),
    completedAt: (row['completed_at'] as string | null) ?? null,
    completedMs: row['completed_ms'] == null ? null : Number(row['completed_ms']),
    overrideReason: (row['override_reason'] as string | null) ?? null,
    protocolVersionId: (row['protocol_version_id'] as number | null) ?? null,
    ticks: new Map(),
  };
}
