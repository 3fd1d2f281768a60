import { utcUntil } from './feeds';

describe('utcUntil', () => {
  it('writes a local UNTIL in UTC, as RFC 5545 §3.3.10 wants with a TZID on DTSTART', () => {
    // 2027-04-01 07:00 in Chicago is CDT (-05:00): 12:00 UTC
    expect(utcUntil('FREQ=DAILY;UNTIL=20270401T070000', 'America/Chicago')).toBe('FREQ=DAILY;UNTIL=20270401T120000Z');
  });

  it('takes a date-only UNTIL as that day’s last second', () => {
    expect(utcUntil('FREQ=WEEKLY;BYDAY=SA;UNTIL=20270102', 'America/Chicago')).toBe('FREQ=WEEKLY;BYDAY=SA;UNTIL=20270103T055959Z');
  });

  it('leaves a UTC UNTIL and a rule without one as they are', () => {
    expect(utcUntil('FREQ=DAILY;UNTIL=20270401T120000Z', 'America/Chicago')).toBe('FREQ=DAILY;UNTIL=20270401T120000Z');
    expect(utcUntil('FREQ=DAILY', 'America/Chicago')).toBe('FREQ=DAILY');
  });
});
