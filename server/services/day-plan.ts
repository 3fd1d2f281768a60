import type { Knex } from 'knex';
import { computeDayPlan, type DayPlanExam, type DayPlanInput } from '../../shared/turnover';
import type { DayPlan } from '../../shared/api/plan';
import type { Room } from '../../shared/api/rooms';
import { examsOfDay, toPlanExam } from './exams';
import { listRooms } from './rooms';
import { readSettings } from './settings';

/** The day's plan from what is stored: rooms, settings, the day list and staffing. */
export async function loadDayPlan(db: Knex, day: string): Promise<DayPlan> {
  return computeDayPlan(await loadDayPlanInput(db, day));
}

/** What a day's plan is computed from, as stored. */
export async function loadDayPlanInput(db: Knex, day: string): Promise<DayPlanInput> {
  const [settings, rooms, exams, staffing] = await Promise.all([
    readSettings(db),
    listRooms(db),
    examsOfDay(db, day),
    db('gap_staffing').join('exams', 'exams.id', 'gap_staffing.to_exam_id').where('exams.day', day).select('to_exam_id', 'staff'),
  ]);
  const staffOverrides = Object.fromEntries(staffing.map((s: { to_exam_id: number; staff: number }) => [s.to_exam_id, s.staff]));
  return dayPlanInput(day, settings, rooms, exams.map(toPlanExam), staffOverrides);
}

/** Computes a plan for given exams (stored or would-be), with the site's settings. */
export function planFor(
  day: string,
  settings: { timezone: string; snugMarginMinutes: number },
  rooms: Room[],
  exams: DayPlanExam[],
): DayPlan {
  return computeDayPlan(dayPlanInput(day, settings, rooms, exams, {}));
}

function dayPlanInput(
  day: string,
  settings: { timezone: string; snugMarginMinutes: number },
  rooms: Room[],
  exams: DayPlanExam[],
  staffOverrides: Record<number, number>,
): DayPlanInput {
  const roomIds = new Set(rooms.map((r) => r.id));
  return {
    date: day,
    timezone: settings.timezone,
    snugMarginMinutes: settings.snugMarginMinutes,
    rooms,
    // an exam in a room that was since retired stays stored but leaves the plan
    exams: exams.filter((e) => roomIds.has(e.roomId)),
    staffOverrides,
  };
}
