import { mapExposures } from '@/lib/exposure';
import type { ExposureMap } from '@/lib/exposure/types';
import { buildProjectSnapshot } from './audit-snapshot';

export interface ExposureView extends ExposureMap {
  terminals: { id: string; label: string; stripId: string; circuitClass: string }[];
}

/** Exposures of the schedule as it stands now (not of a frozen run), with labels for display. */
export async function currentExposures(projectId: number): Promise<ExposureView> {
  const snapshot = await buildProjectSnapshot(projectId);
  const map = mapExposures(snapshot, { weights: snapshot.settings.likelihoodWeights ?? undefined });
  return {
    ...map,
    terminals: snapshot.terminals.map((t) => ({ id: t.id, label: t.label, stripId: t.stripId, circuitClass: t.circuitClass })),
  };
}
