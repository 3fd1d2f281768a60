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
