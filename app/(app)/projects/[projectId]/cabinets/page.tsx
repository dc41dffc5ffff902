import type { Metadata } from 'next';
import { CabinetList } from '@/components/schedule/cabinet-list';
import type { Cabinet } from '@/components/schedule/types';
import { listCabinets } from '@/lib/data/schedule/cabinets';
import { asJson, scheduleAccess } from './access';

export const metadata: Metadata = { title: 'Schedule' };

export default async function CabinetsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId, canWrite } = await scheduleAccess((await params).projectId);
  const cabinets = asJson<Cabinet[]>(await listCabinets(projectId));
  return <CabinetList projectId={projectId} canWrite={canWrite} initial={cabinets} />;
}
