import type { PlanGap } from '@shared/api/plan';

import { VERDICT_DISPLAY } from '../../shared/ui/verdict-chip';
import { badgeWidth } from './badge-layout';
import { BAND_PART_LABELS, BandPart, turnoverBand } from './turnover-band';
import { TimelineScale, xOf } from './timeline-scale';

/** One part of a turnover band, in pixels from the band's start. */
export interface BandPiece {
  part: BandPart;
  left: number;
  width: number;
  /** "wet / dry time 6 min" */
  title: string;
}

/** One gap marker, its problem badge and its turnover band, worked out once per lane. */
export interface GapView {
  gap: PlanGap;
  toAccession: string;
  /** The room's opening steps before its first exam, not a turnover between two patients. */
  opening: boolean;
  /** An opening that fits: drawn thin and grey, so it does not read as a wide "fits" area. */
  quiet: boolean;
  icon: string;
  marker: { left: number; width: number };
  /** The marker is wider than its gap (or the gap is an overlap): drawn above the exams it overlaps. */
  raised: boolean;
  /** The word in the marker ("short", "opening"), null when the marker is too narrow for it. */
  word: string | null;
  /** "short by 10 min" inside the marker when it is wide enough. */
  shortBy: string | null;
  /** "short by 10 min" ("−10" at the widest zooms) above a short or overlapping gap, readable at any width; null otherwise. */
  badge: string | null;
  /** Where the badge starts, in pixels: centred on the gap until {@link layOutBadges} moves it clear of its neighbours. */
  badgeLeft: number;
  /** Problem gaps just after this one whose badges did not fit beside it: "+N" on this badge. */
  badgeMore: number;
  band: { left: number; width: number; pieces: BandPiece[] };
  /** "Turnover before ACC-123: short by 4 min, needs 24, has 20" */
  label: string;
  dimmed: boolean;
}

/** Room the marker needs for its word, and for "short by N min" after it. */
const WORD_PX = 64;
const SHORT_BY_PX = 150;
/**
 * A gap narrower than this still gets a marker wide enough to see and click: the minimum pointer
 * target of WCAG 2.2 success criterion 2.5.8 (Target Size (Minimum), 24 by 24 CSS pixels).
 */
export const MIN_MARKER_PX = 24;
const MIN_OPENING_PX = 12;
/** A wet/dry or air-hold part narrower than its pattern's repeat would show as a blank: drawn at least this wide. */
export const MIN_WAIT_PIECE_PX = 7;
/** Below this zoom the badges would run into each other: the number alone. */
const BADGE_WORDS_PX_PER_MIN = 2;

/**
 * Places a gap that runs from `fromIso` (the leaving exam's end, or the room's opening) to the
 * exam `toAccession`: its marker over the free time (on an overlap, a small marker where the
 * next exam starts), its band over the computed turnover, and its words.
 */
export function gapView(gap: PlanGap, toAccession: string, fromIso: string, scale: TimelineScale, dimmed = false): GapView {
  const ppm = scale.pxPerMinute;
  const left = xOf(scale, fromIso);
  const opening = gap.fromExamId === null;
  const late = gap.verdict === 'short' || gap.verdict === 'overlap';
  const quiet = opening && !late;
  const freePx = gap.availableMinutes * ppm;
  const width = Math.max(MIN_MARKER_PX, freePx);
  // A marker wider than its gap is centred on it and drawn over the exams' edges (see `raised`),
  // so the whole target takes the pointer and neither exam loses more than a sliver.
  const marker = quiet
    ? { left, width: Math.max(MIN_OPENING_PX, Math.min(freePx, gap.requiredMinutes * ppm)) }
    : { left: freePx < 0 ? left + freePx : left + (freePx - width) / 2, width };
  const badge = late ? badgeText(gap, ppm) : null;
  return {
    gap,
    toAccession,
    opening,
    quiet,
    icon: VERDICT_DISPLAY[gap.verdict].icon,
    marker,
    raised: !quiet && marker.width > freePx,
    word: marker.width >= WORD_PX ? (quiet ? 'opening' : gap.verdict) : null,
    shortBy: late && marker.width >= SHORT_BY_PX ? `short by ${gap.shortByMinutes} min` : null,
    badge,
    badgeLeft: marker.left + marker.width / 2 - (badge ? badgeWidth(badge) / 2 : 0),
    badgeMore: 0,
    band: bandOf(gap, fromIso, left, ppm),
    label: gapLabel(gap, toAccession),
    dimmed,
  };
}

function badgeText(gap: PlanGap, ppm: number): string {
  if (ppm < BADGE_WORDS_PX_PER_MIN) return `−${gap.shortByMinutes}`;
  // The product's own words, as in the panel and the marker's label.
  return verdictWords(gap);
}

/**
 * A gap's verdict in the product's words, with the minutes it is short by when it is late.
 *
 * @example
 * verdictWords({ verdict: 'overlap', shortByMinutes: 18 }); // 'overlap, short by 18 min'
 * verdictWords({ verdict: 'snug', shortByMinutes: 0 }); // 'snug'
 */
export function verdictWords(gap: Pick<PlanGap, 'verdict' | 'shortByMinutes'>): string {
  if (gap.verdict !== 'short' && gap.verdict !== 'overlap') return gap.verdict;
  return `${gap.verdict === 'overlap' ? 'overlap, ' : ''}short by ${gap.shortByMinutes} min`;
}

function bandOf(gap: PlanGap, fromIso: string, left: number, ppm: number): GapView['band'] {
  const pieces = turnoverBand(gap, fromIso).map((segment): BandPiece => {
    const width = segment.minutes * ppm;
    return {
      part: segment.part,
      left: segment.offsetMinutes * ppm,
      width: segment.part === 'hands-on' ? width : Math.max(MIN_WAIT_PIECE_PX, width),
      title: `${BAND_PART_LABELS[segment.part]} ${Math.round(segment.minutes)} min`,
    };
  });
  const end = pieces.reduce((right, piece) => Math.max(right, piece.left + piece.width), 0);
  return { left, width: Math.max(gap.requiredMinutes * ppm, end), pieces };
}

/** "Turnover before ACC-123: short by 4 min, needs 24, has 20" */
export function gapLabel(gap: PlanGap, toAccession: string): string {
  const kind = gap.fromExamId === null ? 'Opening' : 'Turnover';
  const verdict = verdictWords(gap);
  const has = gap.availableMinutes < 0 ? `overlaps by ${-gap.availableMinutes}` : `has ${gap.availableMinutes}`;
  const air = gap.airHoldMinutes > 0 ? `, air hold ${gap.airHoldMinutes} min` : '';
  return `${kind} before ${toAccession}: ${verdict}, needs ${gap.requiredMinutes}, ${has}${air}`;
}
