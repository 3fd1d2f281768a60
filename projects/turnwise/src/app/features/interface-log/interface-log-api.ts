import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { Hl7AckCode, Hl7LogMessage, Hl7LogPage } from '@shared/api/hl7';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** A page of the interface log: messages older than `before` (null: the newest), with one ACK code or all. */
export interface LogPageKey {
  ack: Hl7AckCode | null;
  before: number | null;
}

/** Messages on a page of the interface log. */
export const LOG_PAGE_SIZE = 50;

/** The interface log's calls; the screen shows their errors itself. */
@Injectable({ providedIn: 'root' })
export class InterfaceLogApi {
  private readonly http = inject(HttpClient);

  page(key: LogPageKey): Observable<Hl7LogPage> {
    const params: Record<string, string | number> = { limit: LOG_PAGE_SIZE };
    if (key.ack) params['ack'] = key.ack;
    if (key.before !== null) params['before'] = key.before;
    return this.http.get<Hl7LogPage>('/api/hl7/messages', { params, context: showsOwnErrors() });
  }

  message(id: number): Observable<Hl7LogMessage> {
    return this.http.get<Hl7LogMessage>(`/api/hl7/messages/${id}`, { context: showsOwnErrors() });
  }
}
