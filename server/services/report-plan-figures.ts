import type { Knex } from 'knex';
import type { VerdictCounts } from '../../shared/api/reports';
import { computeDayPlan } from '../../shared/turnover';
import { SETUP_VERSION_KEY } from './day-version';
import { loadDayPlanInput } from './day-plan';
import { roomVerdicts } from './import-verdicts';

/*
 * The part of a report that comes from each day's plan (gap verdicts now, planned turnover
 * minutes, exam and open minutes): the engine on the day's stored list, kept per day version so a
 * report re-read costs queries. The engine runs once per day not yet kept, between awaits, so the
 * event loop is held one day's plan at a time.
 */

const MINUTE = 60_000;

/** What a report needs from one day's plan, for every room (the room filter applies later). */
export interface DayFigures {
  hasExams: boolean;
  rooms: Map<number, { name: string; verdicts: VerdictCounts; examMinutes: number; openMinutes: number }>;
  /** The plan's required minutes for the gap after an exam, by `roomId|accession`. */
  gapAfter: Map<string, number>;
}

const KEPT_DAYS = 1_000;
// Per database, per day: the figures and the versions they were computed at. Oldest out first.
const kept = new WeakMap<Knex, Map<string, { versions: string; figures: DayFigures }>>();

/** The report for a range (both days included) and, optionally, one room. */
/**
 * Each day's plan figures, computed on a miss and kept under the day's and the setup's versions
 * (the same key as the plan cache: a change to the day's list, staffing, rooms or settings makes
 * a new one). Figures computed while the day changed are used once and not kept.
 */
export async function dayFiguresOf(db: Knex, days: string[]): Promise<Map<string, DayFigures>> {
  let cache = kept.get(db);
  if (!cache) kept.set(db, (cache = new Map()));
  const versionsOf = async () => {
    const rows: { day: string; version: number }[] = await db('day_versions')
      .whereBetween('day', [days[0]!, days[days.length - 1]!])
      .orWhere('day', SETUP_VERSION_KEY)
      .select('day', 'version');
    const setup = Number(rows.find((r) => r.day === SETUP_VERSION_KEY)?.version ?? 0);
    const byDay = new Map(rows.map((r) => [r.day, Number(r.version)]));
    return (day: string) => `${byDay.get(day) ?? 0}:${setup}`;
  };
  const before = await versionsOf();
  const out = new Map<string, DayFigures>();
  const computed: string[] = [];
  for (const day of days) {
    const hit = cache.get(day);
    if (hit && hit.versions === before(day)) {
      out.set(day, hit.figures);
      continue;
    }
    out.set(day, figuresOfPlan(computeDayPlan(await loadDayPlanInput(db, day))));
    computed.push(day);
  }
  if (computed.length > 0) {
    const after = await versionsOf();
    for (const day of computed) {
      if (after(day) !== before(day)) continue;
      cache.delete(day);
      cache.set(day, { versions: before(day), figures: out.get(day)! });
    }
    while (cache.size > KEPT_DAYS) cache.delete(cache.keys().next().value!);
  }
  return out;
}

function figuresOfPlan(plan: ReturnType<typeof computeDayPlan>): DayFigures {
  const rooms: DayFigures['rooms'] = new Map();
  const gapAfter = new Map<string, number>();
  let hasExams = false;
  for (const room of plan.rooms) {
    const accession = new Map(room.exams.map((e) => [e.id, e.accession]));
    for (const gap of room.gaps) {
      if (gap.fromExamId !== null) gapAfter.set(`${room.id}|${accession.get(gap.fromExamId)}`, gap.requiredMinutes);
    }
    if (room.exams.length > 0) hasExams = true;
    rooms.set(room.id, {
      name: room.name,
      verdicts: roomVerdicts(room),
      examMinutes: room.exams.reduce((sum, e) => sum + e.durationMinutes, 0),
      openMinutes: Math.round((Date.parse(room.closesAt) - Date.parse(room.opensAt)) / MINUTE),
    });
  }
  return { hasExams, rooms, gapAfter };
}
