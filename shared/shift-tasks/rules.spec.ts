import { nextOccurrences } from './recurrence';
import { buildRule, readRule, ruleText, type RuleFields } from './rule-builder';
import { ruleProblems } from './rule-check';

const iso = (times: { toISO: (o: { suppressMilliseconds: boolean }) => string | null }[]) => times.map((t) => t.toISO({ suppressMilliseconds: true }));

describe('nextOccurrences', () => {
  it('returns RFC 5545 §3.8.5.3 "every other week on Tuesday and Thursday, for 8 occurrences" (from memory)', () => {
    // RFC 5545 §3.8.5.3 — expected dates from memory: (1997 9:00 AM EDT) September 2,4,16,18,30; October 2,14,16
    const rule = 'DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;COUNT=8;WKST=SU;BYDAY=TU,TH';
    const got = nextOccurrences(rule, { zone: 'UTC', from: new Date('1997-09-01T00:00:00Z'), n: 10 });
    expect(iso(got)).toEqual(['09-02', '09-04', '09-16', '09-18', '09-30', '10-02', '10-14', '10-16'].map((d) => `1997-${d}T09:00:00-04:00`));
  });

  it('returns the next n at or after an instant, in the site’s zone across a clock change (America/Chicago, 14 March 2027)', () => {
    // every other week on Monday and Friday from Monday 1 March 2027 at 07:30 (derived by hand)
    const rule = 'DTSTART:20270301T073000\nRRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR';
    const got = nextOccurrences(rule, { zone: 'America/Chicago', from: new Date('2027-03-05T13:30:00Z'), n: 5 });
    expect(iso(got)).toEqual([
      '2027-03-05T07:30:00-06:00',
      '2027-03-15T07:30:00-05:00',
      '2027-03-19T07:30:00-05:00',
      '2027-03-29T07:30:00-05:00',
      '2027-04-02T07:30:00-05:00',
    ]);
  });

  it('returns fewer when the rule ends (COUNT) and none for an ended rule', () => {
    const rule = 'DTSTART:20270301T073000\nRRULE:FREQ=DAILY;COUNT=3';
    expect(nextOccurrences(rule, { zone: 'UTC', from: new Date('2027-03-02T00:00:00Z'), n: 5 })).toHaveLength(2);
    expect(nextOccurrences(rule, { zone: 'UTC', from: new Date('2028-01-01T00:00:00Z'), n: 5, days: 400 })).toEqual([]);
  });
});

describe('buildRule / readRule', () => {
  const weekly: RuleFields = { freq: 'WEEKLY', interval: 2, byDay: ['FR', 'MO'], time: '07:30', starts: '2027-03-01', count: null, until: null };

  it('writes a floating DTSTART and an RRULE, weekdays in week order', () => {
    expect(buildRule(weekly)).toBe('DTSTART:20270301T073000\nRRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR');
    // a floating DTSTART takes a floating UNTIL (RFC 5545 §3.3.10, from memory): the end of its day
    expect(buildRule({ ...weekly, until: '2027-06-30' })).toBe('DTSTART:20270301T073000\nRRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR;UNTIL=20270630T235959');
    expect(buildRule({ ...weekly, freq: 'MONTHLY', interval: 1, count: 6 })).toBe('DTSTART:20270301T073000\nRRULE:FREQ=MONTHLY;COUNT=6');
  });

  it('reads back what it writes, and refuses what it cannot show (edited as text instead)', () => {
    expect(readRule(buildRule(weekly))).toEqual({ ...weekly, byDay: ['MO', 'FR'] });
    expect(readRule('DTSTART:20260101T070000\nRRULE:FREQ=DAILY')).toMatchObject({ freq: 'DAILY', time: '07:00', starts: '2026-01-01' });
    expect(readRule('DTSTART;TZID=America/New_York:19970902T090000\nRRULE:FREQ=DAILY')).toBeNull();
    expect(readRule('DTSTART:20270301T073000\nRRULE:FREQ=MONTHLY;BYDAY=1FR')).toBeNull();
  });

  it('says the rule in words', () => {
    expect(ruleText(weekly)).toBe('Every 2 weeks on Monday and Friday at 07:30, from 2027-03-01');
    expect(ruleText({ ...weekly, freq: 'DAILY', interval: 1, count: 1 })).toBe('Every day at 07:30, 1 time from 2027-03-01');
    expect(ruleText({ ...weekly, freq: 'MONTHLY', interval: 1, until: '2027-12-31' })).toBe('Every month on day 1 at 07:30, from 2027-03-01 until 2027-12-31');
  });
});

describe('ruleProblems', () => {
  it('accepts the rules a shift task uses, RFC 5545 §3.8.5.3 examples among them', () => {
    expect(ruleProblems('DTSTART:20260101T070000\nRRULE:FREQ=DAILY')).toEqual([]);
    expect(ruleProblems('DTSTART;TZID=America/New_York:19970901T090000\nRRULE:FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR')).toEqual([]);
    expect(ruleProblems('DTSTART:19970905T090000\nRRULE:FREQ=MONTHLY;COUNT=10;BYDAY=1FR')).toEqual([]);
  });

  it('names every problem', () => {
    expect(ruleProblems('DTSTART:20270231T250000\nRRULE:INTERVAL=200;FOO=1;BYDAY=MO,XX')).toEqual([
      'DTSTART:20270231T250000: DTSTART is a local date-time, YYYYMMDDTHHMMSS',
      'INTERVAL=200: a whole number from 1 to 99',
      '"FOO=1": not a rule part a shift task may use (FREQ, INTERVAL, COUNT, UNTIL, BYDAY, WKST)',
      'BYDAY=MO,XX: weekdays as MO, TU, WE, TH, FR, SA, SU',
      'FREQ is required (RFC 5545 §3.3.10)',
    ]);
    expect(ruleProblems('DTSTART:20270301T070000Z\nRRULE:FREQ=DAILY;FREQ=DAILY\nEXDATE:20270302T070000')).toEqual([
      'DTSTART is a local wall-clock time (no Z): a task stays at its hour across daylight-saving changes',
      '"EXDATE:20270302T070000": only DTSTART and RRULE lines are read',
      'FREQ is given twice',
    ]);
    expect(ruleProblems('DTSTART;TZID=Mars/Olympus:20270301T070000\nRRULE:FREQ=DAILY')).toEqual([
      "TZID=Mars/Olympus: not an IANA time zone (leave it out for the site's zone)",
    ]);
  });

  it('refuses what could never occur or would walk for long (the rule is expanded on every board request)', () => {
    // RFC 5545 allows these; a shift task does not
    expect(ruleProblems('DTSTART:20270301T070000\nRRULE:FREQ=DAILY;BYMONTH=2;BYMONTHDAY=31')).toEqual([
      '"BYMONTH=2": not a rule part a shift task may use (FREQ, INTERVAL, COUNT, UNTIL, BYDAY, WKST)',
      '"BYMONTHDAY=31": not a rule part a shift task may use (FREQ, INTERVAL, COUNT, UNTIL, BYDAY, WKST)',
    ]);
    expect(ruleProblems('DTSTART:20270301T070000\nRRULE:FREQ=MONTHLY;BYDAY=6MO')).toEqual([
      'BYDAY=6MO: weekdays as MO, TU, WE, TH, FR, SA, SU (a MONTHLY rule may number them, 1 to 5 or −1 to −5, e.g. 1FR)',
    ]);
    expect(ruleProblems('DTSTART:20270301T070000\nRRULE:FREQ=WEEKLY;BYDAY=1MO')[0]).toMatch(/^BYDAY=1MO: weekdays as/);
    expect(ruleProblems('DTSTART:00010101T000000\nRRULE:FREQ=DAILY;COUNT=9999')).toEqual(['DTSTART:00010101T000000: DTSTART is a date from 1970 to 2100']);
  });
});
