import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { DayFitAnswer } from '@shared/api/day-fit';
import type { PlannedDay } from '@shared/api/plan';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** "Make the day fit": the proposal, applying it, and pinning an exam. Each call shows its own errors. */
@Injectable({ providedIn: 'root' })
export class DayFitService {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: showsOwnErrors() };

  /** `POST /api/days/:date/fit`: the whole-day proposal (solved on the server, seconds on a big day). */
  propose(date: string): Observable<DayFitAnswer> {
    return this.http.post<DayFitAnswer>(`/api/days/${encodeURIComponent(date)}/fit`, {}, this.quiet);
  }

  /** Applies the proposal as one change; 409 `fit_stale` when the day moved on since it was made. */
  apply(date: string, proposal: DayFitAnswer): Observable<PlannedDay> {
    return this.http
      .post<{ plan: PlannedDay }>(`/api/days/${encodeURIComponent(date)}/fit/apply`, { dayVersion: proposal.dayVersion, changes: proposal.changes }, this.quiet)
      .pipe(map((body) => body.plan));
  }

  /** Pins or unpins an exam (a pinned exam never moves when the day is made to fit). */
  pin(examId: number, pinned: boolean): Observable<{ examId: number; pinned: boolean }> {
    return this.http.put<{ examId: number; pinned: boolean }>(`/api/exams/${examId}/pin`, { pinned }, this.quiet);
  }
}
