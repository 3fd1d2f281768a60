import { DateTime } from 'luxon';
import { TURNOVER_STAFF } from '../api/limits';
import { turnoverCaches, turnoverFor } from '../turnover/day-plan-cache';
import { DEFAULT_CLOSES_AT, DEFAULT_OPENS_AT, type DayPlanExam, type DayPlanInput, type DayPlanRoom } from '../turnover/day-plan-input';
import { protocolFor } from '../turnover/protocols';
import { instantOf, wallTimeToMillis } from '../turnover/zoned-time';
import type { DayFitOptions, FixedReason } from './model';

const MINUTE = 60_000;

/** A room of a modality group; times in whole minutes after the site's midnight (real minutes). */
export interface FitRoom {
  room: DayPlanRoom;
  open: number;
  close: number;
}

/** An exam in the model: its place now, whether it may move and where. */
export interface FitExam {
  exam: DayPlanExam;
  start: number;
  duration: number;
  roomId: number;
  /** The earliest start it may be moved to (the options' `notBefore`; -Infinity without one). */
  earliest: number;
  /** Why it stays put (fixed by the caller, or outside its room's hours already); null: free. */
  stays: FixedReason | 'outside-hours' | 'proposed' | null;
}

/** Rooms of one modality that are open and have a protocol, with their exams. */
export interface FitGroup {
  modality: string;
  rooms: FitRoom[];
  exams: FitExam[];
}

/** The day as the model sees it. */
export interface FitDay {
  input: DayPlanInput;
  midnightMs: number;
  groups: FitGroup[];
  /** Required minutes of a turnover: `leaving` null is the room's opening steps. */
  required(room: DayPlanRoom, leaving: DayPlanExam | null, arriving: DayPlanExam, staff: number): number;
  /** Minutes the crew is hands-on in that turnover (its last step's end): what keeps a roster's people in the room. */
  busy(room: DayPlanRoom, leaving: DayPlanExam | null, arriving: DayPlanExam, staff: number): number;
  /** People on the turnover before `exam` in `room` without a helper. */
  baseStaff(room: DayPlanRoom, exam: DayPlanExam): number;
  /** One more person, when the limit allows; null otherwise. */
  helperStaff(room: DayPlanRoom, exam: DayPlanExam): number | null;
  toIso(minute: number): string;
  minuteOf(iso: string): number;
}

/**
 * Groups a day for the model: per modality, its open rooms that have a protocol and their
 * exams, each exam's start and duration in real whole minutes after the site's midnight. Rooms
 * closed all day and rooms without a protocol are left out (their exams stay where they are).
 *
 * @throws RangeError on a bad date, zone or start
 * @example
 * fitDay(input, {}).groups.map((g) => g.modality); // ['MR', 'CT']
 */
export function fitDay(input: DayPlanInput, options: Pick<DayFitOptions, 'fixed' | 'notBefore'>): FitDay {
  const midnight = DateTime.fromISO(input.date, { zone: input.timezone });
  if (!midnight.isValid) throw new RangeError(`not a valid date and zone: ${input.date} ${input.timezone}`);
  const midnightMs = midnight.toMillis();
  const nextDate = midnight.plus({ days: 1 }).toISODate()!;
  const toMinute = (ms: number) => Math.round((ms - midnightMs) / MINUTE);
  const caches = turnoverCaches(input);
  const earliest = options.notBefore === undefined ? -Infinity : Math.ceil((options.notBefore - midnightMs) / MINUTE);
  const groups = new Map<string, FitGroup>();
  const roomGroup = new Map<number, FitGroup>();
  for (const room of input.rooms) {
    const protocol = protocolFor(room.modality, input.protocols);
    if (!protocol || room.closed) continue;
    const opensAt = room.opensAt ?? DEFAULT_OPENS_AT;
    const closesAt = room.closesAt ?? DEFAULT_CLOSES_AT;
    const openMs = wallTimeToMillis(input.date, opensAt, input.timezone);
    let closeMs = wallTimeToMillis(input.date, closesAt, input.timezone);
    if (closeMs <= openMs) closeMs = wallTimeToMillis(nextDate, closesAt, input.timezone);
    const key = room.modality.toUpperCase();
    let group = groups.get(key);
    if (!group) groups.set(key, (group = { modality: key, rooms: [], exams: [] }));
    group.rooms.push({ room, open: toMinute(openMs), close: toMinute(closeMs) });
    roomGroup.set(room.id, group);
  }
  for (const exam of input.exams) {
    const group = roomGroup.get(exam.roomId);
    if (!group) continue;
    const fitRoom = group.rooms.find((r) => r.room.id === exam.roomId)!;
    const startMs = instantOf(exam.start, input.timezone);
    const start = (startMs - midnightMs) / MINUTE;
    const duration = exam.durationMinutes;
    const onMinute = Number.isInteger(start) && Number.isInteger(duration);
    const outside = start < fitRoom.open || start + duration > fitRoom.close;
    const stays = options.fixed?.[exam.id] ?? (start < earliest ? 'passed' : outside || !onMinute ? 'outside-hours' : null);
    group.exams.push({ exam, start: Math.round(start), duration: Math.ceil(duration), roomId: exam.roomId, earliest, stays });
  }
  const overrides = input.staffOverrides;
  const turnover = (room: DayPlanRoom, leaving: DayPlanExam | null, arriving: DayPlanExam, staff: number) => {
    const protocol = protocolFor(room.modality, input.protocols)!;
    return turnoverFor(caches(protocol), { input, room, protocol, leaving, arriving, staff });
  };
  const baseStaff = (room: DayPlanRoom, exam: DayPlanExam) => overrides?.[exam.id] ?? room.staff;
  return {
    input,
    midnightMs,
    groups: [...groups.values()].filter((g) => g.exams.length > 0),
    required(room, leaving, arriving, staff) {
      return turnover(room, leaving, arriving, staff).requiredMinutes;
    },
    busy(room, leaving, arriving, staff) {
      return turnover(room, leaving, arriving, staff).steps.reduce((end, step) => Math.max(end, step.end), 0);
    },
    baseStaff,
    helperStaff(room, exam) {
      const staff = baseStaff(room, exam) + 1;
      return staff <= TURNOVER_STAFF.max ? staff : null;
    },
    toIso(minute) {
      return DateTime.fromMillis(midnightMs + minute * MINUTE, { zone: input.timezone }).toISO({ suppressMilliseconds: true })!;
    },
    minuteOf(iso) {
      return toMinute(instantOf(iso, input.timezone));
    },
  };
}
