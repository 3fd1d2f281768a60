/**
 * The day plan's roster side: which rooms the roster covers, the gaps those rooms hand over while
 * the plan is built, and, once every room has, the crews (shared/roster) and the gaps judged with
 * them. A day without a roster never comes here, so its plan is exactly what it was before rosters.
 */
import type { AssignCrewsOptions } from '../roster/assign-crews';
import { staffGaps, type RosterGapInput } from '../roster/staff-gaps';
import type { DayPlanInput, DayPlanRoom } from './day-plan-input';
import type { PlanGap, PlanPeople, PlanSummary } from './day-plan-types';
import { turnoverFor, type TurnoverCache } from './day-plan-cache';
import { toPlanGap, type DayPlanSlot } from './day-plan-output';
import type { Protocol } from './model';
import { DEFAULT_SNUG_MARGIN_MINUTES, gapVerdict } from './verdict';
import type { ZonedFormatter } from './zoned-time';

const MINUTE = 60_000;

/** A gap of a covered room, waiting for its crew. */
export interface PendingRosterGap {
  room: DayPlanRoom;
  previous: DayPlanSlot | null;
  slot: DayPlanSlot;
  fromMs: number;
  wanted: number;
  cache: TurnoverCache;
  protocol: Protocol;
  /** The room's gaps and this gap's place in them (a placeholder until staffed); unused for a summary. */
  gaps: PlanGap[];
  index: number;
}

export interface RosterContext {
  roster: NonNullable<DayPlanInput['roster']>;
  /** Rooms of the day at least one person on the roster covers. */
  covered: Set<number>;
  pending: PendingRosterGap[];
}

/** What of the day plan's context the roster side reads. */
export interface RosterPlanContext {
  input: DayPlanInput;
  format: ZonedFormatter;
  summary: PlanSummary;
  wallTime: (hhmm: string) => number;
  detailed: boolean;
}

/**
 * The roster side of a day plan, or null without a roster.
 *
 * @example
 * rosterContext({ ...input, roster: { source: 'day', people, walkingMinutes: 3 } })?.covered; // Set {1, 2}
 */
export function rosterContext(input: DayPlanInput): RosterContext | null {
  const roster = input.roster;
  if (!roster) return null;
  const dayRooms = new Set(input.rooms.map((room) => room.id));
  const covered = new Set<number>();
  for (const person of roster.people) for (const id of person.roomIds) if (dayRooms.has(id)) covered.add(id);
  return { roster, covered, pending: [] };
}

/**
 * Staffs and judges the pending gaps: ready-at = when the crew can start + the required minutes
 * for its size; required = ready-at − the room's free time. Counts them in the summary, writes
 * them into their rooms' gaps (detailed plans) and answers the day's people with their work.
 *
 * @example
 * const people = staffRosterGaps(ctx.roster, ctx); // people.provenOptimal === true on a usual day
 */
export function staffRosterGaps(roster: RosterContext, ctx: RosterPlanContext, search?: AssignCrewsOptions): PlanPeople {
  const { input, format } = ctx;
  const roomOrder = new Map(input.rooms.map((room, i) => [room.id, i]));
  const inputs: RosterGapInput[] = roster.pending.map((gap) => ({
    roomId: gap.room.id,
    roomOrder: roomOrder.get(gap.room.id)!,
    toExamId: gap.slot.exam.id,
    fromMs: gap.fromMs,
    toMs: gap.slot.startMs,
    availableMinutes: Math.floor((gap.slot.startMs - gap.fromMs) / MINUTE),
    wanted: gap.wanted,
    turnover: (k) => turnoverFor(gap.cache, { input, room: gap.room, protocol: gap.protocol, leaving: gap.previous?.exam ?? null, arriving: gap.slot.exam, staff: k }),
  }));
  const staffed = staffGaps(inputs, roster.roster.people, roster.roster.walkingMinutes, ctx.wallTime, search);
  const snugMarginMinutes = input.snugMarginMinutes ?? DEFAULT_SNUG_MARGIN_MINUTES;
  roster.pending.forEach((gap, i) => {
    const result = staffed.gaps[i]!;
    const availableMinutes = inputs[i]!.availableMinutes;
    const judged = gapVerdict({ availableMinutes, requiredMinutes: result.requiredMinutes, snugMarginMinutes });
    ctx.summary[judged.verdict]++;
    ctx.summary.minutesShort += judged.shortByMinutes;
    if (!ctx.detailed) return;
    const planned = toPlanGap(gap.previous, gap.slot, result.startMs, result.turnover, availableMinutes, judged, format);
    const reason = result.reason;
    gap.gaps[gap.index] = {
      ...planned,
      requiredMinutes: result.requiredMinutes,
      crew: result.crew,
      people: reason && {
        kind: reason.kind,
        personId: reason.personId,
        roomId: reason.roomId,
        until: reason.untilMs === null ? null : format(reason.untilMs),
        wanted: reason.wanted,
        got: reason.got,
        waitedMinutes: reason.waitedMinutes,
      },
    };
  });
  return {
    source: roster.roster.source,
    walkingMinutes: roster.roster.walkingMinutes,
    people: roster.roster.people.map((person) => ({
      id: person.id,
      label: person.label,
      name: person.name,
      role: person.role,
      start: format(ctx.wallTime(person.start)),
      end: format(ctx.wallTime(person.end)),
      breaks: person.breaks.map((b) => ({ start: format(ctx.wallTime(b.start)), end: format(ctx.wallTime(b.end)) })),
      roomIds: [...person.roomIds],
      work: (staffed.work.get(person.id) ?? []).map((w) => ({ roomId: w.roomId, toExamId: w.toExamId, start: format(w.startMs), end: format(w.endMs) })),
    })),
    uncoveredRoomIds: input.rooms.filter((room) => !roster.covered.has(room.id)).map((room) => room.id),
    provenOptimal: staffed.provenOptimal,
  };
}


