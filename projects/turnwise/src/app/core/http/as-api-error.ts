import type { ApiError } from '@shared/api/errors';
import { isApiError } from '@shared/api/errors';

/**
 * Any failure as an ApiError. Requests fail with one already (the error interceptor sees to
 * it); anything else is a bug, logged for developers and shown to people as `fallback`.
 *
 * @example
 * asApiError(new TypeError('x is undefined'), 'That change could not be made.');
 * // { status: 0, code: 'unexpected', message: 'That change could not be made.' }
 */
export function asApiError(failure: unknown, fallback: string): ApiError {
  if (isApiError(failure)) return failure;
  console.error(failure);
  return { status: 0, code: 'unexpected', message: fallback };
}
