import { DateTime } from 'luxon';
import type { PlanChange } from '../api/changes';
import type { PlanSummary } from '../api/plan';
import { computeDayPlan, computeDaySummary } from '../turnover/day-plan';
import { turnoverCaches } from '../turnover/day-plan-cache';
import type { DayPlanExam, DayPlanInput, DayPlanRoom } from '../turnover/day-plan-input';
import { DEFAULT_SNUG_MARGIN_MINUTES } from '../turnover/verdict';
import { instantOf, wallTimeToMillis, zonedFormatter, type ZonedFormatter } from '../turnover/zoned-time';
import { withChanges } from './apply-changes';
import { addToSummary, judgeRoom, type JudgedGap, type JudgedRoom, type RoomJudge } from './room-gaps';

/** A day as fixes are weighed on it: rooms judged on demand, once; the summary of the whole day. */
export interface FixDay {
  input: DayPlanInput;
  format: ZonedFormatter;
  margin: number;
  /** The next day's start: nothing may be pushed past it. */
  lastEndMs: number;
  summary: PlanSummary;
  /** The engine's memoised turnovers, per protocol. */
  turnovers: RoomJudge['turnovers'];
  rooms: readonly DayPlanRoom[];
  roomOfExam: ReadonlyMap<number, number>;
  /** The room before any change, judged on first use. */
  judged(roomId: number): JudgedRoom;
  /** The gap before an exam before any change (its room judged on first use). */
  gapBefore(toExamId: number): JudgedGap | undefined;
  /** The rooms of `roomIds` with `changes` applied, judged. */
  judgeWith(roomIds: ReadonlySet<number>, changes: readonly PlanChange[]): Map<number, JudgedRoom>;
}

/**
 * Prepares a day for weighing fixes: one engine pass for the day's summary (and its checks),
 * exams grouped by room, and a judge that reuses the engine's memoised turnovers.
 *
 * @throws what `computeDaySummary` throws on a bad day
 * @example
 * const day = fixDay(input);
 * day.judged(1).gaps.filter((g) => g.verdict === 'short').length; // 2
 */
export function fixDay(input: DayPlanInput): FixDay {
  // A roster day weighs each fix on a whole day's plan: a small crew search each, and the day's
  // own summary with the same search, so before and after are judged alike.
  const summary = computeDaySummary(input, input.roster ? { crewSearch: FIX_CREW_SEARCH } : {});
  const wallTimes = new Map<string, number>();
  const starts = new Map<DayPlanExam, number>();
  const judge: RoomJudge = {
    input,
    turnovers: turnoverCaches(input),
    wallTime: (hhmm) => {
      let ms = wallTimes.get(hhmm);
      if (ms === undefined) wallTimes.set(hhmm, (ms = wallTimeToMillis(input.date, hhmm, input.timezone)));
      return ms;
    },
    startOf: (exam) => {
      let ms = starts.get(exam);
      if (ms === undefined) starts.set(exam, (ms = instantOf(exam.start, input.timezone)));
      return ms;
    },
  };
  const examsByRoom = groupByRoom(input.rooms, input.exams);
  const roomOfExam = new Map(input.exams.map((exam) => [exam.id, exam.roomId]));
  const roomById = new Map(input.rooms.map((room) => [room.id, room]));
  const judgedRooms = new Map<number, JudgedRoom>();
  const gapsByExam = new Map<number, JudgedGap>();
  // With a roster, people are shared between rooms: every room is judged from the whole day's plan.
  const withRoster = input.roster ? judgeWholeDay(judge, roomById) : null;
  const judged = (roomId: number): JudgedRoom => {
    let room = judgedRooms.get(roomId);
    if (!room) {
      if (withRoster) {
        for (const [id, whole] of withRoster(input)) {
          judgedRooms.set(id, whole);
          for (const gap of whole.gaps) gapsByExam.set(gap.toExamId, gap);
        }
        return judgedRooms.get(roomId)!;
      }
      room = judgeRoom(judge, roomById.get(roomId)!, examsByRoom.get(roomId)!);
      judgedRooms.set(roomId, room);
      for (const gap of room.gaps) gapsByExam.set(gap.toExamId, gap);
    }
    return room;
  };
  return {
    input,
    format: zonedFormatter(input.timezone),
    margin: input.snugMarginMinutes ?? DEFAULT_SNUG_MARGIN_MINUTES,
    lastEndMs: DateTime.fromISO(input.date, { zone: input.timezone }).plus({ days: 1 }).toMillis(),
    summary,
    turnovers: judge.turnovers,
    rooms: input.rooms,
    roomOfExam,
    judged,
    gapBefore(toExamId) {
      const roomId = roomOfExam.get(toExamId);
      if (roomId === undefined) return undefined;
      judged(roomId);
      return gapsByExam.get(toExamId);
    },
    judgeWith(roomIds, changes) {
      // With a roster a change can reach any room through its people: every room, judged anew.
      if (withRoster) return withRoster(withChanges(input, changes));
      // Only the touched rooms' exams go through withChanges and the judge: the rest of the day is as it was.
      const rooms = input.rooms.filter((room) => roomIds.has(room.id));
      const exams = rooms.flatMap((room) => examsByRoom.get(room.id)!);
      const after = withChanges({ ...input, rooms, exams }, changes);
      const afterJudge: RoomJudge = { ...judge, input: after };
      const byRoom = groupByRoom(rooms, after.exams);
      return new Map(rooms.map((room) => [room.id, judgeRoom(afterJudge, room, byRoom.get(room.id)!)]));
    },
  };
}

/**
 * The summary of the day after the touched rooms change: before, less them before, plus them after.
 *
 * @example
 * summaryWith(day, judgedAfter); // { fits: 30, snug: 4, short: 1, overlap: 0, minutesShort: 6 }
 */
export function summaryWith(day: FixDay, after: ReadonlyMap<number, JudgedRoom>): PlanSummary {
  const summary = { ...day.summary };
  for (const [roomId, room] of after) {
    addToSummary(summary, day.judged(roomId), -1);
    addToSummary(summary, room, 1);
  }
  return summary;
}

/**
 * The crew search a fix is weighed with on a roster day: each candidate costs a whole day's plan,
 * so a page of fixes stays around a second; the plan itself searches further (its answer after a
 * fix may be better still, never worse than the greedy crews this starts from).
 */
const FIX_CREW_SEARCH = { clusterWorkBudget: 500, dayWorkBudget: 1_000 } as const;

/**
 * A roster day's rooms judged as the day plan judges them: each room's slots from `judgeRoom`,
 * its gaps' verdicts from the whole day's plan (crews shared across rooms, shared/roster).
 */
function judgeWholeDay(judge: RoomJudge, roomById: ReadonlyMap<number, DayPlanRoom>): (day: DayPlanInput) => Map<number, JudgedRoom> {
  return (day) => {
    const plan = computeDayPlan(day, { crewSearch: FIX_CREW_SEARCH });
    const byRoom = groupByRoom(day.rooms, day.exams);
    const dayJudge: RoomJudge = { ...judge, input: day };
    const out = new Map<number, JudgedRoom>();
    for (const planned of plan.rooms) {
      const room = judgeRoom(dayJudge, roomById.get(planned.id)!, byRoom.get(planned.id)!);
      const byExam = new Map(planned.gaps.map((gap) => [gap.toExamId, gap]));
      room.gaps = room.gaps.map((gap) => {
        const p = byExam.get(gap.toExamId);
        return p ? { ...gap, availableMinutes: p.availableMinutes, requiredMinutes: p.requiredMinutes, verdict: p.verdict, shortByMinutes: p.shortByMinutes, staff: p.staff } : gap;
      });
      out.set(planned.id, room);
    }
    return out;
  };
}

function groupByRoom(rooms: readonly DayPlanRoom[], exams: readonly DayPlanExam[]): Map<number, DayPlanExam[]> {
  const byRoom = new Map<number, DayPlanExam[]>(rooms.map((room) => [room.id, []]));
  for (const exam of exams) {
    const list = byRoom.get(exam.roomId);
    // computeDaySummary has already refused an exam in an unknown room; a move there is refused too.
    if (!list) throw new Error(`exam ${exam.id} is in unknown room ${exam.roomId}`);
    list.push(exam);
  }
  return byRoom;
}
