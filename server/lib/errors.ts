// Typed errors that routes throw; the error handler turns each into the JSON error shape.
export class AppError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export class ValidationError extends AppError {
  constructor(message: string, fields: Record<string, string[]>) {
    super(422, 'validation_failed', message, { fields });
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = 'Sign in to continue.', code = 'unauthorized') {
    super(401, code, message);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = 'Your role does not allow this.') {
    super(403, 'forbidden', message);
  }
}

export class NotFoundError extends AppError {
  constructor(what = 'That item') {
    super(404, 'not_found', `${what} was not found.`);
  }
}

/** A write based on a stale version: `current` is what the other person saved. */
export class ConflictError extends AppError {
  constructor(message: string, current?: unknown) {
    super(409, 'version_conflict', message, current === undefined ? {} : { current });
  }
}
