import { DateTime } from 'luxon';
import { RRule, type Options } from 'rrule';

/*
 * rrule computes in UTC and knows nothing of daylight saving. We treat every rule's DTSTART as
 * a floating wall-clock time: generate occurrences as if the zone were UTC, then read each
 * one's fields as a local time in the site's zone with luxon. A daily 07:00 task therefore
 * stays at 07:00 local on both sides of a clock change. A TZID on DTSTART names the zone to
 * use instead of the site's; an UNTIL in UTC is compared as a wall-clock time (at most the
 * zone's offset off, which only matters for an UNTIL within hours of an occurrence).
 */

const TZID = /DTSTART;TZID=([^:;\s]+)/;

const DAY_MS = 86_400_000;

/**
 * rrule walks from DTSTART to the window, which costs tens of milliseconds a call for a daily
 * task started a year ago. A daily or weekly rule without COUNT repeats every INTERVAL days
 * (weeks), so DTSTART moves forward by whole periods to just before the window: same
 * occurrences, a few steps each. COUNT (and monthly or yearly rules) keep their DTSTART.
 */
function rebased(options: Partial<Options>, windowStart: Date): Partial<Options> {
  const { dtstart, freq, count } = options;
  if (!dtstart || count != null || (freq !== RRule.DAILY && freq !== RRule.WEEKLY)) return options;
  const periodMs = (options.interval ?? 1) * (freq === RRule.WEEKLY ? 7 : 1) * DAY_MS;
  const periods = Math.floor((windowStart.getTime() - dtstart.getTime()) / periodMs) - 2;
  return periods > 0 ? { ...options, dtstart: new Date(dtstart.getTime() + periods * periodMs) } : options;
}

/** A recurrence rule ready to expand, with the zone its wall-clock times belong to. */
function compile(rule: string, siteZone: string, windowStart: Date): { rrule: RRule; zone: string } {
  const zone = TZID.exec(rule)?.[1] ?? siteZone;
  let options;
  try {
    options = RRule.parseString(rule.replace(/;TZID=[^:;\s]+/g, ''));
  } catch {
    throw new RangeError(`not an RFC 5545 recurrence rule: "${rule}"`);
  }
  if (!options.dtstart || options.freq === undefined) throw new RangeError(`a recurrence rule needs DTSTART and FREQ: "${rule}"`);
  if (!DateTime.local().setZone(zone).isValid) throw new RangeError(`not an IANA time zone: "${zone}"`);
  return { rrule: new RRule(rebased(options, windowStart)), zone };
}

const floating = (date: string) => new Date(`${date}T00:00:00Z`);

/**
 * Occurrences of a rule whose local date is in [from, to) (`YYYY-MM-DD`), as luxon times in
 * the rule's zone. A wall time skipped by a spring-forward change moves forward (luxon's rule).
 *
 * @throws RangeError on a rule without DTSTART or FREQ, or an unknown zone
 */
export function ruleOccurrences(rule: string, window: { zone: string; from: string; to: string }): DateTime[] {
  const start = floating(window.from);
  const end = floating(window.to);
  const { rrule, zone } = compile(rule, window.zone, start);
  return rrule
    .between(start, end, true)
    .filter((d) => d < end)
    .map((d) =>
      DateTime.fromObject(
        { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate(), hour: d.getUTCHours(), minute: d.getUTCMinutes(), second: d.getUTCSeconds() },
        { zone },
      ),
    );
}

/** Occurrences on one local date. */
export function occurrencesOn(rule: string, date: string, zone: string): DateTime[] {
  const next = DateTime.fromISO(date, { zone: 'UTC' }).plus({ days: 1 }).toISODate()!;
  return ruleOccurrences(rule, { zone, from: date, to: next });
}

/**
 * The next `n` occurrences at or after `from` (an instant), looking ahead at most `days` days:
 * what the rule builder previews while an admin edits a rule.
 *
 * @example
 * nextOccurrences('DTSTART:20270104T070000\nRRULE:FREQ=WEEKLY;BYDAY=MO,FR', { zone: 'America/Chicago', from: new Date('2027-03-10T12:00:00Z'), n: 2 })
 * // → [Fri 12 March 07:00, Mon 15 March 07:00] (Chicago)
 * @throws RangeError as {@link ruleOccurrences}
 */
export function nextOccurrences(rule: string, options: { zone: string; from: Date; n: number; days?: number }): DateTime[] {
  const fromDay = DateTime.fromJSDate(options.from, { zone: options.zone }).toISODate()!;
  const out: DateTime[] = [];
  const span = 62;
  for (let offset = 0; offset < (options.days ?? 3660) && out.length < options.n; offset += span) {
    const from = DateTime.fromISO(fromDay, { zone: 'UTC' }).plus({ days: offset }).toISODate()!;
    const to = DateTime.fromISO(fromDay, { zone: 'UTC' }).plus({ days: offset + span }).toISODate()!;
    for (const t of ruleOccurrences(rule, { zone: options.zone, from, to })) {
      if (t.toMillis() >= options.from.getTime() && out.length < options.n) out.push(t);
    }
  }
  return out;
}

