import { HttpClient, HttpEventType } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, filter, map } from 'rxjs';

import type { ImportResult } from '@shared/api/import';
import type { PlannedDay } from '@shared/api/plan';
import type { DayPlanInput } from '@shared/turnover';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** Where an upload is: still sending (percent when the browser knows it), or answered. */
export type ImportProgress =
  | { kind: 'uploading'; percent: number | null }
  | { kind: 'done'; result: ImportResult };

/**
 * Sends an exam-list file to `POST /api/days/:date/exams/import`, as a preview (`dryRun`) or
 * for real. Fails with an ApiError: a 422 carries every row error and the file's cells as details
 * ({@link importRefusalOf}); 415 not CSV/XLSX, 413 too large, …. The screen shows both itself.
 */
@Injectable()
export class ImportService {
  private readonly http = inject(HttpClient);

  /** A commit carries the `dayVersion` of its preview; the server refuses it (409 `day_changed`) if the day moved on. */
  send(date: string, file: File, options: { dryRun: boolean; dayVersion?: number }): Observable<ImportProgress> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http
      .post<ImportResult>(`/api/days/${encodeURIComponent(date)}/exams/import`, body, {
        params: options.dryRun ? { dryRun: 'true' } : options.dayVersion === undefined ? {} : { dayVersion: options.dayVersion },
        reportProgress: true,
        observe: 'events',
        context: showsOwnErrors(),
      })
      .pipe(
        map((event): ImportProgress | null => {
          if (event.type === HttpEventType.UploadProgress) {
            return { kind: 'uploading', percent: event.total ? Math.round((100 * event.loaded) / event.total) : null };
          }
          return event.type === HttpEventType.Response && event.body ? { kind: 'done', result: event.body } : null;
        }),
        filter((progress): progress is ImportProgress => progress !== null),
      );
  }

  /** The day's own engine input (rooms, zone, snug margin), to place the file's rows in their gaps. */
  dayInput(date: string): Observable<DayPlanInput> {
    return this.http.get<PlannedDay>(`/api/days/${encodeURIComponent(date)}/plan`, { context: showsOwnErrors() }).pipe(map((plan) => plan.input));
  }
}
