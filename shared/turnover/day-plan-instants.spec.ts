import { DateTime, IANAZone } from 'luxon';
import { canonicalInstant, instantOf, zonedOffset } from './zoned-time';

// The instants the day plan reads (stored starts) and the offsets it writes them out with.
// DST dates: brief check-values.md, "Daylight saving" (America/Chicago, 2027).

describe('canonicalInstant', () => {
  it('returns the instant of the stored form with an offset or Z', () => {
    expect(canonicalInstant('2027-03-14T03:10:00-05:00')).toBe(Date.UTC(2027, 2, 14, 8, 10));
    expect(canonicalInstant('2027-03-14T01:50:00-06:00')).toBe(Date.UTC(2027, 2, 14, 7, 50));
    expect(canonicalInstant('2027-03-14T08:10:00Z')).toBe(Date.UTC(2027, 2, 14, 8, 10));
    expect(canonicalInstant('2027-10-03T02:00:00+10:30')).toBe(Date.UTC(2027, 9, 2, 15, 30));
  });

  it('returns NaN for every other form, left to Date.parse or luxon', () => {
    for (const text of ['2027-03-14T03:10', '2027-03-14T03:10:00', '2027-03-14T03:10:00.500Z', '2027-03-14T03:10:00+0500',
      '2027-03-14T03:10:00z', '2027-03-31T08:00:00Z', '0099-03-14T03:10:00Z', '2027-13-14T03:10:00Z', '2027-03-14T24:00:00Z',
      '2027-03-14T03:10:00+24:00', '2027-03-14 03:10:00Z', 'soon']) {
      expect(canonicalInstant(text)).toBeNaN();
    }
  });

  it('agrees with Date.parse on ~1,700 instants across a year in the stored form (so instantOf is unchanged)', () => {
    let checked = 0;
    for (let ms = Date.UTC(2027, 0, 1); ms < Date.UTC(2028, 0, 1); ms += 5 * 3_600_000 + 61_000) {
      const text = new Date(ms).toISOString().slice(0, 19) + ['Z', '-05:00', '+05:45'][checked++ % 3];
      const parsed = canonicalInstant(text);
      if (!Number.isNaN(parsed)) expect(parsed).toBe(Date.parse(text));
      expect(instantOf(text, 'UTC')).toBe(Date.parse(text));
    }
    expect(checked).toBeGreaterThan(1000);
  });
});

describe('zonedOffset', () => {
  it("returns luxon's offset every 10 minutes across both America/Chicago DST days of 2027", () => {
    const offsetAt = zonedOffset('America/Chicago');
    const zone = IANAZone.create('America/Chicago');
    for (const day of [Date.UTC(2027, 2, 14, 0), Date.UTC(2027, 10, 7, 0)]) {
      for (let ms = day; ms < day + 36 * 3_600_000; ms += 600_000) expect(offsetAt(ms)).toBe(zone.offset(ms));
    }
    expect(offsetAt(Date.UTC(2027, 2, 14, 7, 59))).toBe(-360);
    expect(offsetAt(Date.UTC(2027, 2, 14, 8, 0))).toBe(-300);
  });

  // From memory: Lord Howe Island moves from UTC+10:30 to +11:00 on the first Sunday of October.
  it('returns a half-hour change exactly (Australia/Lord_Howe, 3 October 2027, 02:00 → 02:30)', () => {
    const offsetAt = zonedOffset('Australia/Lord_Howe');
    const change = DateTime.fromISO('2027-10-03T02:30', { zone: 'Australia/Lord_Howe' }).toMillis();
    expect(offsetAt(change - 60_000)).toBe(630);
    expect(offsetAt(change)).toBe(660);
  });

  it('throws a RangeError for an unknown zone', () => {
    expect(() => zonedOffset('Nowhere/Special')).toThrow(RangeError);
  });
});
