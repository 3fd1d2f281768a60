import { DestroyRef, Signal, inject, signal } from '@angular/core';
import { Observable, Subject, catchError, map, of, switchMap } from 'rxjs';

import type { ApiError } from '@shared/api/errors';
import { asApiError } from '../http/as-api-error';

export type LoadStatus = 'idle' | 'loading' | 'loaded' | 'failed';

/**
 * What a screen shows from the server, for one key at a time (a day, a room): the value, where
 * its loading is, and the last failure as a typed ApiError. A failed refresh keeps the value on
 * screen (status stays `loaded`, `error` says what failed); only a key never loaded fails.
 */
export interface ServerState<K, T> {
  readonly key: Signal<K | null>;
  readonly value: Signal<T | null>;
  readonly status: Signal<LoadStatus>;
  readonly error: Signal<ApiError | null>;
  /** Counts the values taken (fetched or set), so panels that depend on them know to refetch. */
  readonly revision: Signal<number>;
  /** Shows another key: drops the old value and fetches. Showing the current key does nothing. */
  show(key: K): void;
  /** Fetches the current key again, keeping its value on screen until the answer comes. */
  reload(): void;
  /**
   * Takes a value an action answered (a change answers the new state), as if fetched. A fetch
   * still on its way may have been read before the action's change: it is dropped and sent again,
   * so an older answer never lands on top of the newer one.
   */
  set(value: T): void;
}

type Outcome<T> = { value: T } | { error: ApiError };

/**
 * The one shape of server state on every screen. Fetches of the same state never race: a newer
 * one cancels the older (switchMap). Call in an injection context; fetches end with the caller.
 *
 * @example
 * readonly plan = serverState((date: string) => this.api.plan(date), 'The day plan could not be shown.');
 * // template: @if (plan.status() === 'loading') {…} @else if (plan.value(); as p) {…}
 */
export function serverState<K, T>(fetch: (key: K) => Observable<T>, failedMessage: string): ServerState<K, T> {
  const key = signal<K | null>(null);
  const value = signal<T | null>(null);
  const status = signal<LoadStatus>('idle');
  const error = signal<ApiError | null>(null);
  const revision = signal(0);
  const fetches = new Subject<K>();
  let fetching = false;

  const take = (next: T) => {
    value.set(next);
    error.set(null);
    status.set('loaded');
    revision.update((n) => n + 1);
  };
  const subscription = fetches
    .pipe(
      switchMap((current) => {
        fetching = true;
        return fetch(current).pipe(
          map((next): Outcome<T> => ({ value: next })),
          catchError((failure: unknown) => of<Outcome<T>>({ error: asApiError(failure, failedMessage) })),
        );
      }),
    )
    .subscribe((outcome) => {
      fetching = false;
      if ('value' in outcome) return take(outcome.value);
      error.set(outcome.error);
      if (value() === null) status.set('failed');
    });
  inject(DestroyRef).onDestroy(() => subscription.unsubscribe());

  return {
    key: key.asReadonly(),
    value: value.asReadonly(),
    status: status.asReadonly(),
    error: error.asReadonly(),
    revision: revision.asReadonly(),
    show(next: K) {
      if (next === key()) return;
      key.set(next);
      value.set(null);
      error.set(null);
      status.set('loading');
      fetches.next(next);
    },
    reload() {
      const current = key();
      if (current === null) return;
      if (value() === null) status.set('loading');
      fetches.next(current);
    },
    set(next: T) {
      take(next);
      const current = key();
      // switchMap cancels the fetch on its way; the new one starts after the action's change
      if (fetching && current !== null) fetches.next(current);
    },
  };
}
