import Link from 'next/link';
import { SignOutButton } from './sign-out-button';
import { Wordmark } from './wordmark';

export function TopBar({ userName, isAdmin }: { userName: string; isAdmin: boolean }) {
  return (
    <header className="border-b-4 border-accent bg-rail text-accent-ink">
      <div className="mx-auto flex h-14 max-w-7xl items-center justify-between gap-4 px-4">
        <Link href="/projects" className="text-lg">
          <Wordmark />
        </Link>
        <nav aria-label="Account" className="flex items-center gap-3 text-sm">
          <Link href="/projects" className="hover:underline">
            Projects
          </Link>
          <span aria-hidden className="opacity-40">
            |
          </span>
          <span>
            {userName}
            {isAdmin ? (
              <span className="ml-2 rounded-sm bg-white/15 px-1.5 py-0.5 text-xs">admin</span>
            ) : null}
          </span>
          <SignOutButton />
        </nav>
      </div>
    </header>
  );
}
