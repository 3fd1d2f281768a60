import type { Verdict } from './model';

export interface GapVerdictOptions {
  /** Real elapsed minutes from A's end (or the room's opening) to B's start; negative when they overlap. */
  availableMinutes: number;
  /** Minutes the turnover needs (ready-at − A's end). */
  requiredMinutes: number;
  /** A gap with less than this spare is `snug`. Default 3. */
  snugMarginMinutes?: number;
}

export interface GapVerdict {
  verdict: Verdict;
  /** max(0, required − available). */
  shortByMinutes: number;
}

/** The site's default snug margin, in minutes. */
export const DEFAULT_SNUG_MARGIN_MINUTES = 3;

/**
 * The verdict of a gap: `overlap` if available < 0, `short` if available < required,
 * `snug` if available < required + margin, else `fits`.
 *
 * @throws RangeError when a value is not a finite number, or required or margin is negative
 * @example
 * gapVerdict({ availableMinutes: 21, requiredMinutes: 20 });  // { verdict: 'snug', shortByMinutes: 0 }
 * gapVerdict({ availableMinutes: 15, requiredMinutes: 20 });  // { verdict: 'short', shortByMinutes: 5 }
 * gapVerdict({ availableMinutes: -5, requiredMinutes: 20 });  // { verdict: 'overlap', shortByMinutes: 25 }
 */
export function gapVerdict({
  availableMinutes,
  requiredMinutes,
  snugMarginMinutes = DEFAULT_SNUG_MARGIN_MINUTES,
}: GapVerdictOptions): GapVerdict {
  if (!Number.isFinite(availableMinutes)) {
    throw new RangeError(`availableMinutes must be a finite number, got ${availableMinutes}`);
  }
  if (!Number.isFinite(requiredMinutes) || requiredMinutes < 0) {
    throw new RangeError(`requiredMinutes must be a number ≥ 0, got ${requiredMinutes}`);
  }
  if (!Number.isFinite(snugMarginMinutes) || snugMarginMinutes < 0) {
    throw new RangeError(`snugMarginMinutes must be a number ≥ 0, got ${snugMarginMinutes}`);
  }
  const shortByMinutes = Math.max(0, requiredMinutes - availableMinutes);
  let verdict: Verdict;
  if (availableMinutes < 0) verdict = 'overlap';
  else if (availableMinutes < requiredMinutes) verdict = 'short';
  else if (availableMinutes < requiredMinutes + snugMarginMinutes) verdict = 'snug';
  else verdict = 'fits';
  return { verdict, shortByMinutes };
}

/**
 * Real elapsed whole minutes between two ISO 8601 instants (with offset), rounded down so a
 * gap is never reported longer than it is. A day crossing a daylight-saving change has an hour
 * more or less than its wall clock shows; this counts the real time.
 *
 * @throws RangeError when either string is not a valid ISO instant with offset
 * @example
 * // America/Chicago springs forward at 02:00 on 14 March 2027:
 * availableMinutesBetween('2027-03-14T01:50:00-06:00', '2027-03-14T03:10:00-05:00'); // 20
 */
export function availableMinutesBetween(fromIso: string, toIso: string): number {
  const from = parseInstant(fromIso);
  const to = parseInstant(toIso);
  return Math.floor((to - from) / 60_000);
}

const OFFSET_AT_END = /(?:Z|[+-]\d{2}(?::?\d{2})?)$/i;

/**
 * Milliseconds since the epoch of an ISO 8601 date-time that carries an offset (or Z).
 * A string without an offset is refused: its instant depends on a zone it does not name.
 *
 * @throws RangeError on a string without offset or that does not parse
 * @example
 * parseInstant('2027-03-14T03:10:00-05:00'); // 1805011800000
 */
export function parseInstant(iso: string): number {
  const ms = OFFSET_AT_END.test(iso) ? Date.parse(iso) : NaN;
  if (Number.isNaN(ms)) throw new RangeError(`not an ISO 8601 instant with offset: "${iso}"`);
  return ms;
}
