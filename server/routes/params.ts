import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { ValidationError } from '../errors';
import { readSettings } from '../services/settings';

// Every route reads its path and query values through these, so they refuse alike (422).

/** Rooms may close after midnight, so a day's plan reaches into the next: that day must be writable too. */
const LAST_DAY = '9999-12-30';

/** `YYYY-MM-DD` that is a real calendar day (up to {@link LAST_DAY}). */
export function parseDay(value: unknown): string {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value) || !DateTime.fromISO(value).isValid || value > LAST_DAY) {
    throw new ValidationError(`"${String(value ?? '')}" is not a date; use YYYY-MM-DD.`);
  }
  return value;
}

const MAX_ID = 2_147_483_647;

/** A positive whole-number id from a path parameter, else 422. */
export function idParam(value: unknown, what: string): number {
  const id = Number(value);
  // ids are 32-bit integers (PostgreSQL refuses a larger one in a query rather than finding nothing)
  if (!Number.isInteger(id) || id <= 0 || id > MAX_ID) throw new ValidationError(`"${String(value)}" is not ${what} id.`);
  return id;
}

/** `?date=` when given, else the site's today at the server's clock. */
export async function dayOrToday(db: Knex, value: unknown, now: Date): Promise<string> {
  if (value !== undefined && value !== '') return parseDay(value);
  const { timezone } = await readSettings(db);
  return DateTime.fromJSDate(now, { zone: timezone }).toISODate()!;
}
