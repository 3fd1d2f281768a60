import { Signal, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { Observable, filter, interval, map, merge, of, switchMap, tap } from 'rxjs';

import type { ServerState } from '../state/server-state';
import { DayEvents, type DayStreamMessage, type DayStreamStatus } from './day-events';

/**
 * When a live screen should fetch its day again: at once, on every change event, when the
 * stream comes back after a drop (events sent meanwhile are lost), and every `everyMs` for
 * changes the clock alone brings (a surface dries, an air hold ends). The stream's status goes
 * to `onStatus` for the screen's "live" indicator.
 *
 * @example
 * dayRefreshes(dayEvents.stream('2027-03-15'), { everyMs: 30_000, onStatus: (s) => status.set(s) })
 *   .pipe(switchMap(() => boards.board('2027-03-15')));
 */
export function dayRefreshes(
  stream: Observable<DayStreamMessage>,
  options: { everyMs?: number; onStatus: (status: DayStreamStatus) => void },
): Observable<void> {
  let dropped = false;
  const fromStream = stream.pipe(
    tap((message) => {
      if (message.type === 'status') options.onStatus(message.status);
    }),
    filter((message) => {
      if (message.type === 'change') return true;
      const comingBack = message.status === 'live' && dropped;
      dropped = message.status === 'reconnecting' || (dropped && message.status === 'connecting');
      return comingBack;
    }),
  );
  const ticks = options.everyMs ? interval(options.everyMs) : of();
  return merge(of(null), fromStream, ticks).pipe(map(() => undefined));
}

/**
 * Keeps `state` showing `key()` and fresh: a new key is shown (fetched), then fetched again on
 * every {@link dayRefreshes} of its day. Answers the stream's status for the "live" indicator.
 * Call in an injection context; the stream closes with the caller.
 *
 * @example
 * readonly board = serverState((date: string) => this.boards.board(date), 'The board could not be shown.');
 * readonly live = liveDay(this.board, this.today, { day: (date) => date, everyMs: 30_000 });
 */
export function liveDay<K, T>(
  state: ServerState<K, T>,
  key: Signal<K | null>,
  options: { day: (key: K) => string; everyMs?: number },
): Signal<DayStreamStatus> {
  const events = inject(DayEvents);
  const status = signal<DayStreamStatus>('connecting');
  toObservable(key)
    .pipe(
      filter((current): current is K => current !== null),
      switchMap((current) =>
        dayRefreshes(events.stream(options.day(current)), { everyMs: options.everyMs, onStatus: (next) => status.set(next) }).pipe(map(() => current)),
      ),
      takeUntilDestroyed(),
    )
    .subscribe((current) => (current === state.key() ? state.reload() : state.show(current)));
  return status.asReadonly();
}
