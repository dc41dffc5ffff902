'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { cn } from '@/lib/utils';

export interface ProjectNavItem {
  href: string;
  label: string;
}

/** The project's sections, already filtered on the server to what this role may use. */
export function ProjectNav({ items }: { items: ProjectNavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Project sections" className="flex flex-wrap gap-1">
      {items.map((item) => {
        const exact = item.href.split('/').length <= 3;
        const active = exact ? pathname === item.href : pathname.startsWith(item.href);
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? 'page' : undefined}
            className={cn(
              'border-b-2 px-3 py-2 text-sm font-medium',
              active ? 'border-accent text-ink' : 'border-transparent text-muted hover:text-ink',
            )}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
