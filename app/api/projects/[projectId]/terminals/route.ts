import { NextResponse } from 'next/server';
import { projectRoute } from '@/lib/auth/guard';
import {
  bulkUpdateTerminals,
  createTerminal,
  TerminalConflictError,
} from '@/lib/data/schedule/terminals';
import { terminalBulkUpdateSchema, terminalCreateSchema } from '@/lib/validation/terminal';

export const POST = projectRoute(
  { capability: 'schedule:write', body: terminalCreateSchema },
  async ({ actor, body }) =>
    NextResponse.json(
      await createTerminal({ userId: actor.user.id, projectId: actor.projectId }, body),
      { status: 201 },
    ),
);

/** Bulk edit: all or nothing; a stale row answers 409 listing every conflict (the contract's `conflicts`, each with `changedBy`). */
export const PATCH = projectRoute(
  { capability: 'schedule:write', body: terminalBulkUpdateSchema },
  async ({ actor, body }) => {
    try {
      return {
        items: await bulkUpdateTerminals(
          { userId: actor.user.id, projectId: actor.projectId },
          body.updates,
        ),
      };
    } catch (err) {
      if (err instanceof TerminalConflictError) {
        return NextResponse.json({ error: err.message, conflicts: err.conflicts }, { status: 409 });
      }
      throw err;
    }
  },
);
