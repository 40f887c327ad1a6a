import type { Metadata } from 'next';
import { redirect } from 'next/navigation';

import { EmptyState } from '@/components/ui/empty-state';
import { MailboxView } from '@/features/mailbox/components/mailbox-view';
import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Development outbox' };

export default async function MailboxPage() {
  // Session and role: the outbox is for admins (the API refuses everyone else too)
  const actor = await getActor();
  if (!actor) redirect('/login');
  if (!can(actor.role, 'mailbox.read')) {
    return <EmptyState title="The outbox is for admins">Your role may not read the development outbox.</EmptyState>;
  }
  return <MailboxView />;
}
