import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { DayHistory, ExamFormInput } from '@shared/api/changes';
import type { MoveReason } from '@shared/api/limits';
import type { PlannedDay } from '@shared/api/plan';
import type { Room } from '@shared/api/rooms';
import type { Fix } from '@shared/fixes/model';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/**
 * The Day plan's calls. Every one shows its own errors (the screen puts them in a banner), and
 * every change answers the day's new plan so the screen never shows a half-updated day.
 */
@Injectable({ providedIn: 'root' })
export class DayPlanService {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: showsOwnErrors() };

  /** `GET /api/days/:date/plan`; fails with an ApiError. */
  plan(date: string): Observable<PlannedDay> {
    return this.http.get<PlannedDay>(`${day(date)}/plan`, this.quiet);
  }

  /** Moves a slot (`start` ISO with offset); 409 when `version` is stale, 422 when the move is refused. */
  move(examId: number, body: { start: string; roomId: number; version: number; reason: MoveReason }): Observable<PlannedDay> {
    return this.http.patch<PlannedDay>(`/api/exams/${examId}`, body, this.quiet);
  }

  /** Adds one exam (the import's columns, checked by its rules); 422 `validation_failed` lists `problems` by column. */
  addExam(date: string, body: ExamFormInput): Observable<PlannedDay> {
    return this.http.post<PlannedDay>(`${day(date)}/exams`, body, this.quiet);
  }

  /** Replaces an exam's fields; 409 `stale_version` when `version` is stale, 422 as {@link addExam}. */
  editExam(examId: number, body: ExamFormInput & { version: number }): Observable<PlannedDay> {
    return this.http.put<PlannedDay>(`/api/exams/${examId}`, body, this.quiet);
  }

  /** Cancels an exam (it leaves the day); 409 `stale_version` when `version` is stale. */
  cancelExam(examId: number, version: number): Observable<PlannedDay> {
    return this.http.delete<PlannedDay>(`/api/exams/${examId}`, { ...this.quiet, params: { version } });
  }

  /** People on the turnover before `toExamId`; null goes back to the room's usual staff. */
  gapStaffing(toExamId: number, staff: number | null): Observable<PlannedDay> {
    return this.http.put<PlannedDay>(`/api/exams/${toExamId}/staffing`, { staff }, this.quiet);
  }

  roomStaffing(roomId: number, staff: number): Observable<Room[]> {
    return this.http.patch<{ rooms: Room[] }>(`/api/rooms/${roomId}/staffing`, { staff }, this.quiet).pipe(map((body) => body.rooms));
  }

  undo(date: string): Observable<PlannedDay> {
    return this.http.post<PlannedDay>(`${day(date)}/undo`, {}, this.quiet);
  }

  redo(date: string): Observable<PlannedDay> {
    return this.http.post<PlannedDay>(`${day(date)}/redo`, {}, this.quiet);
  }

  /** The day's changes, newest first, and whether the signed-in user has anything to undo or redo. */
  history(date: string): Observable<DayHistory> {
    return this.http.get<DayHistory>(`${day(date)}/history`, this.quiet);
  }

  /** The suggested fixes of one gap (the one before exam `toExamId`); none when it is not short or overlapping. */
  fixes(date: string, toExamId: number): Observable<Fix[]> {
    return this.http.get<{ fixes: Fix[] }>(`${day(date)}/fixes`, { ...this.quiet, params: { gap: toExamId } }).pipe(map((body) => body.fixes));
  }

  /** 422 when the fix makes other gaps short and that was not accepted. */
  applyFix(date: string, fixId: string, acceptNewProblems: boolean): Observable<PlannedDay> {
    return this.http
      .post<{ applied: Fix; plan: PlannedDay }>(`${day(date)}/fixes/apply`, { fixId, acceptNewProblems }, this.quiet)
      .pipe(map((body) => body.plan));
  }
}

function day(date: string): string {
  return `/api/days/${encodeURIComponent(date)}`;
}
