import { redirect } from 'next/navigation';
import type { ReactNode } from 'react';
import { QueryProvider } from '@/components/providers/query-provider';
import { TopBar } from '@/components/shell/top-bar';
import { getSignedInUser } from '@/lib/data/membership';

export default async function AppLayout({ children }: { children: ReactNode }) {
  const user = await getSignedInUser();
  if (!user) redirect('/sign-in');
  return (
    <div className="min-h-screen">
      <TopBar userName={user.name} isAdmin={user.isAdmin} />
      <QueryProvider>{children}</QueryProvider>
    </div>
  );
}
