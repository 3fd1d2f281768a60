import { Injectable, InjectionToken, inject } from '@angular/core';
import { Observable, defer, retry, tap, timer } from 'rxjs';

import type { DayEvent } from '@shared/api/changes';

/** Opens an event stream; replaced in tests (jsdom has no EventSource). */
export const EVENT_SOURCE = new InjectionToken<(url: string) => EventSource>('EVENT_SOURCE', {
  providedIn: 'root',
  factory: () => (url) => new EventSource(url, { withCredentials: true }),
});

/** A change of the day, or the stream (re)connecting, or dropping (it then retries). */
export type StreamNotice = DayEvent | 'opened' | 'dropped';

/** `EventSource.CLOSED`, spelled out so this file also loads where EventSource does not exist. */
const CLOSED = 2;

/** Longest wait between reconnection attempts once the server has been gone for a while. */
const MAX_BACKOFF_MS = 30_000;

/** Live "this day changed" notices from `GET /api/days/:date/events`. */
@Injectable({ providedIn: 'root' })
export class DayEvents {
  private readonly open = inject(EVENT_SOURCE);

  /**
   * Each `change` event of the day, plus `opened` when the stream (re)connects (the screen
   * refetches what it missed) and `dropped` when it loses the connection. EventSource retries by
   * itself after a dropped connection, but gives up for good on some failures (it closes); those
   * are retried here with a growing pause.
   */
  changes(date: string): Observable<StreamNotice> {
    // Failures in a row; only a stream that opens again counts as recovered.
    let failures = 0;
    return defer(() => this.stream(date)).pipe(
      tap((notice) => notice === 'opened' && (failures = 0)),
      retry({ delay: () => timer(Math.min(MAX_BACKOFF_MS, 1000 * 2 ** failures++)) }),
    );
  }

  private stream(date: string): Observable<StreamNotice> {
    return new Observable<StreamNotice>((subscriber) => {
      const source = this.open(`/api/days/${encodeURIComponent(date)}/events`);
      source.onopen = () => subscriber.next('opened');
      source.addEventListener('change', (event) => {
        try {
          subscriber.next(JSON.parse((event as MessageEvent<string>).data) as DayEvent);
        } catch {
          // A notice we cannot read still means the day changed.
          subscriber.next({ date, kind: 'plan', reason: 'unknown', by: null, at: new Date().toISOString() });
        }
      });
      source.onerror = () => {
        subscriber.next('dropped');
        if (source.readyState === CLOSED) subscriber.error(new Error('event stream closed'));
      };
      return () => source.close();
    });
  }
}
