import { longDay, shiftDay, shortDay, siteClock, SiteTime } from './site-time';

describe('siteClock', () => {
  it('returns the wall-clock time at the offset written in the ISO time, not the browser zone', () => {
    expect(siteClock('2027-03-15T07:05:00-05:00')).toBe('07:05');
    expect(siteClock('2027-03-15T23:59:00+09:00')).toBe('23:59');
  });

  it('returns an empty string for a value that is not a time', () => {
    expect(siteClock('not a time')).toBe('');
    expect(new SiteTime().transform(null)).toBe('');
  });
});

describe('shiftDay', () => {
  it('moves by calendar days across month ends and a daylight-saving change', () => {
    expect(shiftDay('2027-03-01', -1)).toBe('2027-02-28');
    // 14 March 2027 is the US spring-forward day (second Sunday of March; from memory).
    expect(shiftDay('2027-03-14', 1)).toBe('2027-03-15');
  });
});

describe('longDay', () => {
  it('names the weekday and month', () => {
    expect(longDay('2027-03-15')).toBe('Monday 15 March 2027');
  });
});

describe('shortDay', () => {
  it('writes the day with its month as a word, so no one reads 3 Dec as 12 March', () => {
    expect(shortDay('2026-12-03')).toBe('3 Dec 2026');
    expect(shortDay('not a day')).toBe('not a day');
  });
});
