import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import { LoginResponse, SessionUser } from '@shared/api/auth';
import { showsOwnErrors } from '../http/shows-own-errors';

/** Who is signed in. The session lives in a server cookie; this service only mirrors it. */
@Injectable({ providedIn: 'root' })
export class AuthService {
  private readonly http = inject(HttpClient);
  private readonly current = signal<SessionUser | null>(null);
  private loading: Promise<SessionUser | null> | null = null;

  /** The signed-in user, or null when signed out (or not yet known). */
  readonly user = this.current.asReadonly();

  /**
   * Asks the server who is signed in. Guards call this on every navigation, so the
   * answer is fetched once and reused until sign-in, sign-out or a 401 changes it.
   */
  load(): Promise<SessionUser | null> {
    this.loading ??= firstValueFrom(
      this.http.get<LoginResponse>('/api/auth/me', { context: showsOwnErrors() }),
    ).then(
      (response) => this.settle(response.user),
      // 401 means signed out; any other failure is treated the same so the sign-in page can show.
      () => this.settle(null),
    );
    return this.loading;
  }

  /** Signs in; rejects with an ApiError (401 wrong credentials, 429 throttled) for the page to show. */
  async login(username: string, password: string): Promise<SessionUser> {
    const response = await firstValueFrom(
      this.http.post<LoginResponse>('/api/auth/login', { username, password }, { context: showsOwnErrors() }),
    );
    this.settle(response.user);
    return response.user;
  }

  async logout(): Promise<void> {
    try {
      await firstValueFrom(this.http.post<void>('/api/auth/logout', {}));
    } finally {
      // Forget the user even if the server is unreachable: the screen must not look signed in.
      this.clear();
    }
  }

  /** The user chose their own password: the server's password gate has opened, so the screens may load. */
  passwordChanged(): void {
    const user = this.current();
    if (user) this.settle({ ...user, mustChangePassword: false });
  }

  /** Forgets the user locally, e.g. after the server answered 401 because the session expired. */
  clear(): void {
    this.settle(null);
  }

  private settle(user: SessionUser | null): SessionUser | null {
    this.current.set(user);
    this.loading = Promise.resolve(user);
    return user;
  }
}
