import { inject } from '@angular/core';
import { CanActivateFn, RedirectCommand, Router } from '@angular/router';

import { AuthService } from './auth-service';
import { Role, homeFor } from './roles';

/**
 * Lets a signed-in user through only when their role may use the screen. A user whose role
 * may not sees the "not available" page while the address bar keeps what they asked for.
 * Pair it with authGuard, which handles the signed-out case.
 */
export function roleGuard(roles: readonly Role[]): CanActivateFn {
  return async (_route, state) => {
    const router = inject(Router);
    // Awaited (not read from the signal) because guards run before the first load has settled.
    const user = await inject(AuthService).load();
    if (!user) return router.createUrlTree(['/sign-in']);
    if (roles.includes(user.role)) return true;
    return new RedirectCommand(router.createUrlTree(['/not-available']), { browserUrl: state.url });
  };
}

/** For the bare `/` address: sends a signed-in user to their role's home screen. */
export const homeRedirectGuard: CanActivateFn = async () => {
  const router = inject(Router);
  const user = await inject(AuthService).load();
  return router.parseUrl(user ? homeFor(user.role) : '/sign-in');
};
