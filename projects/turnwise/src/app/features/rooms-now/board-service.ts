import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type { Board } from '@shared/api/board';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** The board's calls; the screen shows every error in the page, so none pops a snack bar. */
@Injectable({ providedIn: 'root' })
export class BoardService {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: showsOwnErrors() };

  /** `GET /api/days/:date/board`, computed at the server's clock. */
  board(date: string): Observable<Board> {
    return this.http.get<Board>(`/api/days/${encodeURIComponent(date)}/board`, this.quiet);
  }

  /** The front desk's "patient has arrived" for this exam. */
  markArrived(examId: number): Observable<{ arrivedAt: string }> {
    return this.http.post<{ arrivedAt: string }>(`/api/exams/${examId}/arrived`, {}, this.quiet);
  }

  /** Takes back a mistaken arrival mark. */
  undoArrived(examId: number): Observable<unknown> {
    return this.http.delete(`/api/exams/${examId}/arrived`, this.quiet);
  }
}
