import { z } from 'zod';
import { projectRoute } from '@/lib/auth/guard';
import { deleteTerminal, loadTerminalRows, updateTerminal } from '@/lib/data/schedule/terminals';
import { findTerminal } from '@/lib/data/schedule/scope';
import { idParam, versionQuery } from '@/lib/validation/cabinet';
import { terminalUpdateSchema } from '@/lib/validation/terminal';

const params = z.object({ terminalId: idParam('terminalId') });

export const GET = projectRoute(
  { capability: 'schedule:read', params },
  async ({ actor, params }) => {
    await findTerminal(actor.projectId, params.terminalId);
    return (await loadTerminalRows(actor.projectId, [params.terminalId]))[0];
  },
);

export const PATCH = projectRoute(
  { capability: 'schedule:write', params, body: terminalUpdateSchema },
  async ({ actor, params, body }) => {
    const { version, ...changes } = body;
    return updateTerminal(
      { userId: actor.user.id, projectId: actor.projectId },
      params.terminalId,
      version,
      changes,
    );
  },
);

export const DELETE = projectRoute(
  { capability: 'schedule:write', params, query: versionQuery },
  async ({ actor, params, query }) => {
    await deleteTerminal(
      { userId: actor.user.id, projectId: actor.projectId },
      params.terminalId,
      query.version,
    );
    return { deleted: true };
  },
);
