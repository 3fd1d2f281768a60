import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { BoardShiftTask, Checklist } from '@shared/api/board';
import type { RoomKitAnswer } from '@shared/api/mr-zones';
import type { Room } from '@shared/api/rooms';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** What a tick sends: the product used (disinfecting steps) and, for a surface still wet, why now. */
export interface StepTick {
  productKey?: string;
  earlyReason?: string;
}

/**
 * The Turnover screen's calls. Each change answers the whole checklist, recomputed, so the screen
 * never shows a half-updated turnover; errors (409 already done, 422 still wet) go in the page.
 */
@Injectable({ providedIn: 'root' })
export class TurnoverService {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: showsOwnErrors() };

  rooms(): Observable<Room[]> {
    return this.http.get<{ rooms: Room[] }>('/api/rooms', this.quiet).pipe(map((body) => body.rooms));
  }

  /** The room's current turnover, or else its next one. */
  checklist(roomId: number, date: string): Observable<Checklist> {
    return this.http.get<Checklist>(`/api/rooms/${roomId}/turnover`, { ...this.quiet, params: { date } });
  }

  /**
   * Records the exam's real end (server clock) and opens the turnover after it; 409 if already
   * recorded, 422 `exam_not_started` before the slot's start unless `earlyReason` says why.
   */
  examFinished(examId: number, earlyReason?: string): Observable<Checklist> {
    return this.http.post<Checklist>(`/api/exams/${examId}/finished`, earlyReason ? { earlyReason } : {}, this.quiet);
  }

  stepDone(turnoverId: number, stepKey: string, tick: StepTick): Observable<Checklist> {
    const url = `/api/turnovers/${turnoverId}/steps/${encodeURIComponent(stepKey)}/done`;
    return this.http.post<Checklist>(url, tick, this.quiet);
  }

  /** Closes the turnover; `overrideReason` only when an air hold has not yet ended. */
  complete(turnoverId: number, overrideReason?: string): Observable<Checklist> {
    const body = overrideReason ? { overrideReason } : {};
    return this.http.post<Checklist>(`/api/turnovers/${turnoverId}/complete`, body, this.quiet);
  }

  /** The room's cleaning kit and, for an MR room, its zone layout. */
  kit(roomId: number): Observable<RoomKitAnswer> {
    return this.http.get<RoomKitAnswer>(`/api/rooms/${roomId}/kit`, this.quiet);
  }

  shiftTaskDone(task: BoardShiftTask): Observable<BoardShiftTask> {
    return this.http
      .post<{ task: BoardShiftTask }>(`/api/shift-tasks/${task.taskId}/done`, { due: task.due }, this.quiet)
      .pipe(map((body) => body.task));
  }
}
