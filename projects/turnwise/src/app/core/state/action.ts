import { Signal, computed, signal } from '@angular/core';
import { Observable, firstValueFrom } from 'rxjs';

import type { ApiError } from '@shared/api/errors';
import { asApiError } from '../http/as-api-error';

/** Where a user's action is: not started, on its way, done with its answer, or refused. */
export type ActionState<T> =
  | { status: 'idle' }
  | { status: 'pending' }
  | { status: 'done'; value: T }
  | { status: 'failed'; error: ApiError };

export interface Action<A extends unknown[], T> {
  readonly state: Signal<ActionState<T>>;
  /** True while a run is on its way; screens hold further changes until it answers. */
  readonly pending: Signal<boolean>;
  /** The last run's refusal (typed: decide on `code` and `details`, never on `message`). */
  readonly error: Signal<ApiError | null>;
  /** Runs the request; resolves to `done` or `failed`, never rejects. */
  run(...args: A): Promise<Extract<ActionState<T>, { status: 'done' | 'failed' }>>;
  /** Back to idle, e.g. when the user dismisses the refusal. */
  reset(): void;
}

/**
 * The one shape of a user's action on every screen: pending → done | failed with the typed
 * ApiError. The request's errors are the caller's to show (send it with `showsOwnErrors()`).
 *
 * @example
 * readonly move = action((exam: PlanExam, start: string) => this.api.move(exam.id, { start, … }));
 * const result = await this.move.run(exam, start);
 * if (result.status === 'failed' && result.error.code === 'stale_version') this.plan.reload();
 */
export function action<A extends unknown[], T>(request: (...args: A) => Observable<T>, failedMessage = 'That could not be done. Try again.'): Action<A, T> {
  const state = signal<ActionState<T>>({ status: 'idle' });
  return {
    state: state.asReadonly(),
    pending: computed(() => state().status === 'pending'),
    error: computed(() => {
      const current = state();
      return current.status === 'failed' ? current.error : null;
    }),
    async run(...args: A) {
      state.set({ status: 'pending' });
      let settled: Extract<ActionState<T>, { status: 'done' | 'failed' }>;
      try {
        settled = { status: 'done', value: await firstValueFrom(request(...args)) };
      } catch (failure) {
        settled = { status: 'failed', error: asApiError(failure, failedMessage) };
      }
      state.set(settled);
      return settled;
    },
    reset: () => state.set({ status: 'idle' }),
  };
}
