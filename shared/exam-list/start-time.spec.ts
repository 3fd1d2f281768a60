import { resolveStart } from './start-time';

// DST facts, America/Chicago (check-values.md, "Daylight saving"; IANA tz database rules for
// the US since 2007, from memory): clocks skip 02:00→03:00 on 14 March 2027 and repeat
// 01:00–02:00 on 7 November 2027.
const CHICAGO = 'America/Chicago';
const SPRING_FORWARD = { date: '2027-03-14', timezone: CHICAGO };
const FALL_BACK = { date: '2027-11-07', timezone: CHICAGO };
const ORDINARY = { date: '2027-03-15', timezone: CHICAGO };

describe('resolveStart', () => {
  it('returns HH:MM as the site time on the day, with the site offset', () => {
    expect(resolveStart('08:30', ORDINARY)).toEqual({ ok: true, start: '2027-03-15T08:30:00-05:00' });
  });

  it('accepts H:MM with a one-digit hour', () => {
    expect(resolveStart('7:05', ORDINARY)).toEqual({ ok: true, start: '2027-03-15T07:05:00-05:00' });
  });

  it('uses standard time before the spring change and daylight time after it', () => {
    expect(resolveStart('01:59', SPRING_FORWARD)).toEqual({ ok: true, start: '2027-03-14T01:59:00-06:00' });
    expect(resolveStart('03:00', SPRING_FORWARD)).toEqual({ ok: true, start: '2027-03-14T03:00:00-05:00' });
  });

  it('accepts ISO 8601 with an offset on the day, rewritten with the site offset', () => {
    expect(resolveStart('2027-03-15T13:30:00Z', ORDINARY)).toEqual({ ok: true, start: '2027-03-15T08:30:00-05:00' });
    expect(resolveStart('2027-03-15T08:30-05:00', ORDINARY)).toEqual({ ok: true, start: '2027-03-15T08:30:00-05:00' });
  });

  it('accepts a date and time without offset (an Excel date-time cell) on the day', () => {
    expect(resolveStart('2027-03-15T09:00', ORDINARY)).toEqual({ ok: true, start: '2027-03-15T09:00:00-05:00' });
  });

  describe('daylight-saving days', () => {
    it('refuses a time the spring-forward change skips, naming the jump', () => {
      expect(resolveStart('02:30', SPRING_FORWARD)).toEqual({
        ok: false,
        message: '02:30 does not exist on 2027-03-14 in America/Chicago: clocks skip from 02:00 to 03:00',
      });
      expect(resolveStart('2:00', SPRING_FORWARD).ok).toBe(false);
    });

    it('takes the first occurrence of a repeated fall-back time (daylight time) and warns', () => {
      const result = resolveStart('01:30', FALL_BACK);
      expect(result).toMatchObject({ ok: true, start: '2027-11-07T01:30:00-05:00' });
      expect(result.ok && result.warning).toBe(
        '01:30 happens twice on 2027-11-07 in America/Chicago (clocks go back from 02:00 to 01:00); ' +
          'the first one was taken (UTC-05:00). For the second, write 2027-11-07T01:30-06:00.',
      );
    });

    it('reaches the second occurrence through an explicit offset, without a warning', () => {
      expect(resolveStart('2027-11-07T01:30-06:00', FALL_BACK)).toEqual({ ok: true, start: '2027-11-07T01:30:00-06:00' });
    });

    it('does not warn just outside the repeated hour', () => {
      expect(resolveStart('00:59', FALL_BACK)).toEqual({ ok: true, start: '2027-11-07T00:59:00-05:00' });
      expect(resolveStart('02:00', FALL_BACK)).toEqual({ ok: true, start: '2027-11-07T02:00:00-06:00' });
    });

    it('handles a zone that shifts by 30 minutes (Australia/Lord_Howe, from memory: 02:00→02:30 on 2027-10-03)', () => {
      expect(resolveStart('02:15', { date: '2027-10-03', timezone: 'Australia/Lord_Howe' })).toEqual({
        ok: false,
        message: '02:15 does not exist on 2027-10-03 in Australia/Lord_Howe: clocks skip from 02:00 to 02:30',
      });
    });
  });

  describe('invalid input', () => {
    it.each(['25:00', '24:00', '12:60'])('refuses %s as not a time of day', (value) => {
      expect(resolveStart(value, ORDINARY)).toMatchObject({ ok: false, message: expect.stringContaining('not a time of day') });
    });

    it.each(['noon', '8.30', '0830', '=NOW()', '8:3', '2027-03-15X08:30'])('refuses "%s" with the accepted forms', (value) => {
      expect(resolveStart(value, ORDINARY)).toMatchObject({
        ok: false,
        message: expect.stringContaining('write HH:MM (24-hour, site time) or ISO 8601 with an offset, e.g. 08:30 or 2027-03-15T08:30:00-05:00'),
      });
    });

    it('refuses an ISO time that falls on another day in the site zone', () => {
      // 03:00Z on the 15th is still the evening of the 14th in Chicago.
      expect(resolveStart('2027-03-15T03:00:00Z', ORDINARY)).toEqual({
        ok: false,
        message: '2027-03-15T03:00:00Z is 2027-03-14 22:00 in America/Chicago, not on 2027-03-15, the day being imported.',
      });
    });

    it('refuses a date-time without offset on another day', () => {
      expect(resolveStart('2027-03-16T09:00', ORDINARY)).toMatchObject({ ok: false, message: expect.stringContaining('not on 2027-03-15') });
    });

    it('refuses an impossible ISO date', () => {
      expect(resolveStart('2027-02-30T08:00:00Z', ORDINARY)).toMatchObject({ ok: false, message: expect.stringContaining('not a valid date and time') });
    });
  });
});
