import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, of, startWith } from 'rxjs';

import type { ApiError } from '@shared/api/errors';
import { isApiError } from '@shared/api/errors';
import type { DayPlan } from '@shared/api/plan';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** A day's plan as a screen shows it: on its way, there, or failed with a message to show. */
export type DayPlanState =
  | { status: 'loading'; date: string }
  | { status: 'loaded'; date: string; plan: DayPlan }
  | { status: 'failed'; date: string; error: ApiError };

/**
 * Fetches day plans. Kept free of presentation so the later timeline (and its live updates)
 * can reuse it; screens show the error themselves, in the page.
 */
@Injectable({ providedIn: 'root' })
export class DayPlanService {
  private readonly http = inject(HttpClient);

  /** `GET /api/days/:date/plan`; fails with an ApiError. */
  plan(date: string): Observable<DayPlan> {
    return this.http.get<DayPlan>(`/api/days/${encodeURIComponent(date)}/plan`, { context: showsOwnErrors() });
  }

  /** The plan of `date` as a state stream: `loading` first, then `loaded` or `failed`; never errors. */
  state(date: string): Observable<DayPlanState> {
    return this.plan(date).pipe(
      map((plan): DayPlanState => ({ status: 'loaded', date, plan })),
      catchError((error: unknown) => of<DayPlanState>({ status: 'failed', date, error: asApiError(error) })),
      startWith<DayPlanState>({ status: 'loading', date }),
    );
  }
}

function asApiError(error: unknown): ApiError {
  return isApiError(error) ? error : { status: 0, code: 'unexpected', message: 'The day plan could not be shown. Try again.' };
}
