import { IANAZone } from 'luxon';

/**
 * A strict reading of a shift task's rule before it is stored: rrule's parser passes unknown
 * values through (FREQ=FOO, BYDAY=XX, INTERVAL=0), so each part is checked against RFC 5545
 * §3.3.10 (RECUR) here, and every problem is named.
 */

const FREQS = ['DAILY', 'WEEKLY', 'MONTHLY', 'YEARLY'];
const DAYS = ['MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'];
const DATE_TIME = /^(\d{4})(\d{2})(\d{2})(T(\d{2})(\d{2})(\d{2})(Z?))?$/;

function validDateTime(text: string): boolean {
  const m = DATE_TIME.exec(text);
  if (!m) return false;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(Date.UTC(y, mo - 1, d));
  if (date.getUTCMonth() !== mo - 1 || date.getUTCDate() !== d) return false;
  return !m[4] || (Number(m[5]) < 24 && Number(m[6]) < 60 && Number(m[7]) < 61);
}

const upTo = (max: number) => (v: string) => /^[1-9]\d*$/.test(v) && Number(v) <= max;
const list = (v: string, ok: (item: string) => boolean) => v.split(',').every(ok);

/**
 * The parts a shift task may use. Narrower than RFC 5545 on purpose: every occurrence list is
 * computed by walking the rule, and a rule that can never match (FREQ=DAILY;BYMONTH=2;BYMONTHDAY=31,
 * or BYDAY=53MO in a month) makes that walk run for seconds on every board request. So BYMONTH,
 * BYMONTHDAY and BYSETPOS are not offered, a weekday's ordinal fits its period, and INTERVAL and
 * DTSTART are bounded.
 */
const PARTS: Record<string, (value: string, freq: string | undefined) => string | null> = {
  FREQ: (v) => (FREQS.includes(v) ? null : `FREQ=${v}: a shift task repeats DAILY, WEEKLY, MONTHLY or YEARLY`),
  INTERVAL: (v) => (upTo(99)(v) ? null : `INTERVAL=${v}: a whole number from 1 to 99`),
  COUNT: (v) => (upTo(9999)(v) ? null : `COUNT=${v}: a whole number from 1 to 9999`),
  UNTIL: (v) => (validDateTime(v) ? null : `UNTIL=${v}: a date (YYYYMMDD) or date-time (YYYYMMDDTHHMMSS)`),
  BYDAY: (v, freq) => {
    const most = freq === 'MONTHLY' ? 5 : freq === 'YEARLY' ? 53 : 0;
    const ok = list(v, (d) => {
      const m = /^([+-]?)(\d{1,2})?(MO|TU|WE|TH|FR|SA|SU)$/.exec(d);
      return !!m && (m[2] === undefined ? m[1] === '' : Number(m[2]) >= 1 && Number(m[2]) <= most);
    });
    if (ok) return null;
    const ordinal = most > 0 ? ` (a ${freq} rule may number them, 1 to ${most} or −1 to −${most}, e.g. 1FR)` : '';
    return `BYDAY=${v}: weekdays as ${DAYS.join(', ')}${ordinal}`;
  },
  WKST: (v) => (DAYS.includes(v) ? null : `WKST=${v}: a weekday as ${DAYS.join(', ')}`),
};

/**
 * Every problem with a rule (`DTSTART[;TZID=zone]:YYYYMMDDTHHMMSS` and `RRULE:…` on their own
 * lines); an empty list for a rule a shift task may use.
 *
 * @example
 * ruleProblems('DTSTART:20270104T070000\nRRULE:FREQ=WEEKLY;INTERVAL=0') // → ['INTERVAL=0: a whole number from 1 to 99']
 */
export function ruleProblems(rule: string): string[] {
  const problems: string[] = [];
  const lines = rule.split(/\r?\n/).map((l) => l.trim()).filter(Boolean);
  const start = lines.filter((l) => l.startsWith('DTSTART'));
  const recur = lines.filter((l) => l.startsWith('RRULE:'));
  const other = lines.filter((l) => !l.startsWith('DTSTART') && !l.startsWith('RRULE:'));
  if (start.length !== 1) problems.push('give one DTSTART line: the first occurrence, e.g. DTSTART:20270104T070000');
  else {
    const m = /^DTSTART(;TZID=[A-Za-z_+\-/0-9]+)?:(.*)$/.exec(start[0]!);
    if (!m || !/T/.test(m[2]!) || !validDateTime(m[2]!)) problems.push(`${start[0]}: DTSTART is a local date-time, YYYYMMDDTHHMMSS`);
    else if (Number(m[2]!.slice(0, 4)) < 1970 || Number(m[2]!.slice(0, 4)) > 2100) problems.push(`${start[0]}: DTSTART is a date from 1970 to 2100`);
    else if (m[2]!.endsWith('Z')) problems.push('DTSTART is a local wall-clock time (no Z): a task stays at its hour across daylight-saving changes');
    const zone = m?.[1]?.slice(';TZID='.length);
    if (zone && !IANAZone.isValidZone(zone)) problems.push(`TZID=${zone}: not an IANA time zone (leave it out for the site's zone)`);
  }
  if (recur.length !== 1) problems.push('give one RRULE line, e.g. RRULE:FREQ=DAILY');
  for (const line of other) problems.push(`"${line}": only DTSTART and RRULE lines are read`);
  if (recur.length === 1) {
    const seen = new Set<string>();
    const freq = /(?:^|;)FREQ=([A-Z]+)/i.exec(recur[0]!.slice('RRULE:'.length))?.[1]?.toUpperCase();
    for (const part of recur[0]!.slice('RRULE:'.length).split(';')) {
      const [name, value, extra] = part.split('=');
      const check = name ? PARTS[name.toUpperCase()] : undefined;
      if (!check || value === undefined || value === '' || extra !== undefined) {
        problems.push(`"${part}": not a rule part a shift task may use (${Object.keys(PARTS).join(', ')})`);
        continue;
      }
      if (seen.has(name!.toUpperCase())) problems.push(`${name} is given twice`);
      seen.add(name!.toUpperCase());
      const problem = check(value.toUpperCase(), freq);
      if (problem) problems.push(problem);
    }
    // RFC 5545 §3.3.10: FREQ is required; UNTIL and COUNT MUST NOT occur in the same rule
    if (!seen.has('FREQ')) problems.push('FREQ is required (RFC 5545 §3.3.10)');
    if (seen.has('COUNT') && seen.has('UNTIL')) problems.push('COUNT and UNTIL may not both be given (RFC 5545 §3.3.10): end after a number of times or on a date');
  }
  return problems;
}
