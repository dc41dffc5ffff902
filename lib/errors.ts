/**
 * Domain errors. Route handlers and server actions map them to HTTP statuses in one place
 * (lib/http/respond.ts); nothing else decides a status code.
 */

export class AppError extends Error {
  constructor(
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** Not signed in → 401. */
export class UnauthorizedError extends AppError {}

/** Signed in but the role on this project does not allow it → 403. */
export class ForbiddenError extends AppError {}

/** No such record (or not visible to this user) → 404. */
export class NotFoundError extends AppError {}

/** Input failed validation → 422; details carry field errors. */
export class ValidationError extends AppError {
  constructor(
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message, fieldErrors);
  }
}

/** Stale version: someone else saved first → 409; `current` is the record as it now stands. */
export class ConflictError extends AppError {
  constructor(
    message: string,
    readonly current?: unknown,
  ) {
    super(message, current);
  }
}
