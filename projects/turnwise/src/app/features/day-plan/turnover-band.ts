import type { PlanGap } from '@shared/api/plan';

/** The three parts of a turnover band, each drawn with its own pattern (not colour alone). */
export type BandPart = 'hands-on' | 'wet-dry' | 'air-hold';

export interface BandSegment {
  part: BandPart;
  /** Minutes from the band's start (the leaving exam's end, or the room's opening). */
  offsetMinutes: number;
  minutes: number;
}

/** How people read each part, in the legend and in each segment's label. */
export const BAND_PART_LABELS: Readonly<Record<BandPart, string>> = {
  'hands-on': 'hands-on',
  'wet-dry': 'wet / dry time',
  'air-hold': 'air hold',
};

const MINUTE = 60_000;

/**
 * Splits a gap's turnover into hands-on time (until the last hands-on step ends), wet/dry time
 * (surfaces still wet or drying after that) and air hold (the rest up to ready-at, when the
 * airborne hold outlasts the work). Empty parts are left out. Minutes are real elapsed minutes.
 */
export function turnoverBand(gap: PlanGap, fromIso: string): BandSegment[] {
  const from = Date.parse(fromIso);
  const readyAt = Date.parse(gap.readyAt);
  if (!Number.isFinite(from) || !Number.isFinite(readyAt)) return [];
  let handsOnEnd = from;
  let dryEnd = from;
  for (const step of gap.steps) {
    handsOnEnd = Math.max(handsOnEnd, Date.parse(step.end));
    dryEnd = Math.max(dryEnd, Date.parse(step.dryAt));
  }
  const workEnd = Math.max(handsOnEnd, dryEnd);
  const segments: BandSegment[] = [];
  const add = (part: BandPart, start: number, end: number) => {
    if (end > start) segments.push({ part, offsetMinutes: (start - from) / MINUTE, minutes: (end - start) / MINUTE });
  };
  add('hands-on', from, handsOnEnd);
  add('wet-dry', handsOnEnd, dryEnd);
  if (gap.airHoldMinutes > 0) add('air-hold', workEnd, readyAt);
  return segments;
}
