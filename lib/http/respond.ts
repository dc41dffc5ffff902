import { NextResponse } from 'next/server';
import { ZodError } from 'zod';
import {
  ConflictError,
  ForbiddenError,
  NotFoundError,
  UnauthorizedError,
  ValidationError,
} from '@/lib/errors';

/** The JSON error body every route handler returns. */
export interface ErrorBody {
  error: string;
  fieldErrors?: Record<string, string[]>;
  current?: unknown;
  /** On a 409 for a stale version: who saved the newer one, when the audit log knows. */
  changedBy?: unknown;
}

/** zod issues → { "rows.3.position": ["Must be 1 or more"] }, paths joined with dots. */
export function fieldErrorsOf(error: ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

function describeZod(error: ZodError): string {
  const first = error.issues[0];
  if (!first) return 'The request is not valid.';
  const where = first.path.length ? `${first.path.join('.')}: ` : '';
  const more = error.issues.length > 1 ? ` (and ${error.issues.length - 1} more)` : '';
  return `${where}${first.message}${more}`;
}

/** The one place where errors become HTTP statuses (STYLE.md habit 4). */
export function errorResponse(error: unknown): NextResponse<ErrorBody> {
  if (error instanceof ZodError) {
    return NextResponse.json(
      { error: describeZod(error), fieldErrors: fieldErrorsOf(error) },
      { status: 422 },
    );
  }
  if (error instanceof ValidationError) {
    return NextResponse.json(
      { error: error.message, fieldErrors: error.fieldErrors },
      { status: 422 },
    );
  }
  if (error instanceof UnauthorizedError) {
    return NextResponse.json({ error: error.message }, { status: 401 });
  }
  if (error instanceof ForbiddenError) {
    return NextResponse.json({ error: error.message }, { status: 403 });
  }
  if (error instanceof NotFoundError) {
    return NextResponse.json({ error: error.message }, { status: 404 });
  }
  if (error instanceof ConflictError) {
    const changedBy = (error as { changedBy?: unknown }).changedBy;
    return NextResponse.json(
      {
        error: error.message,
        current: error.current,
        ...(changedBy !== undefined ? { changedBy } : {}),
      },
      { status: 409 },
    );
  }
  if (error instanceof SyntaxError) {
    return NextResponse.json(
      { error: `The request body is not valid JSON: ${error.message}` },
      { status: 400 },
    );
  }
  console.error(error);
  return NextResponse.json(
    { error: 'Something went wrong on the server; nothing was changed.' },
    { status: 500 },
  );
}
