import { DateTime } from 'luxon';

/**
 * Time left until `until` as a countdown: `m:ss`, or `h:mm:ss` from an hour up; `0:00` once
 * passed (the caller decides what "over" means). Seconds round up so `0:00` only shows when
 * the time has truly come.
 *
 * @example
 * countdown('2027-03-15T10:42:00-05:00', Date.parse('2027-03-15T10:38:40-05:00')); // '3:20'
 */
export function countdown(until: string, nowMs: number): string {
  const left = Math.max(0, Math.ceil((Date.parse(until) - nowMs) / 1000));
  const hours = Math.floor(left / 3600);
  const minutes = Math.floor((left % 3600) / 60);
  const seconds = String(left % 60).padStart(2, '0');
  return hours > 0 ? `${hours}:${String(minutes).padStart(2, '0')}:${seconds}` : `${minutes}:${seconds}`;
}

/**
 * Whether `until` is still ahead of `nowMs`.
 *
 * @example
 * isAhead('2027-03-15T10:42:00-05:00', Date.parse('2027-03-15T10:38:40-05:00')); // true
 */
export function isAhead(until: string | null, nowMs: number): boolean {
  return until !== null && Date.parse(until) > nowMs;
}

/**
 * How far the server's clock is ahead of the browser's, in ms, from the `now` a response
 * carries. Countdowns add it so a tablet with a wrong clock still counts to the server's times.
 *
 * @example
 * serverSkew('2027-03-15T10:00:05-05:00', Date.parse('2027-03-15T10:00:00-05:00')); // 5000
 */
export function serverSkew(serverNow: string, browserNowMs: number): number {
  const server = DateTime.fromISO(serverNow).toMillis();
  return Number.isFinite(server) ? server - browserNowMs : 0;
}
