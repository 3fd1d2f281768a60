import { DateTime } from 'luxon';

/** A start as the import's `start` cell reads it, and the site day it falls on. */
export type Hl7Start = { ok: true; cell: string; day: string } | { ok: false; message: string };

// HL7 v2.5.1 chapter 2, TS/DTM: YYYY[MM[DD[HH[MM[SS[.S[S[S[S]]]]]]]]][+/-ZZZZ] (from memory).
// A start needs the minute; seconds are dropped, as slots are planned to the minute.
const TS = /^(\d{4})(\d{2})(\d{2})(\d{2})(\d{2})(?:\d{2}(?:\.\d{1,4})?)?([+-]\d{4})?$/;

/**
 * Reads an HL7 time stamp. With an offset it is that instant, on its day in the site's zone;
 * without one it is site time on its own date, which the import's start rules then resolve
 * (a time a spring-forward change skips is refused; a repeated one takes its first occurrence).
 *
 * @example
 * hl7Start('202703140830', 'America/Chicago');      // { ok: true, cell: '2027-03-14T08:30', day: '2027-03-14' }
 * hl7Start('202703140830-0500', 'America/Chicago'); // { ok: true, cell: '2027-03-14T08:30:00-05:00', day: '2027-03-14' }
 */
export function hl7Start(value: string, timezone: string): Hl7Start {
  const m = TS.exec(value.trim());
  if (!m) return { ok: false, message: `"${value}" is not an HL7 date/time to the minute (YYYYMMDDHHMM[SS][+/-ZZZZ]).` };
  const [, y, mo, d, h, mi, offset] = m;
  const local = `${y}-${mo}-${d}T${h}:${mi}`;
  if (!offset) {
    if (!DateTime.fromISO(local, { zone: 'UTC' }).isValid) return { ok: false, message: `"${value}" is not a real date and time.` };
    return { ok: true, cell: local, day: `${y}-${mo}-${d}` };
  }
  const iso = `${local}:00${offset.slice(0, 3)}:${offset.slice(3)}`;
  const at = DateTime.fromISO(iso, { setZone: true });
  if (!at.isValid || Math.abs(at.offset) > 14 * 60) return { ok: false, message: `"${value}" is not a real date and time.` };
  return { ok: true, cell: iso, day: at.setZone(timezone).toISODate()! };
}

/** An HL7 time stamp as an instant (site time when it has no offset), for ordering messages; null when unreadable. */
export function hl7Instant(value: string, timezone: string): string | null {
  const m = /^(\d{4})(\d{2})(\d{2})(\d{2})(\d{2})(\d{2})?(?:\.\d{1,4})?([+-]\d{4})?$/.exec(value.trim());
  if (!m) return null;
  const [, y, mo, d, h, mi, s, offset] = m;
  const local = `${y}-${mo}-${d}T${h}:${mi}:${s ?? '00'}`;
  const at = offset ? DateTime.fromISO(`${local}${offset.slice(0, 3)}:${offset.slice(3)}`, { setZone: true }) : DateTime.fromISO(local, { zone: timezone });
  return at.isValid ? at.toUTC().toISO() : null;
}
