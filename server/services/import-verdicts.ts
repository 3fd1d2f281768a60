import type { Knex } from 'knex';
import type { PlanRoom } from '../../shared/api/plan';
import type { VerdictCounts } from '../../shared/api/reports';
import { loadDayPlan } from './day-plan';

/** A room's gap verdicts and minutes short on a plan. */
export function roomVerdicts(room: Pick<PlanRoom, 'gaps'>): VerdictCounts {
  const counts: VerdictCounts = { fits: 0, snug: 0, short: 0, overlap: 0, minutesShort: 0 };
  for (const gap of room.gaps) {
    counts[gap.verdict] += 1;
    counts.minutesShort += gap.shortByMinutes;
  }
  return counts;
}

/**
 * Keeps the verdicts of the day's plan as its latest import left it (called right after the
 * commit), one row per room: Reports' "as imported".
 */
export async function recordImportVerdicts(db: Knex, day: string): Promise<void> {
  const latest = await db('imports').where({ day }).max('id as id').first();
  if (!latest?.id) return;
  const plan = await loadDayPlan(db, day);
  const rows = plan.rooms.map((room) => {
    const v = roomVerdicts(room);
    return { import_id: latest.id, room_id: room.id, fits: v.fits, snug: v.snug, short: v.short, overlap: v.overlap, minutes_short: v.minutesShort };
  });
  if (rows.length > 0) await db('import_verdicts').insert(rows).onConflict(['import_id', 'room_id']).ignore();
}
