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

const positive = (v: string) => /^[1-9]\d{0,3}$/.test(v);
const list = (v: string, ok: (item: string) => boolean) => v.split(',').every(ok);

const PARTS: Record<string, (value: string) => string | null> = {
  FREQ: (v) => (FREQS.includes(v) ? null : `FREQ=${v}: a shift task repeats DAILY, WEEKLY, MONTHLY or YEARLY`),
  INTERVAL: (v) => (positive(v) ? null : `INTERVAL=${v}: a positive whole number`),
  COUNT: (v) => (positive(v) ? null : `COUNT=${v}: a positive whole number`),
  UNTIL: (v) => (validDateTime(v) ? null : `UNTIL=${v}: a date (YYYYMMDD) or date-time (YYYYMMDDTHHMMSS)`),
  BYDAY: (v) => (list(v, (d) => /^([+-]?([1-9]|[1-4]\d|5[0-3]))?(MO|TU|WE|TH|FR|SA|SU)$/.test(d)) ? null : `BYDAY=${v}: weekdays as ${DAYS.join(', ')}`),
  BYMONTHDAY: (v) => (list(v, (d) => /^[+-]?([1-9]|[12]\d|3[01])$/.test(d)) ? null : `BYMONTHDAY=${v}: days 1 to 31 (or −1 to −31)`),
  BYMONTH: (v) => (list(v, (d) => /^([1-9]|1[0-2])$/.test(d)) ? null : `BYMONTH=${v}: months 1 to 12`),
  BYSETPOS: (v) => (list(v, (d) => /^[+-]?([1-9]\d{0,2})$/.test(d) && Math.abs(Number(d)) <= 366) ? null : `BYSETPOS=${v}: positions 1 to 366 (or −1 to −366)`),
  WKST: (v) => (DAYS.includes(v) ? null : `WKST=${v}: a weekday as ${DAYS.join(', ')}`),
};

/**
 * Every problem with a rule (`DTSTART[;TZID=zone]:YYYYMMDDTHHMMSS` and `RRULE:…` on their own
 * lines); an empty list for a rule a shift task may use.
 *
 * @example
 * ruleProblems('DTSTART:20270104T070000\nRRULE:FREQ=WEEKLY;INTERVAL=0') // → ['INTERVAL=0: a positive whole number']
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
    else if (m[2]!.endsWith('Z')) problems.push('DTSTART is a local wall-clock time (no Z): a task stays at its hour across daylight-saving changes');
  }
  if (recur.length !== 1) problems.push('give one RRULE line, e.g. RRULE:FREQ=DAILY');
  for (const line of other) problems.push(`"${line}": only DTSTART and RRULE lines are read`);
  if (recur.length === 1) {
    const seen = new Set<string>();
    for (const part of recur[0]!.slice('RRULE:'.length).split(';')) {
      const [name, value, extra] = part.split('=');
      const check = name ? PARTS[name.toUpperCase()] : undefined;
      if (!check || value === undefined || value === '' || extra !== undefined) {
        problems.push(`"${part}": not a rule part a shift task may use (${Object.keys(PARTS).join(', ')})`);
        continue;
      }
      if (seen.has(name!.toUpperCase())) problems.push(`${name} is given twice`);
      seen.add(name!.toUpperCase());
      const problem = check(value.toUpperCase());
      if (problem) problems.push(problem);
    }
    // RFC 5545 §3.3.10: FREQ is required; UNTIL and COUNT MUST NOT occur in the same rule
    if (!seen.has('FREQ')) problems.push('FREQ is required (RFC 5545 §3.3.10)');
    if (seen.has('COUNT') && seen.has('UNTIL')) problems.push('COUNT and UNTIL may not both be given (RFC 5545 §3.3.10): end after a number of times or on a date');
  }
  return problems;
}
