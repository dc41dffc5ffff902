import { Op } from 'sequelize';
import type { GuardOverrides } from '@/lib/presets/overrides';
import type { ProjectSettings, ProjectSnapshot } from '@/lib/audit/types';
import type { LikelihoodWeights } from '@/lib/exposure/types';
import type { Guard } from '@/lib/stress/types';
import { getDb } from '@/lib/db';
import { NotFoundError } from '@/lib/errors';

const str = (id: number | null | undefined) => (id == null ? null : String(id));

/**
 * Everything an audit reads, from the database, in a stable order: the schedule, the
 * channels, the guard recipes and the project's assumptions. The audit's hash is taken over
 * exactly this, so what a reviewer signs is what was computed.
 */
export async function buildProjectSnapshot(projectId: number): Promise<ProjectSnapshot> {
  const { models } = getDb();
  const project = await models.Project.findByPk(projectId);
  if (!project) throw new NotFoundError(`Project ${projectId} not found.`);

  const cabinets = await models.Cabinet.findAll({ where: { projectId }, order: [['id', 'ASC']] });
  const strips = await models.Strip.findAll({
    where: { cabinetId: { [Op.in]: cabinets.map((c) => c.id) } },
    order: [['id', 'ASC']],
  });
  const terminals = await models.Terminal.findAll({
    where: { stripId: { [Op.in]: strips.map((s) => s.id) } },
    order: [['id', 'ASC']],
  });
  const channels = await models.Channel.findAll({ where: { projectId }, order: [['id', 'ASC']] });
  const recipes = await models.GuardRecipe.findAll({ where: { projectId }, order: [['id', 'ASC']] });

  const settings: ProjectSettings = {
    mainsSystem: project.mainsSystem,
    nominalVoltage: project.nominalVoltage,
    frequency: project.frequency,
    supplyTolerance: project.supplyTolerance,
    dcSupplyMax: project.dcSupplyMax,
    ambientC: project.ambientC,
    surgeLevelKv: project.surgeLevelKv,
    surgeCoupling: project.surgeCoupling,
    esdLevelKv: project.esdLevelKv,
    powerDerating: project.powerDerating,
    voltageDerating: project.voltageDerating,
    wireColourConvention: project.wireColourConvention,
    faultMode: project.faultMode,
    likelihoodWeights: (project.likelihoodWeights as Partial<LikelihoodWeights> | null) ?? null,
  };

  return {
    cabinets: cabinets.map((c) => ({ id: String(c.id), tag: c.tag })),
    strips: strips.map((s) => ({ id: String(s.id), cabinetId: String(s.cabinetId), tag: s.tag })),
    terminals: terminals.map((t) => ({
      id: String(t.id),
      stripId: String(t.stripId),
      position: t.position,
      level: t.level,
      blockId: t.blockId,
      label: t.label,
      terminalNumber: t.terminalNumber,
      wireNumber: t.wireNumber,
      cableId: t.cableId,
      cableCore: t.cableCore,
      connector: t.connector,
      wireColour: t.wireColour,
      circuitClass: t.circuitClass,
      hazardKind: t.hazardKind,
      nominalVoltage: t.nominalVoltage,
      currentKind: t.currentKind,
      frequency: t.frequency,
      sourceImpedance: t.sourceImpedance,
      bridgeGroup: t.bridgeGroup,
      channelId: str(t.channelId),
    })),
    channels: channels
      .filter((c) => c.signalTerminalId != null)
      .map((c) => ({
        id: String(c.id),
        tag: c.tag,
        signalTerminalId: String(c.signalTerminalId),
        returnTerminalId: str(c.returnTerminalId),
        signalType: c.signalType,
        guardRecipeId: str(c.guardRecipeId),
        guardOverrides: (c.guardOverrides as GuardOverrides | null) ?? null,
      })),
    guards: recipes.map((r) => ({ id: String(r.id), name: r.name, guard: r.guard as Guard })),
    settings,
  };
}
