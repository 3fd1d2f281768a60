import type { Knex } from 'knex';

/**
 * The day's version: rises with every change to its exams or turnover staffing (kept by
 * triggers, see the day-versions migration); 0 for a day never written.
 *
 * @example
 * const before = await dayVersion(db, '2027-03-10'); // e.g. 12
 */
export async function dayVersion(db: Knex, day: string): Promise<number> {
  const row = await db('day_versions').where({ day }).first('version');
  return row ? Number(row.version) : 0;
}

/** Key of the versions row that counts changes to the rooms and settings, which every day's plan depends on. */
export const SETUP_VERSION_KEY = 'setup';

/**
 * The day's version and the setup's (rooms and settings), in one query: what a plan is computed from.
 *
 * @example
 * await planVersions(db, '2027-03-10'); // { day: 12, setup: 3 }
 */
export async function planVersions(db: Knex, day: string): Promise<{ day: number; setup: number }> {
  const rows: { day: string; version: number }[] = await db('day_versions').whereIn('day', [day, SETUP_VERSION_KEY]).select('day', 'version');
  const of = (key: string) => Number(rows.find((r) => r.day === key)?.version ?? 0);
  return { day: of(day), setup: of(SETUP_VERSION_KEY) };
}
