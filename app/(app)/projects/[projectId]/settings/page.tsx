import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { SettingsForm } from '@/components/settings/settings-form';
import { Caution } from '@/components/ui/caution';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { can } from '@/lib/auth/permissions';
import { getSignedInUser, loadStanding } from '@/lib/data/membership';
import { getProjectSettings } from '@/lib/data/project-settings';

export const metadata: Metadata = { title: 'Assumptions' };

export default async function SettingsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const projectId = Number((await params).projectId);
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  const standing = await loadStanding(user, projectId);
  if (!standing) notFound();
  const settings = await getProjectSettings(projectId);

  return (
    <div className="space-y-6">
      <Panel>
        <PanelTitle>Audit assumptions</PanelTitle>
        <p className="mb-4 max-w-3xl text-sm text-muted">
          Every audit of this project takes these as given: the worst supply voltage a mis-wire can
          apply, the transient levels to withstand, and how hard parts may be worked. They are
          printed on every report and handover pack.
        </p>
        <SettingsForm
          projectId={projectId}
          initial={settings}
          canEdit={can(standing, 'settings:write')}
        />
      </Panel>
      <Caution>
        These defaults follow the cited standards and common practice. Local electrical codes, the
        supply authority&apos;s declared tolerance and the equipment&apos;s own test levels take
        precedence; a qualified, licensed person decides which apply.
      </Caution>
    </div>
  );
}
