import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { CabinetWorkspace } from '@/components/schedule/cabinet-workspace';
import type { Cabinet } from '@/components/schedule/types';
import { getCabinet } from '@/lib/data/schedule/cabinets';
import { NotFoundError } from '@/lib/errors';
import { asJson, idSegment, scheduleAccess } from '../access';

export const metadata: Metadata = { title: 'Cabinet schedule' };

export default async function CabinetPage({
  params,
}: {
  params: Promise<{ projectId: string; cabinetId: string }>;
}) {
  const raw = await params;
  const { projectId, canWrite } = await scheduleAccess(raw.projectId);
  const cabinetId = idSegment(raw.cabinetId);
  let cabinet: Cabinet;
  try {
    cabinet = asJson<Cabinet>(await getCabinet(projectId, cabinetId));
  } catch (error) {
    if (error instanceof NotFoundError) notFound();
    throw error;
  }
  return <CabinetWorkspace projectId={projectId} cabinet={cabinet} canWrite={canWrite} />;
}
