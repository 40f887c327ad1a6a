import type { Metadata } from 'next';
import { redirect } from 'next/navigation';

import { getActor } from '@/lib/auth/session';

import { SignInForm } from './_components/sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

export default async function LoginPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  if (await getActor()) redirect('/boards');
  const { callbackUrl } = await searchParams;
  const next = callbackUrl?.startsWith('/') && !callbackUrl.startsWith('//') ? callbackUrl : '/boards';
  return (
    <main className="grid min-h-screen place-items-center px-4 py-10">
      <div className="w-full max-w-sm">
        <div className="mb-8 flex items-center gap-3">
          <BoardMark />
          <div>
            <h1 className="text-xl font-semibold tracking-tight">Boardwright</h1>
            <p className="text-sm text-ink-soft">Distribution boards, designed and checked.</p>
          </div>
        </div>
        <div className="rounded-card border border-line bg-paper-raised p-6 shadow-sm">
          <h2 className="mb-4 text-base font-semibold">Sign in</h2>
          <SignInForm next={next} />
        </div>
        <p className="mt-6 text-xs leading-relaxed text-ink-faint">
          New to the team? Your admin sends you an invitation by e-mail with a link to choose a password.
        </p>
      </div>
    </main>
  );
}

function BoardMark() {
  return (
    <svg width="40" height="40" viewBox="0 0 40 40" aria-hidden="true">
      <rect x="2" y="4" width="36" height="32" rx="5" fill="#1f2a37" />
      <rect x="6" y="18" width="28" height="4" fill="#9aa3ad" />
      {[8, 14, 20, 26].map((x) => (
        <rect key={x} x={x} y="11" width="5" height="18" rx="1" fill="#f7f5f0" />
      ))}
      <rect x="26" y="11" width="5" height="18" rx="1" fill="#b5652b" />
    </svg>
  );
}
