import type { ProjectActor } from '@/lib/auth/guard';
import { getDb } from '@/lib/db';
import { NotFoundError } from '@/lib/errors';
import type { ProjectSettingsUpdate } from '@/lib/validation/project-settings';
import { logAction } from './audit-log';
import { updateVersioned } from './versioned';

const SETTING_FIELDS = [
  'mainsSystem',
  'nominalVoltage',
  'frequency',
  'supplyTolerance',
  'dcSupplyMax',
  'ambientC',
  'overvoltageCategory',
  'surgeLevelKv',
  'surgeCoupling',
  'esdLevelKv',
  'powerDerating',
  'voltageDerating',
  'wireColourConvention',
  'faultMode',
] as const;

export type ProjectSettings = Pick<ProjectSettingsUpdate, (typeof SETTING_FIELDS)[number] | 'version'>;

function pickSettings(record: Record<string, unknown>): ProjectSettings {
  const out: Record<string, unknown> = { version: record.version };
  for (const f of SETTING_FIELDS) out[f] = record[f];
  return out as ProjectSettings;
}

export async function getProjectSettings(projectId: number): Promise<ProjectSettings> {
  const { models } = getDb();
  const project = await models.Project.findByPk(projectId);
  if (!project) throw new NotFoundError(`Project ${projectId} not found.`);
  return pickSettings(project.get({ plain: true }));
}

/** Saves the assumptions if nobody saved since `version`; logs what changed. */
export async function updateProjectSettings(actor: ProjectActor, input: ProjectSettingsUpdate): Promise<ProjectSettings> {
  const { models, sequelize } = getDb();
  const { version, ...changes } = input;
  return sequelize.transaction(async (transaction) => {
    const before = await getProjectSettings(actor.projectId);
    const updated = await updateVersioned(models.Project, actor.projectId, version, changes, { transaction });
    const after = pickSettings(updated.get({ plain: true }));
    const changed = SETTING_FIELDS.filter((f) => before[f] !== after[f]).map((f) => ({ field: f, from: before[f], to: after[f] }));
    await logAction(
      { actorId: actor.user.id, projectId: actor.projectId, action: 'settings.update', entity: 'Project', entityId: actor.projectId, detail: { changed } },
      transaction,
    );
    return after;
  });
}
