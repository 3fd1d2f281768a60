import type { ApiError } from '@shared/api/errors';
import type { ImportRefusal } from '@shared/api/import';

/**
 * The refused import inside an {@link ApiError}: a 422 whose details carry every row error and
 * the file's cells (the error interceptor keeps them). Null for any other failure, which the
 * screen shows as a plain message.
 *
 * @example
 * importRefusalOf({ status: 422, code: 'validation_failed', message: '1 error', details: { errors: [] } });
 * // { error: { code: 'validation_failed', message: '1 error' }, errors: [] }
 */
export function importRefusalOf(error: ApiError): ImportRefusal | null {
  const details = error.details;
  if (error.status !== 422 || typeof details !== 'object' || details === null) return null;
  const rest = details as Omit<ImportRefusal, 'error'>;
  if (!Array.isArray(rest.errors)) return null;
  return { ...rest, error: { code: error.code, message: error.message } };
}
