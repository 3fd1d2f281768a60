import { badgeWidth, layOutBadges } from './badge-layout';
import { gapView } from './gap-view';
import { exampleGap } from './testing/example-plan';
import { MIN_SLOT_PX, readablePxPerMinute, scaleFor } from './timeline-scale';
import type { TimelineScale } from './timeline-scale';

// Invented lane on 2027-03-15 (-05:00): the axis starts at 07:00 site time.
const scale: TimelineScale = { startMs: Date.parse('2027-03-15T07:00:00-05:00'), endMs: Date.parse('2027-03-15T19:00:00-05:00'), pxPerMinute: 2, widthPx: 1440 };
const at = (hhmm: string) => `2027-03-15T${hhmm}:00-05:00`;
/** A short gap of 10 available minutes starting at `hhmm`. */
const short = (id: number, hhmm: string, shortBy: number) =>
  gapView(exampleGap(id - 1, id, 'short', { availableMinutes: 10, requiredMinutes: 10 + shortBy, shortByMinutes: shortBy }), `ACC-${id}`, at(hhmm), scale);

const extents = (gaps: ReturnType<typeof layOutBadges>) =>
  gaps.filter((g) => g.badge !== null).map((g) => ({ left: g.badgeLeft, right: g.badgeLeft + badgeWidth(g.badgeMore ? `${g.badge} +${g.badgeMore}` : g.badge!) }));

describe('layOutBadges', () => {
  it('returns badges centred over their gaps, in words, when they are far apart', () => {
    const [a, b] = layOutBadges([short(2, '08:00', 10), short(3, '11:00', 5)]);
    expect([a!.badge, b!.badge]).toEqual(['short by 10 min', 'short by 5 min']);
    expect(a!.badgeLeft + badgeWidth(a!.badge!) / 2).toBeCloseTo(a!.marker.left + a!.marker.width / 2);
  });

  it('abbreviates a badge that would touch the one before, and nudges it clear', () => {
    const [a, b] = layOutBadges([short(2, '08:00', 10), short(3, '08:40', 5)]); // centres 80 px apart
    expect([a!.badge, b!.badge]).toEqual(['short by 10 min', '−5']);
    const [ea, eb] = extents([a!, b!]);
    expect(eb!.left).toBeGreaterThanOrEqual(ea!.right);
  });

  it('counts badges that cannot be drawn near their gap on the badge before ("+N"), never overlapping', () => {
    const gaps = ['08:00', '08:10', '08:20', '08:30', '08:40'].map((hhmm, i) => short(i + 2, hhmm, 10 + i));
    const laid = layOutBadges(gaps);
    const boxes = extents(laid);
    for (let i = 1; i < boxes.length; i++) expect(boxes[i]!.left).toBeGreaterThanOrEqual(boxes[i - 1]!.right);
    const shown = laid.filter((g) => g.badge !== null).length;
    expect(shown + laid.reduce((n, g) => n + g.badgeMore, 0)).toBe(5); // every problem gap is shown or counted
    expect(shown).toBeLessThan(5);
  });

  it('leaves gaps without a badge (fits, snug) as they are', () => {
    const fits = gapView(exampleGap(1, 2, 'fits'), 'ACC-2', at('08:00'), scale);
    expect(layOutBadges([fits])[0]).toEqual(fits);
  });
});

describe('readablePxPerMinute and scaleFor', () => {
  const range = { startMs: scale.startMs, endMs: scale.endMs };

  it('keeps the shortest exam at least MIN_SLOT_PX wide on a narrow screen (the timeline scrolls instead)', () => {
    // 768 px tablet with the side panel open leaves ~250 px for 12 hours: 0.35 px a minute, a 30-min slot 10 px.
    const fitted = scaleFor(range, 'day', 250);
    expect(30 * fitted.pxPerMinute).toBeLessThan(MIN_SLOT_PX);
    const readable = scaleFor(range, 'day', 250, readablePxPerMinute(30));
    expect(30 * readable.pxPerMinute).toBeGreaterThanOrEqual(MIN_SLOT_PX);
    expect(readable.widthPx).toBeGreaterThan(250);
  });

  it('changes nothing when the zoom already draws slots wide enough', () => {
    expect(scaleFor(range, '1h', 600, readablePxPerMinute(30))).toEqual(scaleFor(range, '1h', 600));
  });

  it('returns no minimum for a day without exams, and a bounded one for very short exams', () => {
    expect(readablePxPerMinute(null)).toBe(0);
    expect(readablePxPerMinute(5)).toBeLessThanOrEqual(4);
  });
});
