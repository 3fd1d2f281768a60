import { turnoverBand } from './turnover-band';
import { exampleGap, exampleStep } from './testing/example-plan';

// Invented gaps on 2027-03-15 (-05:00); the leaving exam ends at 08:30.
const FROM = '2027-03-15T08:30:00-05:00';

describe('turnoverBand', () => {
  it('returns hands-on up to the last hands-on end, then wet/dry up to the latest dry-at', () => {
    const gap = exampleGap(1, 2, 'fits', {
      readyAt: '2027-03-15T08:48:00-05:00',
      steps: [
        exampleStep('clear', 'Patient out', '08:30', '08:33'),
        exampleStep('bore', 'Bore', '08:33', '08:37', '08:48'),
        exampleStep('touch', 'Counters', '08:37', '08:40', '08:42'),
      ],
    });
    expect(turnoverBand(gap, FROM)).toEqual([
      { part: 'hands-on', offsetMinutes: 0, minutes: 10 },
      { part: 'wet-dry', offsetMinutes: 10, minutes: 8 },
    ]);
  });

  it('leaves out wet/dry time when every surface is dry by the last hands-on end', () => {
    const gap = exampleGap(1, 2, 'fits', {
      readyAt: '2027-03-15T08:50:00-05:00',
      steps: [exampleStep('bore', 'Bore', '08:30', '08:34', '08:40'), exampleStep('linen', 'Linen', '08:40', '08:50')],
    });
    expect(turnoverBand(gap, FROM).map((s) => s.part)).toEqual(['hands-on']);
  });

  it('adds the air hold from the end of the work up to ready-at when the hold is longer', () => {
    // 6 air changes per hour → 70 min hold (product brief, ceil(60 × ln 1000 / 6)).
    const gap = exampleGap(1, 2, 'short', {
      airHoldMinutes: 70,
      readyAt: '2027-03-15T09:40:00-05:00',
      steps: [exampleStep('clear', 'Patient out', '08:30', '08:45', '08:52')],
    });
    expect(turnoverBand(gap, FROM)).toEqual([
      { part: 'hands-on', offsetMinutes: 0, minutes: 15 },
      { part: 'wet-dry', offsetMinutes: 15, minutes: 7 },
      { part: 'air-hold', offsetMinutes: 22, minutes: 48 },
    ]);
  });

  it('shows no air hold for a gap without one even if ready-at is later than the work', () => {
    const gap = exampleGap(1, 2, 'fits', { readyAt: '2027-03-15T09:00:00-05:00', steps: [exampleStep('clear', 'x', '08:30', '08:40')] });
    expect(turnoverBand(gap, FROM).map((s) => s.part)).toEqual(['hands-on']);
  });

  it('returns nothing for an unreadable start rather than drawing a bogus band', () => {
    expect(turnoverBand(exampleGap(1, 2, 'fits'), 'not a time')).toEqual([]);
  });
});
