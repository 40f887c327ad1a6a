import type { Metadata } from 'next';
import Link from 'next/link';

import { AcceptInviteForm } from '@/features/members/components/accept-invite-form';
import { roleLabel } from '@/features/members/utils/roles';
import { findOpenInvitation } from '@/lib/dal/members';

export const metadata: Metadata = {
  title: 'Join your team',
  robots: { index: false, follow: false },
  referrer: 'no-referrer',
};

type Props = { params: Promise<{ token: string }> };

export default async function InvitePage({ params }: Props) {
  // The token is the only credential here; a malformed one is treated like a used one
  const { token } = await params;
  const wellFormed = /^[A-Za-z0-9_-]{20,200}$/.test(token);
  // Look the invitation up; if the database is away, say so rather than fail the page
  let invitation: Awaited<ReturnType<typeof findOpenInvitation>> = null;
  let unavailable = false;
  try {
    invitation = wellFormed ? await findOpenInvitation(token) : null;
  } catch (err) {
    console.error('[invite] could not look up the invitation', err);
    unavailable = true;
  }

  return (
    <main className="grid min-h-screen place-items-center px-4 py-10">
      <div className="w-full max-w-md">
        <div className="mb-8 flex items-center gap-3">
          <span aria-hidden className="inline-block h-6 w-6 rounded-sm bg-copper" />
          <p className="text-xl font-semibold tracking-tight">Boardwright</p>
        </div>
        <div className="rounded-card border border-line bg-paper-raised p-6 shadow-sm">
          {unavailable ? (
            <>
              <h1 className="text-base font-semibold">This link cannot be checked just now</h1>
              <p role="alert" className="mt-2 text-sm leading-relaxed text-ink-soft">
                Boardwright cannot reach its database at the moment. Nothing has been used up: reload this page in a
                minute or two.
              </p>
            </>
          ) : invitation ? (
            <>
              <h1 className="text-base font-semibold">Welcome, {invitation.name}</h1>
              <p className="mt-1 mb-5 text-sm text-ink-soft">
                Choose a password to join your team. You will sign in with this e-mail address.
              </p>
              <dl className="mb-6 grid grid-cols-[6rem_1fr] gap-y-2 text-sm">
                <dt className="text-ink-soft">Name</dt>
                <dd className="text-ink">{invitation.name}</dd>
                <dt className="text-ink-soft">E-mail</dt>
                <dd className="break-all text-ink">{invitation.email}</dd>
                <dt className="text-ink-soft">Role</dt>
                <dd className="text-ink">{roleLabel(invitation.role)}</dd>
              </dl>
              <AcceptInviteForm token={token} email={invitation.email} />
            </>
          ) : (
            <>
              <h1 className="text-base font-semibold">This invitation link no longer works</h1>
              <p className="mt-2 text-sm leading-relaxed text-ink-soft">
                It has been used already, it has expired (links last seven days), or it was copied incompletely. Ask
                your admin to send a new invitation.
              </p>
              <p className="mt-4 text-sm">
                Already set your password?{' '}
                <Link href="/login" className="font-medium text-ink underline underline-offset-4">
                  Sign in
                </Link>
              </p>
            </>
          )}
        </div>
      </div>
    </main>
  );
}
