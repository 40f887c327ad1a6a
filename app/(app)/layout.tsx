import { redirect } from 'next/navigation';

import { AppShell } from '@/components/layout/app-shell';
import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';

import { Providers } from './_components/providers';

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await getActor();
  if (!actor) redirect('/login');
  const links = [
    { href: '/boards', label: 'Boards' },
    { href: '/sites', label: 'Sites' },
    ...(can(actor.role, 'sizing.run') ? [{ href: '/quick-size', label: 'Quick size' }] : []),
    ...(can(actor.role, 'members.manage') ? [{ href: '/members', label: 'Members' }] : []),
    ...(can(actor.role, 'mailbox.read') ? [{ href: '/mailbox', label: 'Outbox' }] : []),
  ];
  return (
    <Providers>
      <AppShell links={links} user={{ name: actor.name, role: actor.role }}>
        {children}
      </AppShell>
    </Providers>
  );
}
