'use client';

import { signOut } from 'next-auth/react';
import { Button } from '@/components/ui/button';

export function SignOutButton() {
  return (
    <Button
      variant="ghost"
      size="sm"
      className="text-accent-ink hover:bg-white/10"
      onClick={() => signOut({ callbackUrl: '/sign-in' })}
    >
      Sign out
    </Button>
  );
}
