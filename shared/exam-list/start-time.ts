import { DateTime, IANAZone } from 'luxon';
import { zonedFormatter, zonedOffset } from '../turnover/zoned-time';

/**
 * Outcome of reading one `start` cell.
 *
 * @example
 * const r: StartResolution = { ok: true, start: '2027-11-07T01:30:00-05:00', warning: '01:30 happens twice …' };
 */
export type StartResolution =
  | { ok: true; start: string; warning?: string }
  | { ok: false; message: string };

const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;
const LOCAL_TIME = /^(\d{1,2}):(\d{2})$/;
// What readExamFile writes for an Excel date-and-time cell; it carries no offset.
const LOCAL_DATE_TIME = /^(\d{4}-\d{2}-\d{2})[T ](\d{1,2}):(\d{2})$/;
const ISO_WITH_OFFSET = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}(:?\d{2})?)$/i;

/**
 * Reads a `start` cell against the day being imported and the site's zone.
 *
 * Accepts `HH:MM` or `H:MM` (site time on `date`), `YYYY-MM-DDTHH:MM` without offset (what an
 * Excel date-and-time cell becomes; its date must be `date`) and ISO 8601 with an offset (its
 * instant must fall on `date` in the site's zone). A time that a spring-forward change skips is
 * an error; a time that a fall-back change repeats takes the first occurrence, with a warning.
 *
 * @example
 * resolveStart('8:30', { date: '2027-03-14', timezone: 'America/Chicago' });
 * // { ok: true, start: '2027-03-14T08:30:00-05:00' }
 * resolveStart('02:30', { date: '2027-03-14', timezone: 'America/Chicago' });
 * // { ok: false, message: '02:30 does not exist on 2027-03-14 in America/Chicago: clocks skip from 02:00 to 03:00' }
 */
export function resolveStart(value: string, site: { date: string; timezone: string }): StartResolution {
  const local = LOCAL_TIME.exec(value);
  if (local) return resolveLocal(Number(local[1]), Number(local[2]), site);
  const localDateTime = LOCAL_DATE_TIME.exec(value);
  if (localDateTime) {
    if (localDateTime[1] !== site.date) {
      return { ok: false, message: `${value} is on ${localDateTime[1]}, not on ${site.date}, the day being imported.` };
    }
    return resolveLocal(Number(localDateTime[2]), Number(localDateTime[3]), site);
  }
  if (ISO_WITH_OFFSET.test(value)) return resolveIso(value, site);
  return { ok: false, message: `"${value}" is not a start time: write HH:MM (24-hour, site time) or ISO 8601 with an offset, e.g. 08:30 or ${exampleIso(site)}.` };
}

function resolveLocal(hour: number, minute: number, site: { date: string; timezone: string }): StartResolution {
  const hhmm = `${pad(hour)}:${pad(minute)}`;
  if (hour > 23 || minute > 59) {
    return { ok: false, message: `${hhmm} is not a time of day: hours run 00–23 and minutes 00–59.` };
  }
  const zone = IANAZone.create(site.timezone);
  // Luxon asks Intl for each offset (~15 µs); the shared per-hour lookup answers the same.
  // (Measured: the same checks through luxon's getPossibleOffsets and toISO made the 2,000-row
  // import bench's dry run 1.5–3× slower, past its target, so the lookup stays; time.bench.ts.)
  const offsetAt = zone.isValid ? zonedOffset(site.timezone) : (ms: number) => zone.offset(ms);
  const [year, month, day] = site.date.split('-').map(Number);
  // Wall-clock time written as if it were UTC; each candidate offset turns it into an instant.
  const wall = Date.UTC(year, month - 1, day, hour, minute);
  const instants = [...new Set([offsetAt(wall - DAY), offsetAt(wall), offsetAt(wall + DAY)])]
    .map((offset) => wall - offset * MINUTE)
    .filter((instant) => offsetAt(instant) * MINUTE === wall - instant)
    .sort((a, b) => a - b);

  if (instants.length === 0) {
    const { from, to } = transitionAround(offsetAt, wall - offsetAt(wall + DAY) * MINUTE, wall - offsetAt(wall - DAY) * MINUTE);
    return { ok: false, message: `${hhmm} does not exist on ${site.date} in ${site.timezone}: clocks skip from ${from} to ${to}` };
  }
  const start = isoInZone(instants[0], site.timezone);
  if (instants.length === 1) return { ok: true, start };

  const { from, to } = transitionAround(offsetAt, instants[0], instants[instants.length - 1]);
  const offset = start.slice(-6);
  const second = DateTime.fromMillis(instants[instants.length - 1], { zone: site.timezone }).toFormat('ZZ');
  return {
    ok: true,
    start,
    warning:
      `${hhmm} happens twice on ${site.date} in ${site.timezone} (clocks go back from ${from} to ${to}); ` +
      `the first one was taken (UTC${offset}). For the second, write ${site.date}T${hhmm}${second}.`,
  };
}

function resolveIso(value: string, site: { date: string; timezone: string }): StartResolution {
  const parsed = DateTime.fromISO(value, { setZone: true });
  if (!parsed.isValid) return { ok: false, message: `${value} is not a valid date and time.` };
  const inSite = parsed.setZone(site.timezone);
  if (inSite.toISODate() !== site.date) {
    return {
      ok: false,
      message: `${value} is ${inSite.toFormat('yyyy-MM-dd HH:mm')} in ${site.timezone}, not on ${site.date}, the day being imported.`,
    };
  }
  return { ok: true, start: isoInZone(inSite.toMillis(), site.timezone) };
}

/**
 * Finds the offset change between two instants (`before` < change <= `after`) and returns the
 * wall-clock times it jumps between, by bisection: a handful of steps for a gap of an hour or two.
 */
function transitionAround(offsetAt: (ms: number) => number, before: number, after: number): { from: string; to: string } {
  const offsetBefore = offsetAt(before);
  let low = before;
  let high = after;
  while (high - low > MINUTE) {
    const middle = low + Math.floor((high - low) / 2 / MINUTE) * MINUTE;
    if (offsetAt(middle) === offsetBefore) low = middle;
    else high = middle;
  }
  const offsetAfter = offsetAt(high);
  return { from: wallClock(high + offsetBefore * MINUTE), to: wallClock(high + offsetAfter * MINUTE) };
}

function wallClock(wallAsUtc: number): string {
  const d = new Date(wallAsUtc);
  return `${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}`;
}

// Only reached with a valid zone; the formatter gives luxon's toISO text without its cost.
function isoInZone(instant: number, timezone: string): string {
  return zonedFormatter(timezone)(instant);
}

function exampleIso(site: { date: string; timezone: string }): string {
  const example = DateTime.fromISO(`${site.date}T08:30`, { zone: site.timezone });
  return example.isValid ? (example.toISO({ suppressMilliseconds: true }) as string) : `${site.date}T08:30:00+00:00`;
}

function pad(n: number): string {
  return String(n).padStart(2, '0');
}
