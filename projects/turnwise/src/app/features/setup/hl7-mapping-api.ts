import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type { Hl7Mapping } from '@shared/api/hl7-mapping';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** Setup → Site → Booking system feed: the site's HL7 mapping (admin); each call shows its own errors. */
@Injectable({ providedIn: 'root' })
export class Hl7MappingApi {
  private readonly http = inject(HttpClient);
  private readonly own = { context: showsOwnErrors() };

  mapping(): Observable<Hl7Mapping> {
    return this.http.get<{ mapping: Hl7Mapping }>('/api/hl7/mapping', this.own).pipe(map((r) => r.mapping));
  }
  save(mapping: Hl7Mapping): Observable<Hl7Mapping> {
    return this.http.put<{ mapping: Hl7Mapping }>('/api/hl7/mapping', mapping, this.own).pipe(map((r) => r.mapping));
  }
}
