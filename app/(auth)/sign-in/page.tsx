import type { Metadata } from 'next';
import { Suspense } from 'react';
import { SignInForm } from '@/components/auth/sign-in-form';
import { Wordmark } from '@/components/shell/wordmark';

export const metadata: Metadata = { title: 'Sign in' };

export default function SignInPage() {
  return (
    <main className="grid min-h-screen md:grid-cols-[1fr_minmax(360px,440px)]">
      <section className="hidden flex-col justify-between bg-rail p-10 text-accent-ink md:flex">
        <Wordmark className="text-xl" />
        <div className="max-w-md space-y-3">
          <p className="text-2xl leading-snug font-semibold">
            Find the wrong landing before the panel is energised.
          </p>
          <p className="text-sm opacity-80">
            Terminal schedules, fault exposure, protection stress and a signed review — from the
            design office to the cabinet door.
          </p>
        </div>
        <p className="text-xs opacity-70">
          Results support engineering judgement and defer to local electrical codes.
        </p>
      </section>
      <section className="flex items-center justify-center p-8">
        <div className="w-full max-w-sm space-y-6">
          <div className="md:hidden">
            <Wordmark className="text-xl" />
          </div>
          <h1 className="text-xl font-semibold">Sign in</h1>
          <Suspense>
            <SignInForm />
          </Suspense>
        </div>
      </section>
    </main>
  );
}
