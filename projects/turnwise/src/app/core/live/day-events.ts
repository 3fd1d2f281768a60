import { Injectable, InjectionToken, inject } from '@angular/core';
import { Observable, retry, timer } from 'rxjs';

import type { DayEvent } from '@shared/api/changes';

/** How the day's stream is doing, for a "live" indicator. */
export type DayStreamStatus = 'connecting' | 'live' | 'reconnecting';

/** What the stream of a day emits: its status as it changes, and each `change` event. */
export type DayStreamMessage =
  | { type: 'status'; status: DayStreamStatus }
  /** `event` is null when its data could not be read: something still changed. */
  | { type: 'change'; event: DayEvent | null };

/** Opens an EventSource; tests replace it with a fake because jsdom has none. */
export const EVENT_SOURCE = new InjectionToken<(url: string) => EventSource>('EVENT_SOURCE', {
  providedIn: 'root',
  factory: () => (url) => new EventSource(url, { withCredentials: true }),
});

/** EventSource.CLOSED, spelled out because jsdom (the tests' DOM) has no EventSource. */
const CLOSED = 2;

/** Longest wait between two reconnection attempts, so a long outage does not hammer the server. */
const MAX_RETRY_DELAY_MS = 30_000;

/**
 * The day's server-sent events (`GET /api/days/:date/events`, event name `change`) as an
 * Observable that never errors: the browser's EventSource retries dropped connections itself,
 * and when it gives up (the server answered with an error status) a new one is opened after a
 * growing delay. Screens refetch on each change, and after a reconnection, because events sent
 * while disconnected are lost.
 */
@Injectable({ providedIn: 'root' })
export class DayEvents {
  private readonly open = inject(EVENT_SOURCE);

  stream(date: string): Observable<DayStreamMessage> {
    const url = `/api/days/${encodeURIComponent(date)}/events`;
    return new Observable<DayStreamMessage>((subscriber) => {
      const source = this.open(url);
      subscriber.next({ type: 'status', status: 'connecting' });
      source.onopen = () => subscriber.next({ type: 'status', status: 'live' });
      source.addEventListener('change', (message) => {
        subscriber.next({ type: 'change', event: parse((message as MessageEvent<string>).data) });
      });
      source.onerror = () => {
        subscriber.next({ type: 'status', status: 'reconnecting' });
        // CLOSED means the browser will not try again by itself; retry() below takes over.
        if (source.readyState === CLOSED) subscriber.error(new Error(`${url} closed`));
      };
      return () => source.close();
    }).pipe(retry({ delay: (_, attempt) => timer(Math.min(MAX_RETRY_DELAY_MS, 1000 * 2 ** (attempt - 1))) }));
  }
}

function parse(data: string): DayEvent | null {
  try {
    return JSON.parse(data) as DayEvent;
  } catch {
    return null;
  }
}
