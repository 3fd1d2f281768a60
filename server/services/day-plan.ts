import type { Knex } from 'knex';
import { computeDayPlan, computeDaySummary, type DayPlanExam, type DayPlanInput, type DayPlanRoster } from '../../shared/turnover';
import type { PlannedDay, PlanSummary } from '../../shared/api/plan';
import { planVersions } from './day-version';
import { examsOfDay, toPlanExam } from './exams';
import { cachedPlan, type CachedPlan } from './plan-cache';
import { roomsOnDay, type RoomOnDay } from './room-hours';
import { rosterForPlan } from './roster';
import { readSettings } from './settings';
import { setupForDay, setupSnapshot, type SetupSnapshot } from './site-setup';

/** The day's plan from what is stored (rooms, settings, the day list and staffing), with that input. */
export async function loadDayPlan(db: Knex, day: string): Promise<PlannedDay> {
  // loadCachedDayPlan only ever keeps a planned day (see its compute below).
  return (await loadCachedDayPlan(db, day)).plan as PlannedDay;
}

/**
 * The day's plan with its JSON and ETag, computed once per version of the day and its setup:
 * a busy morning's many reads of an unchanged day cost three small queries each.
 */
export async function loadCachedDayPlan(db: Knex, day: string): Promise<CachedPlan> {
  // Versions are read before the data, so a plan is never kept under newer versions than its data.
  const versions = await planVersions(db, day);
  const key = `${day}:${versions.day}:${versions.setup}`;
  return cachedPlan(
    db,
    key,
    async (): Promise<PlannedDay> => {
      const input = await loadDayPlanInput(db, day);
      // The input travels with the plan (and its ETag), so the client previews moves from exactly it.
      return { ...computeDayPlan(input), input };
    },
    async () => {
      const now = await planVersions(db, day);
      return now.day === versions.day && now.setup === versions.setup;
    },
  );
}

/** What a day's plan is computed from, as stored. */
export async function loadDayPlanInput(db: Knex, day: string): Promise<DayPlanInput> {
  const [settings, rooms, exams, staffing, setup, roster] = await Promise.all([
    readSettings(db),
    roomsOnDay(db, day),
    examsOfDay(db, day),
    db('gap_staffing').join('exams', 'exams.id', 'gap_staffing.to_exam_id').where('exams.day', day).select('to_exam_id', 'staff'),
    setupSnapshot(db),
    rosterForPlan(db, day),
  ]);
  const staffOverrides = Object.fromEntries(staffing.map((s: { to_exam_id: number; staff: number }) => [s.to_exam_id, s.staff]));
  return dayPlanInput(day, settings, rooms, exams.map(toPlanExam), staffOverrides, setup, roster);
}

/**
 * The verdict counts a would-be list (an import preview) gives, with the site's settings; only
 * the summary is needed, so the steps' clock times are never written out.
 */
export function summaryFor(
  day: string,
  settings: { timezone: string; snugMarginMinutes: number },
  rooms: RoomOnDay[],
  exams: DayPlanExam[],
  setup: SetupSnapshot,
  roster?: DayPlanRoster,
): PlanSummary {
  return computeDaySummary(dayPlanInput(day, settings, rooms, exams, {}, setup, roster));
}

function dayPlanInput(
  day: string,
  settings: { timezone: string; snugMarginMinutes: number },
  rooms: RoomOnDay[],
  exams: DayPlanExam[],
  staffOverrides: Record<number, number>,
  setup: SetupSnapshot,
  roster: DayPlanRoster | undefined,
): DayPlanInput {
  const roomIds = new Set(rooms.map((r) => r.id));
  const input: DayPlanInput = {
    date: day,
    timezone: settings.timezone,
    snugMarginMinutes: settings.snugMarginMinutes,
    // the site's own products and the protocol versions in force on the day: never a default
    ...setupForDay(setup, day),
    rooms,
    // an exam in a room that was since retired stays stored but leaves the plan
    exams: exams.filter((e) => roomIds.has(e.roomId)),
    staffOverrides,
  };
  // Without a roster the input (and so the plan and its ETag) is exactly what it was before rosters.
  return roster ? { ...input, roster } : input;
}
