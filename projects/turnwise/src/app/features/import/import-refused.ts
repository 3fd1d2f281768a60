import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { catchError, throwError } from 'rxjs';

import type { ImportRefusal } from '@shared/api/import';

/** A 422 from the import call, with every error and the file's cells kept for the screen. */
export class ImportRefused extends Error {
  constructor(readonly refusal: ImportRefusal) {
    super(refusal.error.message);
    this.name = 'ImportRefused';
  }
}

/**
 * Keeps the body of a refused import. The app's error interceptor reduces every failure to
 * `{status, code, message}`, which would drop the per-row errors and the file's table; this one
 * runs inside it and hands on an {@link ImportRefused} instead, which it passes through untouched.
 */
export const keepImportRefusal: HttpInterceptorFn = (request, next) =>
  next(request).pipe(
    catchError((failure: unknown) =>
      throwError(() =>
        failure instanceof HttpErrorResponse && failure.status === 422 && isRefusal(failure.error)
          ? new ImportRefused(failure.error)
          : failure,
      ),
    ),
  );

function isRefusal(body: unknown): body is ImportRefusal {
  if (typeof body !== 'object' || body === null) return false;
  const candidate = body as Partial<ImportRefusal>;
  return Array.isArray(candidate.errors) && typeof candidate.error?.message === 'string';
}
