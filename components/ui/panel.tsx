import type { HTMLAttributes, ReactNode } from 'react';
import { cn } from '@/lib/utils';

export function Panel({ className, ...props }: HTMLAttributes<HTMLElement>) {
  return (
    <section className={cn('rounded-sm border border-line bg-panel p-5', className)} {...props} />
  );
}

export function PanelTitle({ children, aside }: { children: ReactNode; aside?: ReactNode }) {
  return (
    <div className="mb-3 flex items-baseline justify-between gap-4 border-b border-line pb-2">
      <h2 className="text-sm font-semibold tracking-wide text-ink uppercase">{children}</h2>
      {aside}
    </div>
  );
}
