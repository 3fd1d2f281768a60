import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import { DemoAccounts } from '@shared/api/auth';
import { showsOwnErrors } from '../../core/http/shows-own-errors';

/** Fetches the demo accounts; null when the server is not in demo mode (204, no body) or does not answer. */
@Injectable({ providedIn: 'root' })
export class DemoAccountsService {
  private readonly http = inject(HttpClient);

  async fetch(): Promise<DemoAccounts | null> {
    try {
      // A 204 arrives as a null body.
      return await firstValueFrom(
        this.http.get<DemoAccounts | null>('/api/auth/demo-accounts', { context: showsOwnErrors() }),
      );
    } catch {
      // Outside demo mode the list simply is not there; nothing to tell the user.
      return null;
    }
  }
}
