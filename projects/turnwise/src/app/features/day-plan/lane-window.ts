import { Signal, computed, signal } from '@angular/core';

import type { DayPlan } from '@shared/api/plan';
import { LANE_HEADER_AXIS_PX, LANE_HEIGHT_PX } from './lane-size';

/** What the scroller's `max-height` leaves of the window above the lanes (day-timeline.scss). */
const ABOVE_THE_LANES_PX = 260;

/**
 * Which lanes of a day are drawn in full: those in the scroller's view and half a view around
 * it, and every lane drawn before on that day (kept, so scrolling back costs nothing). The
 * others show only their header, which keeps the tab order: focus reaching one scrolls it into
 * view, and then it is drawn. A day of 40 rooms thus draws its first screen, not 1,200 slots.
 */
export class LaneWindow {
  /** The scroller's height; until measured, what its `max-height` allows in this window. */
  private readonly heightPx = signal(Math.max(LANE_HEIGHT_PX, (globalThis.innerHeight || 800) - ABOVE_THE_LANES_PX));
  /** The lane at the top of the view: changes by whole lanes, so scrolling redraws nothing in between. */
  private readonly topLane = signal(0);
  private everDrawn = { date: '', ids: new Set<number>() };

  constructor(private readonly plan: Signal<DayPlan>) {}

  readonly drawn = computed(() => {
    const plan = this.plan();
    if (this.everDrawn.date !== plan.date) this.everDrawn = { date: plan.date, ids: new Set() };
    const inView = Math.ceil(this.heightPx() / LANE_HEIGHT_PX);
    const margin = Math.ceil(inView / 2);
    const first = Math.max(0, this.topLane() - margin);
    for (const room of plan.rooms.slice(first, this.topLane() + inView + margin + 1)) this.everDrawn.ids.add(room.id);
    return new Set(this.everDrawn.ids);
  });

  /** Follows the scroller: its scroll position and, when known, its height. */
  seen(scroller: HTMLElement, heightPx = scroller.clientHeight): void {
    if (heightPx > 0) this.heightPx.set(heightPx);
    this.topLane.set(Math.floor(scroller.scrollTop / LANE_HEIGHT_PX));
  }

  /** Scrolls a lane into view (a keyboard move to a room far down), so it is drawn and its block can take focus. */
  reveal(scroller: HTMLElement, roomId: number): void {
    const index = this.plan().rooms.findIndex((room) => room.id === roomId);
    if (index < 0 || scroller.clientHeight === 0) return;
    const top = index * LANE_HEIGHT_PX;
    // The time axis stays stuck over the top of the scroller.
    const visible = scroller.clientHeight - LANE_HEADER_AXIS_PX;
    if (top < scroller.scrollTop) scroller.scrollTop = top;
    else if (top + LANE_HEIGHT_PX > scroller.scrollTop + visible) scroller.scrollTop = top + LANE_HEIGHT_PX - visible;
    this.seen(scroller);
  }
}
