import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';

import { AuthService } from './auth-service';

/**
 * Lets signed-in users through; sends everyone else to sign in, remembering where they were
 * going, and a user who must change their password to their profile.
 */
export const authGuard: CanActivateFn = async (_route, state) => {
  // inject() only works before the first await.
  const router = inject(Router);
  const user = await inject(AuthService).load();
  // after a password reset the server refuses everything else, so the profile comes first
  if (user?.mustChangePassword && !state.url.startsWith('/profile')) return router.createUrlTree(['/profile']);
  if (user) return true;
  return router.createUrlTree(['/sign-in'], { queryParams: { returnUrl: state.url } });
};
