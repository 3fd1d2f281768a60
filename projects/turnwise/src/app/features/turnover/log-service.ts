import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { LogEntry } from '@shared/api/board';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** Which entries to show; an empty room or person means all. */
export interface LogFilters {
  date: string;
  roomId: number | null;
  user: string;
}

/**
 * The cleaning log: read, export and add corrections. The log is append-only on the server —
 * there is no call to change or remove an entry, so none exists here either.
 */
@Injectable({ providedIn: 'root' })
export class LogService {
  private readonly http = inject(HttpClient);

  /** `GET /api/log`, newest first. */
  entries(filters: LogFilters): Observable<LogEntry[]> {
    return this.http
      .get<{ entries: LogEntry[] }>('/api/log', { params: logParams(filters), context: showsOwnErrors() })
      .pipe(map((body) => body.entries));
  }

  /** Adds a correction note to an entry; answers the new entry, which points back with `correctsId`. */
  correct(entryId: number, note: string): Observable<LogEntry> {
    return this.http.post<LogEntry>(`/api/log/${entryId}/corrections`, { note }, { context: showsOwnErrors() });
  }
}

/**
 * The CSV export's address with the same filters, for a plain download link.
 *
 * @example
 * logCsvUrl({ date: '2027-03-15', roomId: 2, user: '' }); // '/api/log.csv?date=2027-03-15&roomId=2'
 */
export function logCsvUrl(filters: LogFilters): string {
  return `/api/log.csv?${logParams(filters).toString()}`;
}

function logParams(filters: LogFilters): HttpParams {
  let params = new HttpParams().set('date', filters.date);
  if (filters.roomId !== null) params = params.set('roomId', filters.roomId);
  if (filters.user.trim()) params = params.set('user', filters.user.trim());
  return params;
}
