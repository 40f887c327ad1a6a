import type { Metadata } from 'next';
import { redirect } from 'next/navigation';

import { EmptyState } from '@/components/ui/empty-state';
import { MembersView } from '@/features/members/components/members-view';
import { SelfIssueSetting } from '@/features/organisation/components/self-issue-setting';
import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';
import { getOrganisationSettings } from '@/lib/dal/organisation';

export const metadata: Metadata = { title: 'Members' };

export default async function MembersPage() {
  // Session and role: only admins manage members (the API refuses everyone else too)
  const actor = await getActor();
  if (!actor) redirect('/login');
  if (!can(actor.role, 'members.manage')) {
    return (
      <EmptyState title="Members are managed by admins">
        Your role may not manage members. Ask an admin of your organisation to invite someone or change a role.
      </EmptyState>
    );
  }
  return (
    <>
      <MembersView currentUserId={actor.userId} />
      {can(actor.role, 'organisation.manage') ? (
        <SelfIssueSetting initial={await getOrganisationSettings(actor)} />
      ) : null}
    </>
  );
}
