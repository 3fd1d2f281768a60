import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { Board, BoardArrival, BoardRoom, BoardShiftTask, RoomState } from '../../shared/api/board';
import { zonedFormatter } from '../../shared/turnover';
import { toBoardSlot } from './checklist';
import { lastFinishedIndex, loadRoomDays, type RoomDay } from './room-day';
import { readSettings } from './settings';
import { shiftTasksOfDay } from './shift-tasks';
import { planRoomTurnoverOrNone as planRoomTurnover } from './turnover-plan';
import { turnoverProgress } from './turnover-progress';

const MINUTE = 60_000;

interface RoomNow {
  state: RoomState;
  /** The ready-at the board shows: during a turnover, as planned, so it can be overdue. */
  readyAtMs: number | null;
  /** The best estimate now, for how late the next patient runs (readyAtMs when absent). */
  expectedReadyAtMs?: number;
  /** Index of the exam in the room now or just left; -1 for none. */
  current: number;
  /** Index of the next exam to come in; -1 for none. */
  next: number;
  turnoverId: number | null;
}

/**
 * A room's state at `nowMs` (the day is before, on or after the site's today):
 * - its latest recorded turnover is open → that turnover's state (see turnoverProgress);
 * - an exam after the last recorded end has started by plan → `in exam` (it may run over;
 *   ready-at = the later of its planned end and now, plus the planned turnover);
 * - before opening, after closing, or on another day than today → `closed`;
 * - else `ready` (since the last completion, or from opening + the opening steps), also when
 *   no exam is left: a room within its opening hours is usable, not closed.
 */
export function roomNow(roomDay: RoomDay, nowMs: number, when: 'past' | 'today' | 'future'): RoomNow {
  const { slots, turnovers, openMs } = roomDay;
  const last = lastFinishedIndex(roomDay);
  const lastRecord = last >= 0 ? turnovers.get(slots[last]!.exam.id)! : null;
  if (lastRecord && lastRecord.completedMs === null) {
    const progress = turnoverProgress(planRoomTurnover(roomDay, last, lastRecord.examEndedMs), lastRecord, nowMs);
    return { state: progress.state, readyAtMs: progress.plannedReadyAtMs, expectedReadyAtMs: progress.readyAtMs, current: last, next: slots[last + 1] ? last + 1 : -1, turnoverId: lastRecord.id };
  }
  const closed = (next: number, readyAtMs: number | null = null): RoomNow => ({ state: 'closed', readyAtMs, current: -1, next, turnoverId: null });
  const upcoming = slots[last + 1];
  const opening = () => openMs + planRoomTurnover(roomDay, -1, openMs).requiredMinutes * MINUTE;
  if (when === 'past') return closed(-1);
  if (!upcoming) {
    const open = when === 'today' && nowMs >= openMs && nowMs < roomDay.closeMs;
    return open ? { state: 'ready', readyAtMs: lastRecord ? lastRecord.completedMs : opening(), current: -1, next: -1, turnoverId: null } : closed(-1);
  }
  if (when === 'today' && upcoming.startMs <= nowMs) {
    const fromMs = Math.max(upcoming.endMs, nowMs);
    const readyAtMs = fromMs + planRoomTurnover(roomDay, last + 1, fromMs).requiredMinutes * MINUTE;
    return { state: 'in exam', readyAtMs, current: last + 1, next: slots[last + 2] ? last + 2 : -1, turnoverId: null };
  }
  if (when === 'future' || nowMs < openMs) return closed(last + 1, last < 0 ? opening() : lastRecord!.completedMs);
  return { state: 'ready', readyAtMs: lastRecord ? lastRecord.completedMs : opening(), current: -1, next: last + 1, turnoverId: null };
}

/** Rooms now: every active room's state at the server's clock, with its shift tasks. */
export async function loadBoard(db: Knex, day: string, now: Date): Promise<Board> {
  const [{ timezone: zone }, roomDays] = await Promise.all([readSettings(db), loadRoomDays(db, day)]);
  const format = zonedFormatter(zone);
  const nowMs = now.getTime();
  const today = DateTime.fromJSDate(now, { zone }).toISODate()!;
  const when = day < today ? 'past' : day > today ? 'future' : 'today';
  const tasks = await shiftTasksOfDay(db, roomDays.map((r) => r.room.id), day, zone, now);
  const states = roomDays.map((roomDay) => roomNow(roomDay, nowMs, when));
  const rooms = roomDays.map((roomDay, i) => boardRoom(roomDay, states[i]!, format, tasks.get(roomDay.room.id) ?? []));
  const arrivals = when === 'today' ? arrivalsSoon(roomDays, states, nowMs, format) : [];
  return { date: day, timezone: zone, now: format(nowMs), rooms, arrivals };
}

/** How far ahead the front desk's arrivals list looks. */
const ARRIVALS_AHEAD_MS = 60 * MINUTE;

/**
 * Every room's exams not yet begun (from its next exam on) whose slot starts within the coming
 * hour; a slot already past stays listed until its exam begins (the patient may still come).
 */
function arrivalsSoon(roomDays: RoomDay[], states: RoomNow[], nowMs: number, format: (ms: number) => string): BoardArrival[] {
  const soon = roomDays.flatMap((roomDay, i) => {
    const next = states[i]!.next;
    if (next < 0) return [];
    return roomDay.slots
      .slice(next)
      .filter((slot) => slot.startMs <= nowMs + ARRIVALS_AHEAD_MS)
      .map((slot) => ({ slot, room: roomDay.room }));
  });
  soon.sort((a, b) => a.slot.startMs - b.slot.startMs || a.room.name.localeCompare(b.room.name));
  return soon.map(({ slot, room }) => ({ ...toBoardSlot(slot, format)!, roomId: room.id, roomName: room.name }));
}

function boardRoom(roomDay: RoomDay, now: RoomNow, format: (ms: number) => string, tasks: BoardShiftTask[]): BoardRoom {
  const { room, slots } = roomDay;
  const next = now.next >= 0 ? slots[now.next]! : undefined;
  // The estimate as the card shows it (a whole minute, never earlier than it is): how late the next patient runs follows it.
  const estimate = now.expectedReadyAtMs ?? now.readyAtMs;
  const expectedMs = estimate === null ? null : Math.ceil(estimate / MINUTE) * MINUTE;
  const lateMs = next && expectedMs !== null ? expectedMs - next.startMs : 0;
  return {
    roomId: room.id,
    name: room.name,
    modality: room.modality,
    state: now.state,
    readyAt: now.readyAtMs === null ? null : format(now.readyAtMs),
    expectedReadyAt: expectedMs === null ? null : format(expectedMs),
    current: toBoardSlot(now.current >= 0 ? slots[now.current] : undefined, format),
    next: toBoardSlot(next, format),
    runningLateMinutes: lateMs > 0 ? Math.ceil(lateMs / MINUTE) : 0,
    turnoverId: now.turnoverId,
    tasks,
  };
}
