import { axisTicks, dayRange, scaleFor, siteIso, snapToMinutes, timeAt, xOf } from './timeline-scale';
import { exampleExam, exampleGap, examplePlan, exampleRoom } from './testing/example-plan';

// Invented day: MR 1 open 07:00–19:00 (-05:00, America/Chicago on 2027-03-15, after the DST change).
const plan = examplePlan([exampleRoom([exampleExam(1, '08:00', '08:30')], [exampleGap(null, 1, 'fits')])]);

describe('dayRange', () => {
  it('returns the whole hours from the earliest opening to the latest closing', () => {
    const range = dayRange(plan);
    expect(new Date(range.startMs).toISOString()).toBe('2027-03-15T12:00:00.000Z');
    expect(new Date(range.endMs).toISOString()).toBe('2027-03-16T00:00:00.000Z');
  });

  it('widens to an exam that ends after closing, up to the next whole hour', () => {
    const late = examplePlan([exampleRoom([exampleExam(1, '19:10', '19:40')], [])]);
    expect(new Date(dayRange(late).endMs).toISOString()).toBe('2027-03-16T01:00:00.000Z');
  });

  it('falls back to 07:00–19:00 site time for a day without rooms', () => {
    const range = dayRange(examplePlan([]));
    expect(siteIso(range.startMs, 'America/Chicago')).toBe('2027-03-15T07:00:00-05:00');
    expect(siteIso(range.endMs, 'America/Chicago')).toBe('2027-03-15T19:00:00-05:00');
  });
});

describe('scaleFor and xOf', () => {
  const range = dayRange(plan);

  it('fits the whole day into the viewport at "day" zoom', () => {
    const scale = scaleFor(range, 'day', 1440);
    expect(scale.pxPerMinute).toBe(2);
    expect(scale.widthPx).toBe(1440);
    expect(xOf(scale, '2027-03-15T08:00:00-05:00')).toBe(120);
  });

  it('shows one hour per viewport at "1h" zoom', () => {
    const scale = scaleFor(range, '1h', 600);
    expect(scale.pxPerMinute).toBe(10);
    expect(scale.widthPx).toBe(7200);
  });
});

describe('timeAt and snapToMinutes', () => {
  const scale = scaleFor(dayRange(plan), '1h', 600);

  it('returns the time under a pixel, snapped to the nearest 5 minutes', () => {
    expect(siteIso(timeAt(scale, 10 * 62), 'America/Chicago')).toBe('2027-03-15T08:00:00-05:00');
    expect(siteIso(timeAt(scale, 10 * 63), 'America/Chicago')).toBe('2027-03-15T08:05:00-05:00');
  });

  it('snaps to other steps when asked', () => {
    expect(snapToMinutes(Date.parse('2027-03-15T08:07:00Z'), 15)).toBe(Date.parse('2027-03-15T08:00:00Z'));
  });
});

describe('axisTicks', () => {
  it('labels hours in site time and leaves quarter hours unlabelled', () => {
    const ticks = axisTicks(scaleFor(dayRange(plan), '2h', 1200), 'America/Chicago');
    expect(ticks.slice(0, 5).map((t) => t.label)).toEqual(['07:00', null, null, null, '08:00']);
    expect(ticks[4].x).toBe(600);
  });

  it('drops quarter marks when they would sit closer than 12 px', () => {
    const ticks = axisTicks(scaleFor(dayRange(plan), 'day', 480), 'America/Chicago');
    expect(ticks.every((t) => t.label !== null)).toBe(true);
    expect(ticks).toHaveLength(13);
  });

  it('counts real hours on the day clocks go forward (23 hours, one label skipped)', () => {
    // America/Chicago springs forward at 02:00 on 2027-03-14 (US rule: second Sunday of March; from memory).
    const scale = { startMs: Date.parse('2027-03-14T00:00:00-06:00'), endMs: Date.parse('2027-03-14T04:00:00-05:00'), pxPerMinute: 0.2, widthPx: 0 };
    expect(axisTicks(scale, 'America/Chicago').map((t) => t.label)).toEqual(['00:00', '01:00', '03:00', '04:00']);
  });
});
