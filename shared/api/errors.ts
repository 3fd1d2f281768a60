/**
 * The one error shape the client works with. The server answers failures as
 * `{error: {code, message}}` with an HTTP status; the client's error interceptor folds the
 * status in, so components never look at raw HTTP responses.
 */
export interface ApiError {
  /** HTTP status; 0 when the server could not be reached at all. */
  status: number;
  /** Stable machine-readable code from the server, e.g. `validation_failed`. */
  code: string;
  /** Human-readable text, safe to show as is. */
  message: string;
}

/**
 * Tells an {@link ApiError} apart from any other thrown value (a bug, a cancelled request).
 *
 * @example
 * isApiError({ status: 409, code: 'stale_version', message: 'Someone moved this slot first.' }); // true
 * isApiError(new Error('boom')); // false
 */
export function isApiError(value: unknown): value is ApiError {
  if (typeof value !== 'object' || value === null) return false;
  const candidate = value as Partial<ApiError>;
  return (
    typeof candidate.status === 'number' &&
    typeof candidate.code === 'string' &&
    typeof candidate.message === 'string'
  );
}
