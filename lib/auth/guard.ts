import { NextResponse, type NextRequest } from 'next/server';
import { z, ZodError } from 'zod';
import { loadActingUser, loadStanding, type ActingUser } from '@/lib/data/membership';
import { ForbiddenError, NotFoundError, UnauthorizedError } from '@/lib/errors';
import { errorResponse, fieldErrorsOf } from '@/lib/http/respond';
import { can, describeCapability, type Capability, type ProjectStanding } from './permissions';
import { currentUserId } from './session';

type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

const projectIdSchema = z.coerce
  .number()
  .int()
  .positive('Project id must be a positive whole number.');

export interface ProjectActor {
  user: ActingUser;
  projectId: number;
  standing: ProjectStanding;
}

async function requireUser(): Promise<ActingUser> {
  const id = await currentUserId();
  if (id === null) throw new UnauthorizedError('Sign in first.');
  const user = await loadActingUser(id);
  if (!user) throw new UnauthorizedError('Your account is not active; sign in again.');
  return user;
}

/** Loads the user's standing on the project and checks the capability: 404 for non-members, 403 for a role that may not. */
export async function authorizeProject(
  user: ActingUser,
  projectId: number,
  capability: Capability,
): Promise<ProjectActor> {
  const standing = await loadStanding(user, projectId);
  if (!standing) throw new NotFoundError(`Project ${projectId} not found.`);
  if (!can(standing, capability)) {
    const yours = standing.isAdmin ? 'administrator' : standing.role;
    throw new ForbiddenError(
      `${describeCapability(capability)} Your role on this project: ${yours}.`,
    );
  }
  return { user, projectId, standing };
}

async function readJson(request: NextRequest): Promise<unknown> {
  const text = await request.text();
  if (!text.trim()) return undefined;
  return JSON.parse(text);
}

function queryObject(request: NextRequest): Record<string, string> {
  return Object.fromEntries(request.nextUrl.searchParams.entries());
}

interface RouteSpec<P extends z.ZodType, B extends z.ZodType, Q extends z.ZodType> {
  capability: Capability;
  params?: P;
  body?: B;
  query?: Q;
}

/**
 * Every project-scoped route handler goes through this: signed in (401), member of the
 * project (404), role allows the capability (403), input valid (422) — in that order, so a
 * refused caller learns nothing about the input rules. The handler's return value is sent as
 * JSON unless it is already a Response.
 */
export function projectRoute<
  P extends z.ZodType = z.ZodType<Record<string, unknown>>,
  B extends z.ZodType = z.ZodUnknown,
  Q extends z.ZodType = z.ZodType<Record<string, unknown>>,
>(
  spec: RouteSpec<P, B, Q>,
  handler: (input: {
    actor: ProjectActor;
    params: z.infer<P>;
    body: z.infer<B>;
    query: z.infer<Q>;
    request: NextRequest;
  }) => Promise<unknown>,
) {
  return async (request: NextRequest, context: RouteContext): Promise<Response> => {
    try {
      const user = await requireUser();
      const rawParams = await context.params;
      const projectId = projectIdSchema.parse(rawParams.projectId);
      const actor = await authorizeProject(user, projectId, spec.capability);
      const params = (spec.params ?? z.object({})).parse(rawParams);
      const query = (spec.query ?? z.object({})).parse(queryObject(request));
      const body = spec.body ? spec.body.parse(await readJson(request)) : undefined;
      const result = await handler({
        actor,
        params: params as z.infer<P>,
        body: body as z.infer<B>,
        query: query as z.infer<Q>,
        request,
      });
      return result instanceof Response ? result : NextResponse.json(result ?? null);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Route handlers that need a signed-in user but no project (project list, own profile). */
export function userRoute<B extends z.ZodType = z.ZodUnknown>(
  spec: { body?: B; adminOnly?: boolean },
  handler: (input: {
    user: ActingUser;
    body: z.infer<B>;
    request: NextRequest;
  }) => Promise<unknown>,
) {
  return async (request: NextRequest): Promise<Response> => {
    try {
      const user = await requireUser();
      if (spec.adminOnly && !user.isAdmin)
        throw new ForbiddenError('Only an administrator may do this.');
      const body = spec.body ? spec.body.parse(await readJson(request)) : undefined;
      const result = await handler({ user, body: body as z.infer<B>, request });
      return result instanceof Response ? result : NextResponse.json(result ?? null);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; status: number; error: string; fieldErrors?: Record<string, string[]> };

/**
 * Server actions are public endpoints: the same checks as projectRoute, returning a typed
 * result the form can render (field errors under each field) instead of throwing.
 */
export function projectAction<S extends z.ZodType<{ projectId: number }>, T>(
  capability: Capability,
  schema: S,
  fn: (input: z.infer<S>, actor: ProjectActor) => Promise<T>,
) {
  return async (raw: unknown): Promise<ActionResult<T>> => {
    try {
      const user = await requireUser();
      const projectId = projectIdSchema.parse((raw as { projectId?: unknown } | null)?.projectId);
      const actor = await authorizeProject(user, projectId, capability);
      const input = schema.parse(raw);
      return { ok: true, data: await fn(input, actor) };
    } catch (error) {
      if (error instanceof ZodError) {
        return {
          ok: false,
          status: 422,
          error: 'Some fields need attention.',
          fieldErrors: fieldErrorsOf(error),
        };
      }
      const response = errorResponse(error);
      const body = (await response.json()) as {
        error: string;
        fieldErrors?: Record<string, string[]>;
      };
      return {
        ok: false,
        status: response.status,
        error: body.error,
        fieldErrors: body.fieldErrors,
      };
    }
  };
}
