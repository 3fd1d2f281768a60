import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { PlannedDay } from '@shared/api/plan';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** A day's plan as printed, with the version it was printed at. */
export interface SheetDay {
  plan: PlannedDay;
  /**
   * The plan's version as the server tags it (its ETag, which changes with every change to the
   * day's exams, staffing or setup), shortened: two sheets with the same version show the same plan.
   */
  version: string;
}

/** The day sheet's one call: the day's plan (`GET /api/days/:date/plan`). */
@Injectable({ providedIn: 'root' })
export class DaySheetService {
  private readonly http = inject(HttpClient);

  sheet(date: string): Observable<SheetDay> {
    return this.http
      .get<PlannedDay>(`/api/days/${encodeURIComponent(date)}/plan`, { observe: 'response', context: showsOwnErrors() })
      .pipe(map((response) => ({ plan: response.body!, version: shortVersion(response.headers.get('ETag')) })));
  }
}

/**
 * The first eight characters of an ETag's value, enough to tell two versions apart on paper.
 *
 * @example
 * shortVersion('"q3Zt9aXw1kL0"'); // 'q3Zt9aXw'
 */
export function shortVersion(etag: string | null): string {
  return (etag ?? '').replace(/^W\//, '').replaceAll('"', '').slice(0, 8);
}
