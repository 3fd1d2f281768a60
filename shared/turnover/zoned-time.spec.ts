import { DateTime } from 'luxon';
import { instantOf, wallTimeToMillis, zonedFormatter } from './zoned-time';

const luxonIso = (ms: number, zone: string) => DateTime.fromMillis(ms, { zone }).toISO({ suppressMilliseconds: true });

describe('zonedFormatter', () => {
  it("returns exactly luxon's ISO text, every 10 minutes across both America/Chicago DST days of 2027", () => {
    const format = zonedFormatter('America/Chicago');
    for (const day of [Date.UTC(2027, 2, 14, 0), Date.UTC(2027, 10, 7, 0)]) {
      for (let ms = day; ms < day + 36 * 3_600_000; ms += 600_000) expect(format(ms)).toBe(luxonIso(ms, 'America/Chicago'));
    }
  });

  it('returns "Z" for UTC, "+00:00" for a zone that is only at offset 0, and half-hour offsets', () => {
    const ms = Date.UTC(2027, 0, 15, 12, 0);
    for (const zone of ['UTC', 'Europe/London', 'Asia/Kolkata', 'Australia/Lord_Howe']) {
      expect(zonedFormatter(zone)(ms)).toBe(luxonIso(ms, zone));
    }
    expect(zonedFormatter('UTC')(ms)).toBe('2027-01-15T12:00:00Z');
  });

  it('returns milliseconds only when there are some, as luxon does', () => {
    const ms = Date.UTC(2027, 0, 15, 12, 0, 5, 250);
    expect(zonedFormatter('America/Chicago')(ms)).toBe(luxonIso(ms, 'America/Chicago'));
  });

  it('returns the same text far from the first instant formatted (outside its fast window)', () => {
    const format = zonedFormatter('Europe/Berlin');
    format(Date.UTC(2027, 0, 1));
    const later = Date.UTC(2027, 6, 1, 10, 30);
    expect(format(later)).toBe('2027-07-01T12:30:00+02:00');
  });

  it('throws a RangeError for an unknown zone', () => {
    expect(() => zonedFormatter('Nowhere/Special')).toThrow(RangeError);
  });
});

describe('wallTimeToMillis', () => {
  it('returns the instant of a local time, on both sides of a DST change', () => {
    expect(wallTimeToMillis('2027-03-14', '01:30', 'America/Chicago')).toBe(Date.UTC(2027, 2, 14, 7, 30));
    expect(wallTimeToMillis('2027-03-14', '03:30', 'America/Chicago')).toBe(Date.UTC(2027, 2, 14, 8, 30));
  });

  it('returns a skipped local time moved forward (02:30 does not exist on 14 March 2027 in Chicago)', () => {
    expect(wallTimeToMillis('2027-03-14', '02:30', 'America/Chicago')).toBe(Date.UTC(2027, 2, 14, 8, 30));
  });

  it('throws a RangeError for a malformed time or date', () => {
    expect(() => wallTimeToMillis('2027-03-14', '7:00', 'UTC')).toThrow(RangeError);
    expect(() => wallTimeToMillis('2027-13-01', '07:00', 'UTC')).toThrow(RangeError);
  });
});

describe('instantOf', () => {
  it('returns the instant of a string with offset, ignoring the zone', () => {
    expect(instantOf('2027-03-14T03:10:00-05:00', 'Asia/Tokyo')).toBe(Date.UTC(2027, 2, 14, 8, 10));
  });

  it('returns a string without offset read in the zone', () => {
    expect(instantOf('2027-03-14T03:10', 'America/Chicago')).toBe(Date.UTC(2027, 2, 14, 8, 10));
  });

  it('throws a RangeError for text that is not a date-time', () => {
    expect(() => instantOf('tomorrow', 'UTC')).toThrow(RangeError);
  });
});
