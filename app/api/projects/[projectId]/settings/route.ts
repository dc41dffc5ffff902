import { projectRoute } from '@/lib/auth/guard';
import { getProjectSettings, updateProjectSettings } from '@/lib/data/project-settings';
import { projectSettingsUpdateSchema } from '@/lib/validation/project-settings';

export const GET = projectRoute({ capability: 'project:read' }, async ({ actor }) =>
  getProjectSettings(actor.projectId),
);

export const PATCH = projectRoute(
  { capability: 'settings:write', body: projectSettingsUpdateSchema },
  async ({ actor, body }) => updateProjectSettings(actor, body),
);
