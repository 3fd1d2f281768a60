import type { PlanSummary, Verdict } from '../api/plan';
import { turnoverFor, type TurnoverCache } from '../turnover/day-plan-cache';
import { DEFAULT_OPENS_AT, type DayPlanExam, type DayPlanInput, type DayPlanRoom } from '../turnover/day-plan-input';
import type { DayPlanSlot } from '../turnover/day-plan-output';
import type { Protocol } from '../turnover/model';
import { protocolFor } from '../turnover/protocols';
import { DEFAULT_SNUG_MARGIN_MINUTES, gapVerdict } from '../turnover/verdict';

const MINUTE = 60_000;

/** A gap judged as the day plan judges it, without the steps' clock times a fix never shows. */
export interface JudgedGap {
  fromExamId: number | null;
  toExamId: number;
  availableMinutes: number;
  requiredMinutes: number;
  verdict: Verdict;
  shortByMinutes: number;
  staff: number;
}

/**
 * One room's exams in plan order and the gap before each (`gaps[i]` is the gap before `slots[i]`);
 * no gaps at all for a room whose modality has no protocol.
 */
export interface JudgedRoom {
  room: DayPlanRoom;
  opensMs: number;
  slots: DayPlanSlot[];
  gaps: JudgedGap[];
  /** Its last exam's end, or its opening when it has none. */
  endsMs: number;
}

/** What judging a room needs from its day, worked out once per call. */
export interface RoomJudge {
  input: DayPlanInput;
  /** The engine's memoised turnovers, per protocol. */
  turnovers: (protocol: Protocol) => TurnoverCache;
  /** The instant of a local `HH:MM` on the day. */
  wallTime: (hhmm: string) => number;
  /** The instant an exam starts (remembered per exam: a fix re-judges the same exams many times). */
  startOf: (exam: DayPlanExam) => number;
}

export const isProblemVerdict = (verdict: Verdict | undefined) => verdict === 'short' || verdict === 'overlap';

/**
 * One room's gaps with the same turnovers, order and verdicts as `computeDayPlan` gives them
 * (shared/fixes/room-gaps.spec.ts checks this), at a fraction of the cost: a fix is weighed on
 * the rooms it touches only, and only their verdicts matter. `exams` are the room's exams in
 * any order; `staffOverrides` are read from `judge.input`.
 *
 * @throws RangeError on a start that is not ISO 8601; what the turnover engine refuses
 * @example
 * judgeRoom(judge, room, examsOfRoom).gaps.map((g) => g.verdict); // ['fits', 'short', 'snug']
 */
export function judgeRoom(judge: RoomJudge, room: DayPlanRoom, exams: readonly DayPlanExam[]): JudgedRoom {
  const { input } = judge;
  const opensMs = judge.wallTime(room.opensAt ?? DEFAULT_OPENS_AT);
  const slots: DayPlanSlot[] = new Array<DayPlanSlot>(exams.length);
  for (let i = 0; i < exams.length; i++) {
    const exam = exams[i]!;
    const startMs = judge.startOf(exam);
    slots[i] = { exam, startMs, endMs: startMs + exam.durationMinutes * MINUTE };
  }
  slots.sort((a, b) => a.startMs - b.startMs || a.exam.id - b.exam.id);
  const protocol = protocolFor(room.modality, input.protocols);
  // A room without a protocol has no verdicts (as in the day plan): no gaps to judge or fix.
  if (!protocol) return { room, opensMs, slots, gaps: [], endsMs: slots.reduce((end, s) => Math.max(end, s.endMs), opensMs) };
  const cache = judge.turnovers(protocol);
  const snugMarginMinutes = input.snugMarginMinutes ?? DEFAULT_SNUG_MARGIN_MINUTES;
  const overrides = input.staffOverrides;
  const gaps: JudgedGap[] = new Array<JudgedGap>(slots.length);
  let endsMs = opensMs;
  let previous: DayPlanSlot | null = null;
  for (let i = 0; i < slots.length; i++) {
    const slot = slots[i]!;
    const staff = overrides?.[slot.exam.id] ?? room.staff;
    const turnover = turnoverFor(cache, { input, room, protocol, leaving: previous?.exam ?? null, arriving: slot.exam, staff });
    const fromMs = previous ? previous.endMs : opensMs;
    const availableMinutes = Math.floor((slot.startMs - fromMs) / MINUTE);
    const { verdict, shortByMinutes } = gapVerdict({ availableMinutes, requiredMinutes: turnover.requiredMinutes, snugMarginMinutes });
    gaps[i] = {
      fromExamId: previous ? previous.exam.id : null,
      toExamId: slot.exam.id,
      availableMinutes,
      requiredMinutes: turnover.requiredMinutes,
      verdict,
      shortByMinutes,
      staff: turnover.staff,
    };
    if (slot.endMs > endsMs) endsMs = slot.endMs;
    previous = slot;
  }
  return { room, opensMs, slots, gaps, endsMs };
}

/**
 * Adds (`sign` 1) or takes away (`sign` -1) a room's gaps from a day summary, in place: the
 * day's summary after a fix is the summary before, less the touched rooms before, plus after.
 *
 * @example
 * const after = { ...before }; addToSummary(after, roomBefore, -1); addToSummary(after, roomAfter, 1);
 */
export function addToSummary(summary: PlanSummary, room: JudgedRoom, sign: 1 | -1): void {
  for (const gap of room.gaps) {
    summary[gap.verdict] += sign;
    summary.minutesShort += sign * gap.shortByMinutes;
  }
}
