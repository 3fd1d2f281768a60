import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { ValidationError } from '../errors';
import { readSettings } from '../services/settings';
import { parseDay } from './days';

/** A positive whole-number id from a path parameter, else 422. */
export function idParam(value: unknown, what: string): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new ValidationError(`"${String(value)}" is not ${what} id.`);
  return id;
}

/** `?date=` when given, else the site's today at the server's clock. */
export async function dayOrToday(db: Knex, value: unknown, now: Date): Promise<string> {
  if (value !== undefined && value !== '') return parseDay(value);
  const { timezone } = await readSettings(db);
  return DateTime.fromJSDate(now, { zone: timezone }).toISODate()!;
}
