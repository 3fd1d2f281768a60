import type { ErrorRequestHandler } from 'express';
import { HttpError } from '../errors';

interface BodyParserError {
  type?: string;
  status?: number;
  code?: string;
}

function fromKnownLibraries(err: BodyParserError): HttpError | undefined {
  if (err.type === 'entity.too.large') return new HttpError(413, 'payload_too_large', 'The request body is too large.');
  if (err.type === 'entity.parse.failed') return new HttpError(400, 'bad_json', 'The request body is not valid JSON.');
  if (err.code === 'LIMIT_FILE_SIZE') return new HttpError(413, 'payload_too_large', 'The file is larger than the 5 MB limit.');
  if (err.code?.startsWith('LIMIT_')) return new HttpError(400, 'bad_upload', 'The upload is malformed: send one file in the field "file".');
  if (typeof err.status === 'number' && err.status >= 400 && err.status < 500) {
    return new HttpError(err.status, 'bad_request', 'The request could not be read.');
  }
  return undefined;
}

/**
 * Renders every error as `{error:{code, message}}`; a validation error with a list also carries
 * `errors` (the import contract). Unknown errors are logged and shown as a plain 500.
 */
export function errorHandler(log: (err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    const known = err instanceof HttpError ? err : fromKnownLibraries(err as BodyParserError);
    if (!known) {
      log(err);
      res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server. It has been logged.' } });
      return;
    }
    const body: Record<string, unknown> = { error: { code: known.code, message: known.message } };
    if (Array.isArray(known.details)) body['errors'] = known.details;
    else if (known.details !== undefined) (body['error'] as Record<string, unknown>)['details'] = known.details;
    res.status(known.status).json({ ...body, ...known.extra });
  };
}
