/**
 * Typed errors that routes and services throw. One handler (problem-handler.ts) turns them into
 * application/problem+json responses (RFC 9457), so no route formats an error itself.
 */
export interface FieldError {
  /** Dotted path of the offending field, e.g. "body.email" or "query.page". */
  path: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly slug: string,
    readonly title: string,
    readonly detail?: string,
    readonly fieldErrors?: FieldError[],
  ) {
    super(detail ?? title);
    this.name = new.target.name;
  }
}

export class ValidationError extends AppError {
  constructor(fieldErrors: FieldError[], detail = 'Some fields need attention.') {
    super(400, 'validation', 'Invalid request', detail, fieldErrors);
  }
}

export class NotSignedInError extends AppError {
  constructor(detail = 'Sign in to continue.') {
    super(401, 'not-signed-in', 'Not signed in', detail);
  }
}

export class ForbiddenError extends AppError {
  constructor(detail = 'Your account does not have access to this.') {
    super(403, 'forbidden', 'Not allowed', detail);
  }
}

/** Also used for records outside the caller's scope, so their existence is not revealed. */
export class NotFoundError extends AppError {
  constructor(detail = 'There is nothing here, or it is not yours to see.') {
    super(404, 'not-found', 'Not found', detail);
  }
}

export class ConflictError extends AppError {
  constructor(detail: string) {
    super(409, 'conflict', 'Conflict', detail);
  }
}

export class ServiceUnavailableError extends AppError {
  constructor(detail: string) {
    super(503, 'unavailable', 'Service unavailable', detail);
  }
}
