import { DestroyRef, Signal, afterNextRender, effect, inject, signal, untracked } from '@angular/core';

import type { DayPlan } from '@shared/api/plan';

import { LANE_HEADER_PX } from './lane-size';
import { TimelineScale, xOf } from './timeline-scale';

/** Scrolls a timeline sideways so `element` sits in the middle of the time axis, clear of the sticky lane headers. */
export function centreAlongAxis(scroller: HTMLElement, element: HTMLElement): void {
  const box = element.getBoundingClientRect();
  const view = scroller.getBoundingClientRect();
  scroller.scrollLeft += box.left + box.width / 2 - (view.left + LANE_HEADER_PX + (view.width - LANE_HEADER_PX) / 2);
}

/**
 * Scrolls a day's timeline to where its work is: now on today (`nowX`), else its first exam, with
 * an hour mark's room before it. The lanes may not have their new width yet (the first measure of
 * the viewport): then once more on the next frame.
 */
export function scrollToDayStart(scroller: HTMLElement, plan: DayPlan, scale: TimelineScale, nowX: number | null, again = true): void {
  const exams = plan.rooms.flatMap((room) => room.exams.map((exam) => Date.parse(exam.start)));
  const target = Math.max(0, (nowX ?? (exams.length ? xOf(scale, Math.min(...exams)) : 0)) - 60);
  scroller.scrollLeft = target;
  if (again && Math.abs(scroller.scrollLeft - target) > 1) requestAnimationFrame(() => scrollToDayStart(scroller, plan, scale, nowX, false));
}

/**
 * Whether the now line is clear of the sticky lane headers. Scrolled past it, the line would be
 * drawn across the room names: each lane paints in its own layer (`content-visibility`), so its
 * header cannot cover a line drawn over all lanes. Follows the scroll, set only when it changes
 * (a scroll redraws nothing else), and the line's place (the minute, a zoom). Call in a
 * component's constructor.
 */
export function nowLineClear(scroller: () => HTMLElement, nowX: Signal<number | null>): Signal<boolean> {
  const clear = signal(true);
  let element: HTMLElement | null = null;
  const check = () => {
    const x = untracked(nowX);
    if (element) clear.set(x === null || x >= element.scrollLeft);
  };
  const destroyRef = inject(DestroyRef);
  afterNextRender(() => {
    element = scroller();
    element.addEventListener('scroll', check, { passive: true });
    destroyRef.onDestroy(() => element?.removeEventListener('scroll', check));
    check();
  });
  effect(() => {
    nowX();
    check();
  });
  return clear;
}
