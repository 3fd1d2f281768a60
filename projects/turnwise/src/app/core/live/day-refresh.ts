import { Observable, filter, interval, map, merge, of, tap } from 'rxjs';

import type { DayStreamMessage, DayStreamStatus } from './day-events';

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
