import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { readSettings } from './settings';

/** `YYYY-MM-DD` at the site (its IANA zone) at `now`. */
export async function siteToday(db: Knex, now: Date): Promise<string> {
  const { timezone } = await readSettings(db);
  return DateTime.fromJSDate(now, { zone: timezone }).toISODate()!;
}
