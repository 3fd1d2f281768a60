import { blockAccession, blockTime, clockOf, laneView } from './lane-view';
import { MIN_MARKER_PX, MIN_WAIT_PIECE_PX, gapView } from './gap-view';
import { exampleExam, exampleGap, exampleRoom, exampleStep } from './testing/example-plan';
import type { TimelineScale } from './timeline-scale';

// Invented lane on 2027-03-15 (-05:00): the axis starts at 07:00 site time.
const scaleAt = (pxPerMinute: number): TimelineScale => ({ startMs: Date.parse('2027-03-15T07:00:00-05:00'), endMs: Date.parse('2027-03-15T19:00:00-05:00'), pxPerMinute, widthPx: 720 * pxPerMinute });
const FROM = '2027-03-15T08:30:00-05:00';

describe('clockOf', () => {
  it('returns the site wall clock written in an API time', () => {
    expect(clockOf('2027-03-15T07:05:00-05:00')).toBe('07:05');
  });

  it('returns nothing for text that is not an API time', () => {
    expect(clockOf('soon')).toBe('');
  });
});

describe('blockTime', () => {
  const [start, end] = ['2027-03-15T08:00:00-05:00', '2027-03-15T08:30:00-05:00'];

  it('returns start and end when both fit', () => {
    expect(blockTime(start, end, 120)).toBe('08:00–08:30');
  });

  it('drops the end, never cutting a time, when only the start fits', () => {
    expect(blockTime(start, end, 60)).toBe('08:00');
  });

  it('returns nothing for a sliver of a block', () => {
    expect(blockTime(start, end, 20)).toBe('');
  });
});

describe('blockAccession', () => {
  it('returns the whole accession when it fits', () => {
    expect(blockAccession('ACC-2', 60)).toBe('ACC-2');
  });

  it('keeps the end of a long accession, the part that tells slots apart', () => {
    const shown = blockAccession('TWD-20261201-026', 70);
    expect(shown.startsWith('…')).toBe(true);
    expect('TWD-20261201-026'.endsWith(shown.slice(1))).toBe(true);
    expect(shown.length).toBeLessThan('TWD-20261201-026'.length);
  });

  it('cuts where a part of the accession begins, never inside one', () => {
    // 70 px fits 6 characters: "…1-026" would show a stray piece of the date.
    expect(blockAccession('TWD-20261201-026', 70)).toBe('…026');
    // 120 px fits 13: "…0261201-026" would cut the date.
    expect(blockAccession('TWD-20261201-026', 120)).toBe('…026');
    expect(blockAccession('TWD-20261201-026', 130)).toBe('…20261201-026');
  });

  it('cuts inside a part only when no whole part fits', () => {
    expect(blockAccession('ACCESSION123456', 70)).toBe('…23456');
  });
});

describe('laneView', () => {
  const room = exampleRoom(
    [exampleExam(1, '08:00', '08:30'), exampleExam(2, '08:40', '09:10'), exampleExam(3, '10:00', '10:30')],
    [exampleGap(null, 1, 'fits', { availableMinutes: 60, requiredMinutes: 7 }), exampleGap(1, 2, 'short', { availableMinutes: 10, shortByMinutes: 10 }), exampleGap(2, 3, 'fits', { availableMinutes: 50 })],
  );

  it('returns each exam with the gap before it, placed on the scale', () => {
    const slots = laneView(room, scaleAt(4), false);
    expect(slots.map((slot) => [slot.block.exam.id, slot.block.left, slot.block.width, slot.gap?.gap.toExamId])).toEqual([
      [1, 240, 120, 1],
      [2, 400, 120, 2],
      [3, 720, 120, 3],
    ]);
    expect(slots[1].block.label).toBe('MR 1, ACC-2, MR knee without contrast, 08:40–09:10, knee coil');
  });

  it('dims, with only problem gaps asked for, the fitting gaps and the exams touching no problem', () => {
    const slots = laneView(room, scaleAt(4), true);
    expect(slots.map((slot) => slot.block.dimmed)).toEqual([false, false, true]);
    expect(slots.map((slot) => slot.gap?.dimmed)).toEqual([true, false, true]);
  });
});

describe('gapView', () => {
  it('badges a short gap with its missing minutes, in words down to 2 px a minute and as a number below', () => {
    const gap = exampleGap(1, 2, 'short', { availableMinutes: 5, shortByMinutes: 15 });
    expect(gapView(gap, 'ACC-2', FROM, scaleAt(4)).badge).toBe('short by 15 min');
    expect(gapView(gap, 'ACC-2', FROM, scaleAt(1)).badge).toBe('−15');
    expect(gapView(exampleGap(1, 2, 'overlap', { availableMinutes: -5, shortByMinutes: 25 }), 'ACC-2', FROM, scaleAt(4)).badge).toBe('overlap, short by 25 min');
    expect(gapView(exampleGap(1, 2, 'snug'), 'ACC-2', FROM, scaleAt(4)).badge).toBeNull();
  });

  it('gives a gap narrower than a pointer target a marker of the minimum target size, centred over it and raised above the exams', () => {
    // 5 min at 2 px a minute is 10 px of free time: the marker spills 7 px over each exam.
    const narrow = gapView(exampleGap(1, 2, 'snug', { availableMinutes: 5 }), 'ACC-2', FROM, scaleAt(2));
    const gapStart = narrow.band.left;
    expect(narrow.marker).toEqual({ left: gapStart - 7, width: MIN_MARKER_PX });
    expect(narrow.raised).toBe(true);
    const wide = gapView(exampleGap(1, 2, 'fits', { availableMinutes: 30 }), 'ACC-2', FROM, scaleAt(2));
    expect([wide.marker.left, wide.marker.width, wide.raised]).toEqual([gapStart, 60, false]);
  });

  it('draws a fitting opening thin and grey over its steps only, not over the whole free time', () => {
    const view = gapView(exampleGap(null, 1, 'fits', { availableMinutes: 60, requiredMinutes: 7 }), 'ACC-1', '2027-03-15T07:00:00-05:00', scaleAt(4));
    expect([view.opening, view.quiet, view.marker.width]).toEqual([true, true, 28]);
    expect(view.label).toBe('Opening before ACC-1: fits, needs 7, has 60');
  });

  it('keeps a short opening as loud as any short gap', () => {
    const view = gapView(exampleGap(null, 1, 'short', { availableMinutes: 2, requiredMinutes: 7, shortByMinutes: 5 }), 'ACC-1', '2027-03-15T07:00:00-05:00', scaleAt(4));
    expect([view.opening, view.quiet, view.badge]).toEqual([true, false, 'short by 5 min']);
  });

  it('draws a wet/dry part at least wide enough for its hatching, and the band wide enough to hold it', () => {
    const gap = exampleGap(1, 2, 'fits', {
      requiredMinutes: 11,
      readyAt: '2027-03-15T08:41:00-05:00',
      steps: [exampleStep('clear', 'Patient out', '08:30', '08:40', '08:41')],
    });
    const band = gapView(gap, 'ACC-2', FROM, scaleAt(1)).band;
    expect(band.pieces.map((piece) => [piece.part, piece.left, piece.width])).toEqual([
      ['hands-on', 0, 10],
      ['wet-dry', 10, MIN_WAIT_PIECE_PX],
    ]);
    expect(band.width).toBe(10 + MIN_WAIT_PIECE_PX);
    expect(band.pieces[1].title).toBe('wet / dry time 1 min');
  });
});
