import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type { Report } from '@shared/api/reports';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** What a report covers: a range of days (both included) and one room or all. */
export interface ReportFilters {
  from: string;
  to: string;
  roomId: number | null;
}

/** `GET /api/reports`: the numbers are computed on the server, the screen only draws them. */
@Injectable({ providedIn: 'root' })
export class ReportService {
  private readonly http = inject(HttpClient);

  report(filters: ReportFilters): Observable<Report> {
    let params = new HttpParams().set('from', filters.from).set('to', filters.to);
    if (filters.roomId !== null) params = params.set('room', filters.roomId);
    return this.http.get<Report>('/api/reports', { params, context: showsOwnErrors() });
  }
}
