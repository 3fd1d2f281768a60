/** What the rule builder edits: the subset of RFC 5545 rules a shift task needs. */
export const BUILDER_FREQS = ['DAILY', 'WEEKLY', 'MONTHLY'] as const;
export type BuilderFreq = (typeof BUILDER_FREQS)[number];
export const RULE_DAYS = ['MO', 'TU', 'WE', 'TH', 'FR', 'SA', 'SU'] as const;
export type RuleDay = (typeof RULE_DAYS)[number];
export const RULE_DAY_NAMES: Record<RuleDay, string> = { MO: 'Monday', TU: 'Tuesday', WE: 'Wednesday', TH: 'Thursday', FR: 'Friday', SA: 'Saturday', SU: 'Sunday' };

export interface RuleFields {
  freq: BuilderFreq;
  /** Every `interval` days, weeks or months. */
  interval: number;
  /** Weekly only; empty: the weekday of `starts`. */
  byDay: RuleDay[];
  /** Local `HH:MM`. */
  time: string;
  /** `YYYY-MM-DD`, the first day it may fall on (DTSTART's date; monthly rules repeat on its day of the month). */
  starts: string;
  /** End after this many times… */
  count: number | null;
  /** …or on this local date (inclusive); never both. */
  until: string | null;
}

const compact = (date: string) => date.replaceAll('-', '');

/**
 * The rule text a builder's fields stand for: a floating DTSTART (the site's wall clock) and an
 * RRULE; an UNTIL is floating too, at the end of its day, as RFC 5545 asks of a rule whose
 * DTSTART is a local time.
 *
 * @example
 * buildRule({ freq: 'WEEKLY', interval: 2, byDay: ['MO', 'FR'], time: '07:00', starts: '2027-01-04', count: null, until: null })
 * // → 'DTSTART:20270104T070000\nRRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR'
 */
export function buildRule(f: RuleFields): string {
  const parts = [`FREQ=${f.freq}`];
  if (f.interval > 1) parts.push(`INTERVAL=${f.interval}`);
  if (f.freq === 'WEEKLY' && f.byDay.length > 0) parts.push(`BYDAY=${RULE_DAYS.filter((d) => f.byDay.includes(d)).join(',')}`);
  if (f.count !== null) parts.push(`COUNT=${f.count}`);
  else if (f.until !== null) parts.push(`UNTIL=${compact(f.until)}T235959`);
  return `DTSTART:${compact(f.starts)}T${f.time.replace(':', '')}00\nRRULE:${parts.join(';')}`;
}

/**
 * The builder's fields for a stored rule, or null when the rule uses more than the builder
 * shows (a zone of its own, BYMONTHDAY, YEARLY, …): such a rule is edited as text.
 */
export function readRule(rule: string): RuleFields | null {
  const m = /^DTSTART:(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})00\r?\nRRULE:(.+)$/.exec(rule.trim());
  if (!m) return null;
  const fields: RuleFields = { freq: 'DAILY', interval: 1, byDay: [], time: `${m[4]}:${m[5]}`, starts: `${m[1]}-${m[2]}-${m[3]}`, count: null, until: null };
  for (const part of m[6]!.split(';')) {
    const [name, value = ''] = part.split('=');
    if (name === 'FREQ' && (BUILDER_FREQS as readonly string[]).includes(value)) fields.freq = value as BuilderFreq;
    else if (name === 'INTERVAL' && /^[1-9]\d*$/.test(value)) fields.interval = Number(value);
    else if (name === 'BYDAY' && value.split(',').every((d) => (RULE_DAYS as readonly string[]).includes(d))) fields.byDay = value.split(',') as RuleDay[];
    else if (name === 'COUNT' && /^[1-9]\d*$/.test(value)) fields.count = Number(value);
    else if (name === 'UNTIL' && /^\d{8}T235959$/.test(value)) fields.until = `${value.slice(0, 4)}-${value.slice(4, 6)}-${value.slice(6, 8)}`;
    else return null;
  }
  if (fields.byDay.length > 0 && fields.freq !== 'WEEKLY') return null;
  return buildRule(fields) === rule.trim().replace(/\r\n/g, '\n') ? fields : null;
}

const UNIT: Record<BuilderFreq, [string, string]> = { DAILY: ['day', 'days'], WEEKLY: ['week', 'weeks'], MONTHLY: ['month', 'months'] };

/**
 * The rule in words, for lists and the builder.
 *
 * @example
 * ruleText({ freq: 'WEEKLY', interval: 2, byDay: ['MO', 'FR'], time: '07:00', starts: '2027-01-04', count: 10, until: null })
 * // → 'Every 2 weeks on Monday and Friday at 07:00, 10 times from 2027-01-04'
 */
export function ruleText(f: RuleFields): string {
  const [one, many] = UNIT[f.freq];
  let text = f.interval > 1 ? `Every ${f.interval} ${many}` : `Every ${one}`;
  if (f.freq === 'WEEKLY' && f.byDay.length > 0) {
    const names = RULE_DAYS.filter((d) => f.byDay.includes(d)).map((d) => RULE_DAY_NAMES[d]);
    text += ` on ${names.length > 1 ? `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}` : names[0]}`;
  }
  if (f.freq === 'MONTHLY') text += ` on day ${Number(f.starts.slice(8))}`;
  text += ` at ${f.time}`;
  if (f.count !== null) text += `, ${f.count} time${f.count === 1 ? '' : 's'} from ${f.starts}`;
  else if (f.until !== null) text += `, from ${f.starts} until ${f.until}`;
  else text += `, from ${f.starts}`;
  return text;
}
