import type { GapView } from './gap-view';

/**
 * Badge widths, estimated from the badge's bold 11 px figures (measuring the DOM per frame would
 * cost more than the drag budget allows); slightly generous so an estimate never under-reads.
 */
const CHAR_PX = 7;
const PAD_PX = 12;
/** Clear space between two badges, so they read as two. */
const SPACE_PX = 4;
/** How far a badge may be pushed right of its gap's centre and still read as that gap's. */
const MAX_SHIFT_PX = 40;

export function badgeWidth(text: string): number {
  return text.length * CHAR_PX + PAD_PX;
}

/**
 * Lays a lane's problem badges out in its one badge row without collisions: each is centred over
 * its gap with its words; when that would touch the badge before, it is abbreviated to the missing
 * minutes ("−10") and nudged right; when even that would leave its gap behind, it is not drawn and
 * the badge before counts it ("−10 +1"). Every gap keeps its marker, whose name and tooltip say
 * it all, so nothing is lost to the keyboard, the pointer or a screen reader.
 */
export function layOutBadges(gaps: GapView[]): GapView[] {
  const order = gaps.map((gap, index) => ({ gap, index })).filter(({ gap }) => gap.badge !== null);
  order.sort((a, b) => centre(a.gap) - centre(b.gap));
  const out = [...gaps];
  let previous: { index: number; left: number; more: number; text: string } | null = null;
  let right = -Infinity;
  for (const { gap, index } of order) {
    const full = gap.badge!;
    const middle = centre(gap);
    let text = full;
    let left = middle - badgeWidth(text) / 2;
    if (left < right + SPACE_PX) {
      text = `−${gap.gap.shortByMinutes}`;
      left = Math.max(middle - badgeWidth(text) / 2, right + SPACE_PX);
    }
    if (previous && left > middle + MAX_SHIFT_PX) {
      previous.more += 1;
      out[index] = { ...gap, badge: null, badgeMore: 0 };
      const kept = out[previous.index]!;
      out[previous.index] = { ...kept, badgeMore: previous.more };
      right = previous.left + badgeWidth(`${previous.text} +${previous.more}`);
      continue;
    }
    out[index] = { ...gap, badge: text, badgeLeft: left, badgeMore: 0 };
    previous = { index, left, more: 0, text };
    right = left + badgeWidth(text);
  }
  return out;
}

function centre(gap: GapView): number {
  return gap.marker.left + gap.marker.width / 2;
}
