/** One error vocabulary: each class has an HTTP status and a stable code; the problem middleware writes them. */
export interface FieldError {
  path: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    readonly title: string,
    message: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export class ValidationError extends AppError {
  constructor(
    readonly errors: FieldError[],
    detail = 'Some fields need attention.',
  ) {
    super(400, 'validation', 'Invalid request', detail, { errors });
  }
}

export class BadRequestError extends AppError {
  constructor(detail: string) {
    super(400, 'bad-request', 'Bad request', detail);
  }
}

export class UnauthenticatedError extends AppError {
  constructor(detail = 'Sign in to continue.') {
    super(401, 'unauthenticated', 'Not signed in', detail);
  }
}

export class ForbiddenError extends AppError {
  constructor(detail = 'Your role does not allow this.') {
    super(403, 'forbidden', 'Forbidden', detail);
  }
}

export class CsrfError extends AppError {
  constructor() {
    super(
      403,
      'csrf',
      'Forbidden',
      'The request is missing a valid X-CSRF-Token header. Reload the page and try again.',
    );
  }
}

/** A queued change replayed under a session that is not the person who made it (a shared device). */
export class OtherPersonError extends AppError {
  constructor() {
    super(
      403,
      'other-person',
      'Forbidden',
      'This change was made by another person on this device. Only they can send it, after signing in.',
    );
  }
}

/** A write from a client built against another API version (an old tab or service-worker shell). */
export class ApiVersionError extends AppError {
  constructor(sent: string, current: number) {
    super(
      412,
      'api-version',
      'Gaugeline was updated',
      `This page was built for version ${sent} of Gaugeline's API; the server now speaks version ${current}. Reload the page to carry on: changes waiting on this device are kept and sent after the reload.`,
      { currentVersion: current },
    );
  }
}

export class NotFoundError extends AppError {
  constructor(what = 'The resource') {
    super(404, 'not-found', 'Not found', `${what} was not found.`);
  }
}

export class ConflictError extends AppError {
  constructor(detail: string, extra: Record<string, unknown> = {}) {
    super(409, 'conflict', 'Conflict', detail, extra);
  }
}

/**
 * A customer's proposal link (or the session it opened) that no longer works: expired, revoked, or its
 * version replaced. `reason` and `contact` (the company's name and phone from the version sent) let the
 * customer's page say why and whom to call.
 */
export class LinkEndedError extends AppError {
  constructor(detail: string, extra: Record<string, unknown>) {
    super(410, 'link-ended', 'This link no longer works', detail, extra);
  }
}

/** A new record would repeat one the company has (same e-mail or phone); `existing` names it so the person can use it. */
export class DuplicateError extends AppError {
  constructor(title: string, detail: string, extra: Record<string, unknown>) {
    super(409, 'duplicate', title, detail, extra);
  }
}

export class PreconditionRequiredError extends AppError {
  constructor(detail: string) {
    super(428, 'precondition-required', 'Precondition required', detail);
  }
}

export class UnprocessableError extends AppError {
  constructor(detail: string, extra: Record<string, unknown> = {}) {
    super(422, 'unprocessable', 'Cannot be processed', detail, extra);
  }
}

export class PayloadTooLargeError extends AppError {
  constructor(detail = 'The request body is too large.') {
    super(413, 'payload-too-large', 'Payload too large', detail);
  }
}

export class UnsupportedMediaTypeError extends AppError {
  constructor(detail = 'Send the request body as application/json.') {
    super(415, 'unsupported-media-type', 'Unsupported media type', detail);
  }
}

export class RateLimitedError extends AppError {
  constructor(readonly retryAfterSeconds: number) {
    super(429, 'rate-limited', 'Too many requests', `Too many attempts. Try again in ${retryAfterSeconds} seconds.`);
  }
}

export class ServiceUnavailableError extends AppError {
  constructor(detail = 'The service is temporarily unavailable. Try again shortly.') {
    super(503, 'unavailable', 'Service unavailable', detail);
  }
}
