import { Pipe, PipeTransform } from '@angular/core';
import { DateTime } from 'luxon';

/**
 * Wall-clock time (`HH:mm`) of an API time. The API writes every time with the site's offset,
 * so keeping that offset (`setZone`) shows site time whatever zone the browser is in.
 *
 * @example
 * siteClock('2027-03-15T07:05:00-05:00'); // '07:05'
 */
export function siteClock(iso: string): string {
  const time = DateTime.fromISO(iso, { setZone: true });
  return time.isValid ? time.toFormat('HH:mm') : '';
}

/**
 * The day as people read it, e.g. "Monday 15 March 2027", for a `YYYY-MM-DD` date.
 *
 * @example
 * longDay('2027-03-15'); // 'Monday 15 March 2027'
 */
export function longDay(date: string): string {
  const day = DateTime.fromISO(date, { zone: 'utc', locale: 'en-GB' });
  return day.isValid ? day.toFormat('cccc d LLLL yyyy') : date;
}

/**
 * A day in short, unambiguous in any country (no 11/3 against 3/11), e.g. "15 Mar 2027".
 *
 * @example
 * shortDay('2027-03-15'); // '15 Mar 2027'
 */
export function shortDay(date: string): string {
  const day = DateTime.fromISO(date, { zone: 'utc', locale: 'en-GB' });
  return day.isValid ? day.toFormat('d LLL yyyy') : date;
}

/**
 * The `YYYY-MM-DD` date `days` away from `date` (calendar days, so daylight-saving days count as one).
 *
 * @example
 * shiftDay('2027-03-15', -1); // '2027-03-14'
 */
export function shiftDay(date: string, days: number): string {
  return DateTime.fromISO(date, { zone: 'utc' }).plus({ days }).toISODate() ?? date;
}

/** `{{ exam.start | siteTime }}` → `07:05`; see {@link siteClock}. */
@Pipe({ name: 'siteTime' })
export class SiteTime implements PipeTransform {
  transform(iso: string | null | undefined): string {
    return iso ? siteClock(iso) : '';
  }
}
