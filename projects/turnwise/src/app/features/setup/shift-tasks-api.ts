import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { ShiftTaskInput, ShiftTaskUpdate, ShiftTaskView } from '@shared/api/shift-tasks';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** Setup → Shift tasks' calls (admin); each shows its own errors. */
@Injectable({ providedIn: 'root' })
export class ShiftTasksApi {
  private readonly http = inject(HttpClient);
  private readonly own = { context: showsOwnErrors() };

  list(): Observable<ShiftTaskView[]> {
    return this.http.get<{ tasks: ShiftTaskView[] }>('/api/shift-tasks', this.own).pipe(map((r) => r.tasks));
  }
  create(task: ShiftTaskInput): Observable<ShiftTaskView> {
    return this.http.post<{ task: ShiftTaskView }>('/api/shift-tasks', task, this.own).pipe(map((r) => r.task));
  }
  update(id: number, task: ShiftTaskUpdate): Observable<ShiftTaskView> {
    return this.http.put<{ task: ShiftTaskView }>(`/api/shift-tasks/${id}`, task, this.own).pipe(map((r) => r.task));
  }
  retire(id: number): Observable<ShiftTaskView> {
    return this.http.post<{ task: ShiftTaskView }>(`/api/shift-tasks/${id}/retire`, {}, this.own).pipe(map((r) => r.task));
  }
}
