import { DateTime } from 'luxon';
import type { DayPlan, PlanGap, PlanRoom, PlanSummary } from './day-plan-types';
import { DEFAULT_CLOSES_AT, DEFAULT_OPENS_AT, type DayPlanInput, type DayPlanRoom } from './day-plan-input';
import type { Protocol } from './model';
import { turnoverCaches, turnoverFor, type TurnoverCache } from './day-plan-cache';
import { toPlanExam, toPlanGap, type DayPlanSlot } from './day-plan-output';
import { NO_PROTOCOL_MESSAGE } from './no-protocol';
import { protocolFor } from './protocols';
import { DEFAULT_SNUG_MARGIN_MINUTES, gapVerdict } from './verdict';
import { instantOf, wallTimeToMillis, zonedFormatter, type ZonedFormatter } from './zoned-time';
import { rosterContext, staffRosterGaps, type RosterContext } from './day-plan-roster';
import type { AssignCrewsOptions } from '../roster/assign-crews';

const MINUTE = 60_000;

/**
 * The whole day's plan: per room, its exams in start order and every gap's turnover and verdict,
 * the first gap measured from the room's opening (its opening steps). Exams outside opening
 * hours are flagged, never refused. Times out are ISO 8601 with the site's offset; available
 * minutes are real elapsed minutes, so a daylight-saving day counts its missing or extra hour.
 * Fast on big days: each distinct kind of gap is solved once.
 *
 * @throws RangeError on a bad date, zone, duration, staff or air-change rate (airborne gaps);
 *   Error on an exam in an unknown room or what the turnover engine refuses
 * @example
 * const plan = computeDayPlan({ date: '2027-03-15', timezone: 'America/Chicago', rooms, exams });
 * plan.summary; // { fits: 9, snug: 2, short: 1, overlap: 0, minutesShort: 4 }
 */
export function computeDayPlan(input: DayPlanInput, options: DayPlanOptions = {}): DayPlan {
  const { summary, rooms, people } = planDay(input, true, options);
  return people ? { date: input.date, timezone: input.timezone, rooms, summary, people } : { date: input.date, timezone: input.timezone, rooms, summary };
}

/**
 * The day plan's summary alone, as `computeDayPlan(input).summary` gives it (same checks, same
 * errors) without writing out every step's clock times: what an import preview needs, at a
 * fraction of the time and memory for a big day.
 *
 * @throws what {@link computeDayPlan} throws
 * @example
 * computeDaySummary({ date: '2027-03-15', timezone: 'America/Chicago', rooms, exams });
 * // { fits: 9, snug: 2, short: 1, overlap: 0, minutesShort: 4 }
 */
export function computeDaySummary(input: DayPlanInput, options: DayPlanOptions = {}): PlanSummary {
  return planDay(input, false, options).summary;
}

/** How hard a day with a roster searches for its crews (shared/roster `assignCrews`); the defaults serve the plan. */
export interface DayPlanOptions {
  crewSearch?: AssignCrewsOptions;
}

interface RoomContext {
  input: DayPlanInput;
  format: ZonedFormatter;
  summary: PlanSummary;
  turnovers: (protocol: Protocol) => TurnoverCache;
  staffOverrides: DayPlanInput['staffOverrides'];
  wallTime: (hhmm: string) => number;
  /** False when only the summary is wanted: gaps and exams are judged but not written out. */
  detailed: boolean;
  /** The roster's rooms and the gaps waiting for its people; null without a roster. */
  roster: RosterContext | null;
}

function planDay(input: DayPlanInput, detailed: boolean, options: DayPlanOptions): { summary: PlanSummary; rooms: PlanRoom[]; people?: DayPlan['people'] } {
  const { date, timezone } = input;
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date) || !DateTime.fromISO(date).isValid) {
    throw new RangeError(`date must be YYYY-MM-DD, got "${date}"`);
  }
  const format = zonedFormatter(timezone);
  const byRoom = new Map<number, DayPlanSlot[]>(input.rooms.map((room) => [room.id, []]));
  for (const exam of input.exams) {
    const slots = byRoom.get(exam.roomId);
    if (!slots) throw new Error(`exam ${exam.id} is in unknown room ${exam.roomId}`);
    if (!Number.isFinite(exam.durationMinutes) || exam.durationMinutes < 0) {
      throw new RangeError(`exam ${exam.id}: durationMinutes must be a number ≥ 0, got ${exam.durationMinutes}`);
    }
    const startMs = instantOf(exam.start, timezone);
    slots.push({ exam, startMs, endMs: startMs + exam.durationMinutes * MINUTE });
  }
  const summary: PlanSummary = { fits: 0, snug: 0, short: 0, overlap: 0, minutesShort: 0 };
  const wallTimes = new Map<string, number>();
  const ctx: RoomContext = {
    input,
    format,
    summary,
    turnovers: turnoverCaches(input),
    // Looking up a negative id (a would-be exam) even in an empty object builds a string key.
    staffOverrides: input.staffOverrides && Object.keys(input.staffOverrides).length > 0 ? input.staffOverrides : undefined,
    wallTime: (hhmm) => {
      let ms = wallTimes.get(hhmm);
      if (ms === undefined) wallTimes.set(hhmm, (ms = wallTimeToMillis(date, hhmm, timezone)));
      return ms;
    },
    detailed,
    roster: rosterContext(input),
  };
  const rooms: PlanRoom[] = [];
  for (const room of input.rooms) {
    const planned = planRoom(room, byRoom.get(room.id)!, ctx);
    if (planned) rooms.push(planned);
  }
  // The roster's gaps are judged once every room has handed them over: they compete for people.
  const people = ctx.roster ? staffRosterGaps(ctx.roster, ctx, options.crewSearch) : undefined;
  return people ? { summary, rooms, people } : { summary, rooms };
}

function planRoom(room: DayPlanRoom, slots: DayPlanSlot[], ctx: RoomContext): PlanRoom | null {
  const { input, format } = ctx;
  const opensAt = room.opensAt ?? DEFAULT_OPENS_AT;
  const closesAt = room.closesAt ?? DEFAULT_CLOSES_AT;
  const openMs = ctx.wallTime(opensAt);
  let closeMs = ctx.wallTime(closesAt);
  if (room.closed) closeMs = openMs;
  else if (closeMs <= openMs) closeMs = wallTimeToMillis(nextDate(input.date), closesAt, input.timezone);

  slots.sort((a, b) => a.startMs - b.startMs || a.exam.id - b.exam.id);
  const protocol = protocolFor(room.modality, input.protocols);
  const cache = protocol ? ctx.turnovers(protocol) : null;
  const snugMarginMinutes = input.snugMarginMinutes ?? DEFAULT_SNUG_MARGIN_MINUTES;
  const gaps: PlanGap[] = [];
  let previous: DayPlanSlot | null = null;
  // Without a protocol there is nothing to compute from: no gaps, no verdicts, not counted.
  const rostered = ctx.roster?.covered.has(room.id) === true;
  for (const slot of protocol && cache ? slots : []) {
    const staff = ctx.staffOverrides?.[slot.exam.id] ?? room.staff;
    if (rostered) {
      const fromMs = previous ? previous.endMs : openMs;
      ctx.roster!.pending.push({ room, previous, slot, fromMs, wanted: staff, cache: cache!, protocol: protocol!, gaps, index: gaps.length });
      if (ctx.detailed) gaps.push(null as unknown as PlanGap); // filled by staffRosterGaps
      previous = slot;
      continue;
    }
    const turnover = turnoverFor(cache!, { input, room, protocol: protocol!, leaving: previous?.exam ?? null, arriving: slot.exam, staff });
    const fromMs = previous ? previous.endMs : openMs;
    const availableMinutes = Math.floor((slot.startMs - fromMs) / MINUTE);
    const judged = gapVerdict({ availableMinutes, requiredMinutes: turnover.requiredMinutes, snugMarginMinutes });
    ctx.summary[judged.verdict]++;
    ctx.summary.minutesShort += judged.shortByMinutes;
    if (ctx.detailed) gaps.push(toPlanGap(previous, slot, fromMs, turnover, availableMinutes, judged, format));
    previous = slot;
  }
  if (!ctx.detailed) return null;
  return {
    id: room.id,
    name: room.name,
    modality: room.modality,
    staff: room.staff,
    protocol: protocol
      ? { id: protocol.id ?? null, modality: protocol.modality, version: protocol.version ?? null, effectiveFrom: protocol.effectiveFrom ?? null }
      : null,
    message: protocol ? null : NO_PROTOCOL_MESSAGE(room.modality),
    closed: room.closed === true,
    opensAt: format(openMs),
    closesAt: format(closeMs),
    exams: slots.map((slot) => toPlanExam(slot, format, slot.startMs < openMs || slot.endMs > closeMs)),
    gaps,
  };
}

function nextDate(date: string): string {
  return DateTime.fromISO(date, { zone: 'UTC' }).plus({ days: 1 }).toISODate()!;
}
