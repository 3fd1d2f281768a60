import { readyCountdown } from './ready-countdown';

const at = (hms: string) => Date.parse(`2027-03-15T${hms}-05:00`);
const READY = '2027-03-15T18:16:00-05:00';

describe('readyCountdown', () => {
  it('says minutes left, rounded up, not a clock-like m:ss', () => {
    expect(readyCountdown(READY, at('17:59:01'))).toEqual({ text: 'in 17 min', overdue: false });
    expect(readyCountdown(READY, at('18:15:59'))).toEqual({ text: 'in 1 min', overdue: false });
  });

  it('is due at ready-at itself', () => {
    expect(readyCountdown(READY, at('18:16:00'))).toEqual({ text: 'due now', overdue: false });
  });

  it('counts how far past ready-at, instead of stalling', () => {
    expect(readyCountdown(READY, at('18:16:01'))).toEqual({ text: 'overdue by 1 min', overdue: true });
    expect(readyCountdown(READY, at('18:19:30'))).toEqual({ text: 'overdue by 4 min', overdue: true });
  });
});
