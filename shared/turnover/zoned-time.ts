import { DateTime, Info, type Zone } from 'luxon';

const HOUR = 3_600_000;
const MAX_CACHED_STRINGS = 100_000;
const MAX_CACHED_HOURS = 100_000;
const MINUTES_AROUND = 7 * 24 * 60;

/** Formats instants as ISO 8601 in one zone, exactly as luxon's `toISO({ suppressMilliseconds: true })`. */
export interface ZonedFormatter {
  (ms: number): string;
}

const formatters = new Map<string, ZonedFormatter>();

/**
 * A fast ISO formatter for a zone. Asking luxon for a zone's offset costs ~15 µs (Intl), too
 * slow for a 10,000-exam day; offsets only change at DST transitions, so each hour's offset is
 * looked up once (an hour whose two ends disagree is looked up per instant) and each formatted
 * instant is remembered. Formatters are shared per zone; they hold no state but caches.
 * Measured (engine bench, 10,000 exams): luxon alone for formatting, offsets and parsing takes
 * ~5.4 s warm against ~40 ms with these caches, so they stay (`npm run bench`, time.bench.ts,
 * compares them with luxon per call); luxon remains the reference the specs compare them with.
 *
 * @throws RangeError when the zone is not a valid IANA zone
 * @example
 * zonedFormatter('America/Chicago')(Date.UTC(2027, 2, 14, 8)); // '2027-03-14T03:00:00-05:00'
 */
export function zonedFormatter(zone: string): ZonedFormatter {
  let formatter = formatters.get(zone);
  if (!formatter) {
    formatter = createFormatter(validZone(zone), zonedOffset(zone));
    if (formatters.size >= 16) formatters.clear();
    formatters.set(zone, formatter);
  }
  return formatter;
}

/**
 * The instant of a local wall time on a date in a zone. A time skipped by a spring-forward
 * change moves forward (luxon's rule); a repeated one takes its first occurrence.
 *
 * @throws RangeError on a malformed date or time, or an invalid zone
 * @example
 * wallTimeToMillis('2027-03-14', '07:00', 'America/Chicago'); // Date.UTC(2027, 2, 14, 12)
 */
export function wallTimeToMillis(date: string, hhmm: string, zone: string): number {
  const local = DateTime.fromISO(`${date}T${hhmm}`, { zone: validZone(zone) });
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date) || !/^\d{2}:\d{2}$/.test(hhmm) || !local.isValid) {
    throw new RangeError(`not a valid local date and time: "${date} ${hhmm}"`);
  }
  return local.toMillis();
}

/**
 * Milliseconds of an ISO 8601 date-time: with its own offset when it has one, else read as
 * local time in the zone.
 *
 * @throws RangeError when it does not parse
 * @example
 * instantOf('2027-03-14T08:00', 'America/Chicago') === instantOf('2027-03-14T08:00:00-05:00', 'UTC'); // true
 */
export function instantOf(iso: string, zone: string): number {
  let ms = canonicalInstant(iso);
  // Date.parse is ~50× faster than luxon, but reads an offset-less string in the machine's zone.
  if (Number.isNaN(ms)) ms = /(?:Z|[+-]\d{2}:?\d{2})$/i.test(iso) ? Date.parse(iso) : DateTime.fromISO(iso, { zone }).toMillis();
  if (!Number.isFinite(ms)) throw new RangeError(`not an ISO 8601 date-time: "${iso}"`);
  return ms;
}

/**
 * The instant of `YYYY-MM-DDTHH:MM:SS` with `Z` or `±HH:MM`, the form the server stores, read
 * digit by digit (a day plan reads 10,000 of them); NaN for anything else, including month ends
 * and early years, which callers leave to Date.parse or luxon so their rules stay the only rules.
 *
 * @example
 * canonicalInstant('2027-03-14T03:10:00-05:00'); // Date.UTC(2027, 2, 14, 8, 10)
 * canonicalInstant('2027-03-14T03:10');          // NaN (no offset)
 */
export function canonicalInstant(iso: string): number {
  const n = iso.length;
  if (n !== 20 && n !== 25) return NaN;
  if (iso[4] !== '-' || iso[7] !== '-' || iso[10] !== 'T' || iso[13] !== ':' || iso[16] !== ':') return NaN;
  const year = digits(iso, 0, 4);
  const month = digits(iso, 5, 2);
  const day = digits(iso, 8, 2);
  const hour = digits(iso, 11, 2);
  const minute = digits(iso, 14, 2);
  const second = digits(iso, 17, 2);
  if (!(year >= 1000 && month >= 1 && month <= 12 && day >= 1 && day <= 28 && hour <= 23 && minute <= 59 && second <= 59)) return NaN;
  let offsetMinutes = 0;
  if (n === 20) {
    if (iso[19] !== 'Z') return NaN;
  } else {
    const sign = iso[19] === '+' ? 1 : iso[19] === '-' ? -1 : NaN;
    const hours = digits(iso, 20, 2);
    const minutes = digits(iso, 23, 2);
    if (iso[22] !== ':' || !(hours <= 23 && minutes <= 59)) return NaN;
    offsetMinutes = sign * (hours * 60 + minutes);
  }
  return Date.UTC(year, month - 1, day, hour, minute, second) - offsetMinutes * 60_000;
}

function digits(text: string, at: number, count: number): number {
  let value = 0;
  for (let i = at; i < at + count; i++) {
    const digit = text.charCodeAt(i) - 48;
    if (digit < 0 || digit > 9) return NaN;
    value = value * 10 + digit;
  }
  return value;
}

function validZone(zone: string): Zone {
  const normalized = Info.normalizeZone(zone);
  if (typeof zone !== 'string' || !zone || !normalized.isValid) throw new RangeError(`not an IANA time zone: "${zone}"`);
  return normalized;
}

/**
 * The zone's UTC offset in minutes at an instant, as luxon's `zone.offset(ms)` gives it but
 * looked up once per hour (per instant in an hour that holds a change). Shared per zone.
 *
 * @throws RangeError when the zone is not a valid IANA zone
 * @example
 * zonedOffset('America/Chicago')(Date.UTC(2027, 2, 14, 12)); // -300
 */
export function zonedOffset(zone: string): (ms: number) => number {
  let offsetAt = offsetLookups.get(zone);
  if (!offsetAt) {
    offsetAt = createOffsetLookup(validZone(zone));
    if (offsetLookups.size >= 16) offsetLookups.clear();
    offsetLookups.set(zone, offsetAt);
  }
  return offsetAt;
}

const offsetLookups = new Map<string, (ms: number) => number>();

function createOffsetLookup(zone: Zone): (ms: number) => number {
  const offsets = new Map<number, number>();
  return (ms) => {
    const hour = Math.floor(ms / HOUR);
    let offset = offsets.get(hour);
    if (offset === undefined) {
      const first = zone.offset(hour * HOUR);
      offset = first === zone.offset(hour * HOUR + HOUR - 1) ? first : NaN;
      if (offsets.size >= MAX_CACHED_HOURS) offsets.clear();
      offsets.set(hour, offset);
    }
    return Number.isNaN(offset) ? zone.offset(ms) : offset;
  };
}

function createFormatter(zone: Zone, offsetAt: (ms: number) => number): ZonedFormatter {
  const strings = new Map<number, string>();
  // Whole minutes near the first one formatted sit in an array: a plan formats ~400,000 times.
  let baseMinute = NaN;
  let byMinute: (string | undefined)[] = [];
  const build = (ms: number): string => {
    const offset = offsetAt(ms);
    const local = new Date(ms + offset * 60_000).toISOString();
    return (ms % 1000 === 0 ? local.slice(0, 19) : local.slice(0, 23)) + offsetSuffix(zone, offset);
  };
  return (ms: number): string => {
    if (Number.isNaN(baseMinute)) {
      baseMinute = Math.floor(ms / 60_000) - MINUTES_AROUND;
      byMinute = new Array<string | undefined>(2 * MINUTES_AROUND).fill(undefined);
    }
    const index = ms / 60_000 - baseMinute;
    if (Number.isInteger(index) && index >= 0 && index < byMinute.length) {
      return (byMinute[index] ??= build(ms));
    }
    let text = strings.get(ms);
    if (text === undefined) {
      text = build(ms);
      if (strings.size >= MAX_CACHED_STRINGS) strings.clear();
      strings.set(ms, text);
    }
    return text;
  };
}

function offsetSuffix(zone: Zone, offset: number): string {
  if (zone.isUniversal && offset === 0) return 'Z';
  const abs = Math.abs(offset);
  const hh = String(Math.floor(abs / 60)).padStart(2, '0');
  const mm = String(abs % 60).padStart(2, '0');
  return `${offset < 0 ? '-' : '+'}${hh}:${mm}`;
}
