import { signal } from '@angular/core';

import { AuthService } from '../app/core/auth/auth-service';
import { SessionUser } from '../app/core/auth/roles';

/** A stand-in AuthService whose user the test sets directly; no HTTP involved. */
export function fakeAuth(user: SessionUser | null) {
  const current = signal(user);
  const fake = {
    user: current.asReadonly(),
    load: jest.fn(async () => current()),
    clear: jest.fn(() => current.set(null)),
    logout: jest.fn(async () => current.set(null)),
    signInAs: (next: SessionUser | null) => current.set(next),
    passwordChanged: jest.fn(() => current.update((u) => (u ? { ...u, mustChangePassword: false } : u))),
  };
  return { fake, provider: { provide: AuthService, useValue: fake } };
}
