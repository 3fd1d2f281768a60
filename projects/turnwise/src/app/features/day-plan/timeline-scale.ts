import type { DayPlan } from '@shared/api/plan';
import { DateTime } from 'luxon';

/** How much of the day one screen width shows. */
export type Zoom = 'day' | '4h' | '2h' | '1h';

export const ZOOMS: readonly { zoom: Zoom; label: string }[] = [
  { zoom: 'day', label: 'Whole day' },
  { zoom: '4h', label: '4 h' },
  { zoom: '2h', label: '2 h' },
  { zoom: '1h', label: '1 h' },
];

const ZOOM_MINUTES: Readonly<Record<Exclude<Zoom, 'day'>, number>> = { '4h': 240, '2h': 120, '1h': 60 };
const MINUTE = 60_000;
/** Slots move in whole 5-minute steps: what schedulers book in. */
export const SNAP_MINUTES = 5;

/** The drawn stretch of the day and how wide a minute is. Positions are real elapsed time. */
export interface TimelineScale {
  startMs: number;
  endMs: number;
  pxPerMinute: number;
  widthPx: number;
}

export interface AxisTick {
  x: number;
  /** `HH:mm` on hour marks, null on quarter-hour marks. */
  label: string | null;
}

/**
 * The whole hours that hold every room's opening, closing, exam and turnover of the day, so
 * nothing is drawn off the axis (an exam outside opening hours widens the range).
 */
export function dayRange(plan: DayPlan): { startMs: number; endMs: number } {
  let start = Infinity;
  let end = -Infinity;
  const see = (iso: string) => {
    const ms = Date.parse(iso);
    if (!Number.isFinite(ms)) return;
    start = Math.min(start, ms);
    end = Math.max(end, ms);
  };
  for (const room of plan.rooms) {
    see(room.opensAt);
    see(room.closesAt);
    for (const exam of room.exams) (see(exam.start), see(exam.end));
    for (const gap of room.gaps) see(gap.readyAt);
  }
  if (!Number.isFinite(start)) {
    const midnight = DateTime.fromISO(plan.date, { zone: plan.timezone });
    return { startMs: midnight.plus({ hours: 7 }).toMillis(), endMs: midnight.plus({ hours: 19 }).toMillis() };
  }
  const first = DateTime.fromMillis(start, { zone: plan.timezone }).startOf('hour');
  const last = DateTime.fromMillis(end, { zone: plan.timezone });
  const lastHour = last.startOf('hour');
  return { startMs: first.toMillis(), endMs: (lastHour.equals(last) ? lastHour : lastHour.plus({ hours: 1 })).toMillis() };
}

/**
 * Narrowest an exam block is drawn, in pixels: room for its start time ("08:00") and a pointer
 * target well above WCAG 2.2's 24 px (2.5.8). Below it a block shrank to one letter.
 */
export const MIN_SLOT_PX = 48;
/** A day of 5-minute exams would otherwise ask for ~10 px a minute; past this the axis scrolls enough. */
const MAX_MIN_PX_PER_MINUTE = 4;

/**
 * The least px per minute that keeps the day's shortest exam `MIN_SLOT_PX` wide: on a narrow
 * screen (or with the side panel open) the timeline scrolls sideways instead of drawing slots no
 * one can read.
 */
export function readablePxPerMinute(shortestExamMinutes: number | null): number {
  if (!shortestExamMinutes || shortestExamMinutes <= 0) return 0;
  return Math.min(MAX_MIN_PX_PER_MINUTE, MIN_SLOT_PX / shortestExamMinutes);
}

/**
 * A scale for a zoom level, given the width the lanes have on screen (never below 1 px/min at
 * "whole day"), and never below `minPxPerMinute` (see {@link readablePxPerMinute}).
 */
export function scaleFor(range: { startMs: number; endMs: number }, zoom: Zoom, viewportPx: number, minPxPerMinute = 0): TimelineScale {
  const minutes = Math.max(60, (range.endMs - range.startMs) / MINUTE);
  const usable = Math.max(320, viewportPx);
  const fitted = zoom === 'day' ? usable / minutes : usable / ZOOM_MINUTES[zoom];
  const pxPerMinute = Math.max(fitted, minPxPerMinute);
  return { ...range, pxPerMinute, widthPx: Math.ceil(minutes * pxPerMinute) };
}

/** Pixels from the axis start to a time. */
export function xOf(scale: TimelineScale, time: string | number): number {
  const ms = typeof time === 'number' ? time : Date.parse(time);
  return ((ms - scale.startMs) / MINUTE) * scale.pxPerMinute;
}

/** The time at `x` pixels, snapped to whole 5-minute marks of the clock. */
export function timeAt(scale: TimelineScale, x: number): number {
  return snapToMinutes(scale.startMs + (x / scale.pxPerMinute) * MINUTE);
}

/** Rounds an instant to the nearest `step` minutes (the site's 5-minute clock marks). */
export function snapToMinutes(ms: number, step = SNAP_MINUTES): number {
  return Math.round(ms / (step * MINUTE)) * step * MINUTE;
}

/** Hour marks with their site-time label, quarter-hour marks without one (dropped when too dense). */
export function axisTicks(scale: TimelineScale, timezone: string): AxisTick[] {
  const quarter = 15 * scale.pxPerMinute >= 12;
  const stepMinutes = quarter ? 15 : 60;
  const ticks: AxisTick[] = [];
  for (let ms = scale.startMs; ms <= scale.endMs; ms += stepMinutes * MINUTE) {
    const time = DateTime.fromMillis(ms, { zone: timezone });
    ticks.push({ x: xOf(scale, ms), label: time.minute === 0 ? time.toFormat('HH:mm') : null });
  }
  return ticks;
}

/** An instant as the API wants it: ISO 8601 in the site's zone, with its offset. */
export function siteIso(ms: number, timezone: string): string {
  return DateTime.fromMillis(ms, { zone: timezone }).toISO({ suppressMilliseconds: true })!;
}
