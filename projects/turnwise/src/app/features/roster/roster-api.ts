import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { DayRoster, RosterRow, WeeklyRoster } from '@shared/api/roster';
import type { Room } from '@shared/api/rooms';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** The roster's calls; each shows its own errors (the dialogs put 422 problems on their fields). */
@Injectable({ providedIn: 'root' })
export class RosterApi {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: showsOwnErrors() };

  /** `GET /api/days/:date/roster`: the roster in force (the day's own, the weekday's default, or none). */
  day(date: string): Observable<DayRoster> {
    return this.http.get<{ roster: DayRoster }>(`/api/days/${date}/roster`, this.quiet).pipe(map((r) => r.roster));
  }

  /** `PUT /api/days/:date/roster` (charge, admin); 422 `validation_failed` names `rows.N.field`. */
  saveDay(date: string, rows: RosterRow[]): Observable<DayRoster> {
    return this.http.put<{ roster: DayRoster }>(`/api/days/${date}/roster`, { rows }, this.quiet).pipe(map((r) => r.roster));
  }

  /** `POST /api/days/:date/roster/import?dryRun=true`: a roster file's rows, unsaved; 422 with `errors` by row and column. */
  previewFile(date: string, file: File): Observable<RosterRow[]> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<{ rows: RosterRow[] }>(`/api/days/${date}/roster/import?dryRun=true`, body, this.quiet).pipe(map((r) => r.rows));
  }

  /** `POST /api/days/:date/roster/import`: a roster file saved as the day's roster. */
  importFile(date: string, file: File): Observable<DayRoster> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<{ roster: DayRoster }>(`/api/days/${date}/roster/import`, body, this.quiet).pipe(map((r) => r.roster));
  }

  /** `DELETE /api/days/:date/roster`: the day back to its weekday's default. */
  clearDay(date: string): Observable<DayRoster> {
    return this.http.delete<{ roster: DayRoster }>(`/api/days/${date}/roster`, this.quiet).pipe(map((r) => r.roster));
  }

  /** `GET /api/roster/weekly`. */
  weekly(): Observable<WeeklyRoster> {
    return this.http.get<{ weekly: WeeklyRoster }>('/api/roster/weekly', this.quiet).pipe(map((r) => r.weekly));
  }

  /** `PUT /api/roster/weekly/:weekday` (admin). */
  saveWeekday(weekday: number, rows: RosterRow[]): Observable<WeeklyRoster> {
    return this.http.put<{ weekly: WeeklyRoster }>(`/api/roster/weekly/${weekday}`, { rows }, this.quiet).pipe(map((r) => r.weekly));
  }

  /** `GET /api/rooms`: the rooms in use, for the rooms a person covers. */
  rooms(): Observable<Room[]> {
    return this.http.get<{ rooms: Room[] }>('/api/rooms', this.quiet).pipe(map((r) => r.rooms));
  }
}
