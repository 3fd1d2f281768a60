import { Injectable, Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { interval, map } from 'rxjs';

/**
 * The browser's time, ticking once a second, for countdowns. One timer for the whole app;
 * tests provide a stand-in whose `now` they set.
 */
@Injectable({ providedIn: 'root' })
export class Clock {
  /** Milliseconds since the epoch. */
  readonly now: Signal<number> = toSignal(interval(1000).pipe(map(() => Date.now())), { initialValue: Date.now() });
}
