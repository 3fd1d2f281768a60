/**
 * Typed errors that services throw; the error handler renders them as `{error:{code, message}}`
 * with their status. Anything else is an unexpected failure: logged, never shown.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    /** Extra top-level fields of the error body (e.g. the import refusal's `table`). */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class BadRequestError extends HttpError {
  constructor(message: string, details?: unknown) {
    super(400, 'bad_request', message, details);
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

export class ConflictError extends HttpError {
  constructor(message: string, details?: unknown) {
    super(409, 'conflict', message, details);
  }
}

export class PayloadTooLargeError extends HttpError {
  constructor(message: string) {
    super(413, 'payload_too_large', message);
  }
}

export class UnsupportedMediaTypeError extends HttpError {
  constructor(message: string) {
    super(415, 'unsupported_media_type', message);
  }
}

/** 422: the request was understood but its content is invalid; `details` lists the problems. */
export class ValidationError extends HttpError {
  constructor(message: string, details?: unknown, extra?: Record<string, unknown>) {
    super(422, 'validation_failed', message, details, extra);
  }
}
