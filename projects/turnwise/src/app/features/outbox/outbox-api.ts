import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { OutboxMessage, OutboxPage } from '@shared/api/notices';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** The Outbox's calls; the screen shows their errors itself. */
@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly http = inject(HttpClient);

  list(): Observable<OutboxPage> {
    return this.http.get<OutboxPage>('/api/outbox', { params: { limit: 200 }, context: showsOwnErrors() });
  }

  message(id: number): Observable<OutboxMessage> {
    return this.http.get<OutboxMessage>(`/api/outbox/${id}`, { context: showsOwnErrors() });
  }
}
