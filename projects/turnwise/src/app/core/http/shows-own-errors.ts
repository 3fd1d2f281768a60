import { HttpContext, HttpContextToken } from '@angular/common/http';

/**
 * Set on a request whose caller shows the error itself (a form, an inline message):
 * the error interceptor then skips its snack bar, but still hands over an ApiError.
 */
export const SHOWS_OWN_ERRORS = new HttpContextToken<boolean>(() => false);

/** A request context that opts out of the error snack bar. */
export function showsOwnErrors(): HttpContext {
  return new HttpContext().set(SHOWS_OWN_ERRORS, true);
}
