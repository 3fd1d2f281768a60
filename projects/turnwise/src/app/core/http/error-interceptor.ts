import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { ApiError } from '@shared/api/errors';
import { AuthService } from '../auth/auth-service';
import { ErrorNotice } from './error-notice';
import { SHOWS_OWN_ERRORS } from './shows-own-errors';

/** Calls that answer 401 as part of normal sign-in, never as "your session ended". */
const AUTH_CALLS = ['/api/auth/me', '/api/auth/login'];

/**
 * Turns every failed request into an {@link ApiError}. A 401 elsewhere means the session
 * expired, so the user is sent to sign in and brought back afterwards; other errors are shown
 * in a snack bar unless the caller opted out with SHOWS_OWN_ERRORS.
 */
export const errorInterceptor: HttpInterceptorFn = (request, next) => {
  const auth = inject(AuthService);
  const router = inject(Router);
  const notice = inject(ErrorNotice);
  const showsOwnErrors = request.context.get(SHOWS_OWN_ERRORS);

  return next(request).pipe(
    catchError((failure: unknown) => {
      if (!(failure instanceof HttpErrorResponse)) return throwError(() => failure);
      const apiError = toApiError(failure);
      if (apiError.status === 401 && !AUTH_CALLS.some((path) => request.url.startsWith(path))) {
        // A call still under way when the user signed out answers 401 too: the sign-out already
        // leads to the sign-in page, and must not come back to this screen after the next sign-in.
        const wasSignedIn = auth.user() !== null;
        auth.clear();
        if (wasSignedIn && !router.url.startsWith('/sign-in')) {
          void router.navigate(['/sign-in'], { queryParams: { returnUrl: router.url } });
        }
      } else if (apiError.code === 'password_change_required') {
        // the session is fine, but a reset password must be changed first: the profile says so
        if (!router.url.startsWith('/profile')) void router.navigateByUrl('/profile');
      } else if (!showsOwnErrors) {
        notice.show(apiError.message);
      }
      return throwError(() => apiError);
    }),
  );
};

/**
 * Reads the server's `{error: {code, message, details?}}` into one {@link ApiError}, details
 * included: a refusal's `error.details`, or the body's other top-level fields (the import's
 * `errors`, `table`, `warnings`), so no caller ever needs the raw response.
 */
export function toApiError(response: HttpErrorResponse): ApiError {
  const body: unknown = response.error;
  if (typeof body === 'object' && body !== null) {
    const { error: serverError, ...rest } = body as { error?: unknown } & Record<string, unknown>;
    if (isCodeAndMessage(serverError)) {
      const details = serverError.details ?? (Object.keys(rest).length > 0 ? rest : undefined);
      const apiError: ApiError = { status: response.status, code: serverError.code, message: serverError.message };
      return details === undefined ? apiError : { ...apiError, details };
    }
  }
  if (response.status === 0) {
    return { status: 0, code: 'unreachable', message: 'Turnwise cannot reach its server. Check the connection and try again.' };
  }
  // Some layers (a proxy, a rate limiter) answer with plain text; show it when it is short enough to read.
  const text = typeof body === 'string' && body.trim().length > 0 && body.length <= 300 ? body.trim() : null;
  return {
    status: response.status,
    code: `http_${response.status}`,
    message: text ?? `The server could not complete this (HTTP ${response.status}). Try again in a moment.`,
  };
}

function isCodeAndMessage(value: unknown): value is { code: string; message: string; details?: unknown } {
  if (typeof value !== 'object' || value === null) return false;
  const candidate = value as { code?: unknown; message?: unknown };
  return typeof candidate.code === 'string' && typeof candidate.message === 'string';
}
