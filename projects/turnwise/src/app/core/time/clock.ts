import { Injectable, Signal, computed, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { interval, map } from 'rxjs';

import { serverSkew } from '../../shared/ui/countdown';

/**
 * The app's one "now": the browser's time, ticking once a second, for countdowns; `minute` for
 * views that move by the minute (the timeline's now line, which day is today), so they are not
 * recomputed every second. One timer for the whole app; tests provide `fakeClock` instead.
 */
@Injectable({ providedIn: 'root' })
export class Clock {
  /** Milliseconds since the epoch. */
  readonly now: Signal<number> = toSignal(interval(1000).pipe(map(() => Date.now())), { initialValue: Date.now() });
  /** The start of the current minute, in ms since the epoch; changes once a minute. */
  readonly minute: Signal<number> = computed(() => startOfMinute(this.now()));
}

export function startOfMinute(ms: number): number {
  return Math.floor(ms / 60_000) * 60_000;
}

/**
 * "Now" by the server's clock as this browser sees it: the Clock's ticks, shifted by how far the
 * last answer's `now` was ahead, so countdowns to the server's times (ready-at, wet until) are
 * right on a tablet whose clock is off. Call `heard(answer.now)` with each answer.
 */
export function serverNow(clock: Clock): { now: Signal<number>; heard(serverNowIso: string): void } {
  const skew = signal(0);
  return {
    now: computed(() => clock.now() + skew()),
    heard: (serverNowIso) => skew.set(serverSkew(serverNowIso, clock.now())),
  };
}
