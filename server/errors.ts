import { ERROR_STATUS, type ErrorCode, type ErrorDetails } from '../shared/api/errors';

/**
 * Typed errors that services throw; the error handler renders them as
 * `{error:{code, message, details?}}` with their status. Anything else is an unexpected failure:
 * logged, never shown. Every code is one of `shared/api/errors.ts`, so the client can rely on it.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
    /** Extra top-level fields of the error body (e.g. the import refusal's `table`). */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/**
 * A specific refusal: its status comes from the shared table (unless the code allows two, as
 * `file_refused` does) and its details are typed by the code.
 *
 * @example
 * throw new Refusal('nothing_to_undo', 'You have nothing to undo on this day.', undefined);
 */
export class Refusal<C extends ErrorCode> extends HttpError {
  constructor(code: C, message: string, details: ErrorDetails[C], options: { status?: number; extra?: Record<string, unknown> } = {}) {
    super(options.status ?? ERROR_STATUS[code], code, message, details, options.extra);
  }
}

export class UnauthorizedError extends HttpError {
  constructor(message = 'Sign in first.') {
    super(401, 'unauthorized', message);
  }
}

export class ForbiddenError extends HttpError {
  constructor(message = 'Your role may not do this.') {
    super(403, 'forbidden', message);
  }
}

export class NotFoundError extends HttpError {
  constructor(message = 'Not found.') {
    super(404, 'not_found', message);
  }
}

/** 422: the request was understood but its content is invalid; `details` lists the problems. */
export class ValidationError extends HttpError {
  constructor(message: string, details?: ErrorDetails['validation_failed'] | unknown[], extra?: Record<string, unknown>) {
    super(422, 'validation_failed', message, details, extra);
  }
}
