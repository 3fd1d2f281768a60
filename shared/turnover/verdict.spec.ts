import { DateTime } from 'luxon';
import { availableMinutesBetween, gapVerdict, parseInstant } from './verdict';

const CHICAGO = 'America/Chicago';
const chicago = (iso: string) => DateTime.fromISO(iso, { zone: CHICAGO });

describe('gapVerdict', () => {
  it('returns fits when the gap has the margin to spare', () => {
    expect(gapVerdict({ availableMinutes: 23, requiredMinutes: 20 })).toEqual({ verdict: 'fits', shortByMinutes: 0 });
  });

  it('returns snug when the gap is enough but within the margin', () => {
    expect(gapVerdict({ availableMinutes: 20, requiredMinutes: 20 })).toEqual({ verdict: 'snug', shortByMinutes: 0 });
    expect(gapVerdict({ availableMinutes: 22, requiredMinutes: 20 })).toEqual({ verdict: 'snug', shortByMinutes: 0 });
  });

  it('returns short, with the minutes missing, when the gap is too small', () => {
    expect(gapVerdict({ availableMinutes: 15, requiredMinutes: 20 })).toEqual({ verdict: 'short', shortByMinutes: 5 });
  });

  it('returns overlap when B starts before A ends, short by the whole turnover plus the overlap', () => {
    expect(gapVerdict({ availableMinutes: -5, requiredMinutes: 20 })).toEqual({ verdict: 'overlap', shortByMinutes: 25 });
  });

  it("returns verdicts by the site's own snug margin", () => {
    expect(gapVerdict({ availableMinutes: 24, requiredMinutes: 20, snugMarginMinutes: 5 }).verdict).toBe('snug');
    expect(gapVerdict({ availableMinutes: 25, requiredMinutes: 20, snugMarginMinutes: 5 }).verdict).toBe('fits');
  });

  describe('edge cases', () => {
    it('returns short (not overlap) for back-to-back slots, and fits for a zero-minute turnover', () => {
      expect(gapVerdict({ availableMinutes: 0, requiredMinutes: 20 }).verdict).toBe('short');
      expect(gapVerdict({ availableMinutes: 0, requiredMinutes: 0, snugMarginMinutes: 0 }).verdict).toBe('fits');
    });

    it('returns snug at exactly required + margin − 1 and fits at required + margin', () => {
      expect(gapVerdict({ availableMinutes: 22, requiredMinutes: 20, snugMarginMinutes: 3 }).verdict).toBe('snug');
      expect(gapVerdict({ availableMinutes: 23, requiredMinutes: 20, snugMarginMinutes: 3 }).verdict).toBe('fits');
    });

    it('returns fits with no snug band when the margin is 0', () => {
      expect(gapVerdict({ availableMinutes: 20, requiredMinutes: 20, snugMarginMinutes: 0 }).verdict).toBe('fits');
    });
  });

  describe('invalid input', () => {
    it.each([
      { availableMinutes: NaN, requiredMinutes: 20 },
      { availableMinutes: 10, requiredMinutes: -1 },
      { availableMinutes: 10, requiredMinutes: Infinity },
      { availableMinutes: 10, requiredMinutes: 5, snugMarginMinutes: -1 },
    ])('throws a RangeError for %p', (options) => {
      expect(() => gapVerdict(options)).toThrow(RangeError);
    });
  });
});

describe('availableMinutesBetween', () => {
  it('returns the minutes between two instants', () => {
    expect(availableMinutesBetween('2027-05-03T09:40:00-05:00', '2027-05-03T10:00:00-05:00')).toBe(20);
  });

  it('returns negative minutes when B starts before A ends', () => {
    expect(availableMinutesBetween('2027-05-03T10:00:00-05:00', '2027-05-03T09:55:00-05:00')).toBe(-5);
  });

  it('returns whole minutes rounded down (a gap is never reported longer than it is)', () => {
    expect(availableMinutesBetween('2027-05-03T09:40:30-05:00', '2027-05-03T10:00:00-05:00')).toBe(19);
  });

  describe('daylight-saving days (America/Chicago, luxon)', () => {
    it('returns real minutes across spring-forward, 14 March 2027 02:00→03:00: wall clock 80, real 20', () => {
      const aEnd = chicago('2027-03-14T01:50');
      const bStart = chicago('2027-03-14T03:10');
      expect(aEnd.offset).toBe(-360);
      expect(bStart.offset).toBe(-300);
      expect(availableMinutesBetween(aEnd.toISO()!, bStart.toISO()!)).toBe(20);
    });

    it('returns real minutes across fall-back, 7 November 2027 (01:00–02:00 twice): wall clock 30, real 90', () => {
      const aEnd = chicago('2027-11-07T00:50');
      const bStart = aEnd.plus({ minutes: 90 });
      expect(bStart.toFormat('HH:mm')).toBe('01:20');
      expect(bStart.offset).toBe(-360);
      expect(availableMinutesBetween(aEnd.toISO()!, bStart.toISO()!)).toBe(90);
    });

    it('returns a short verdict the wall clock would have hidden on spring-forward day', () => {
      const available = availableMinutesBetween(chicago('2027-03-14T01:50').toISO()!, chicago('2027-03-14T03:10').toISO()!);
      expect(gapVerdict({ availableMinutes: available, requiredMinutes: 22 })).toEqual({ verdict: 'short', shortByMinutes: 2 });
    });
  });

  describe('invalid input', () => {
    it('throws a RangeError for a time without offset (its instant depends on an unnamed zone)', () => {
      expect(() => availableMinutesBetween('2027-05-03T09:40:00', '2027-05-03T10:00:00-05:00')).toThrow(RangeError);
    });

    it('throws a RangeError for text that is not a date-time', () => {
      expect(() => parseInstant('half past nine')).toThrow(RangeError);
    });
  });
});

describe('parseInstant', () => {
  it('returns epoch milliseconds for ISO 8601 with offset or Z', () => {
    expect(parseInstant('2027-03-14T03:10:00-05:00')).toBe(Date.UTC(2027, 2, 14, 8, 10));
    expect(parseInstant('2027-03-14T08:10:00Z')).toBe(Date.UTC(2027, 2, 14, 8, 10));
  });
});
