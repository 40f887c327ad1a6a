'use client';

import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';

import { useMembers } from '../api/use-members';
import { InviteForm } from './invite-form';
import { MembersTable, PendingInvitations } from './members-table';

/** The members screen (admins): invite, the member list and the open invitations. */
export function MembersView({ currentUserId }: { currentUserId: string }) {
  const members = useMembers();
  const people = members.data?.filter((m) => !m.pending) ?? [];
  const invitations = members.data?.filter((m) => m.pending) ?? [];

  return (
    <>
      <PageHeader title="Members" description="Who can sign in to the organisation, and what each role may do." />
      <div className="flex flex-col gap-8">
        <InviteForm />
        {members.isError ? (
          <ErrorState
            title="The members could not be loaded"
            message={members.error.message}
            onRetry={() => void members.refetch()}
            retrying={members.isFetching}
          />
        ) : members.isPending ? (
          <p role="status" className="text-sm text-ink-soft">
            Loading the members…
          </p>
        ) : (
          <>
            <section aria-labelledby="members-heading" className="flex flex-col gap-3">
              <h2 id="members-heading" className="text-lg font-semibold text-ink">
                Members <span className="text-sm font-normal text-ink-soft">({people.length})</span>
              </h2>
              <MembersTable members={people} currentUserId={currentUserId} />
            </section>
            <section aria-labelledby="invitations-heading" className="flex flex-col gap-3">
              <h2 id="invitations-heading" className="text-lg font-semibold text-ink">
                Waiting for sign-up <span className="text-sm font-normal text-ink-soft">({invitations.length})</span>
              </h2>
              {invitations.length ? (
                <PendingInvitations invitations={invitations} />
              ) : (
                <p className="text-sm text-ink-soft">No invitations are waiting.</p>
              )}
            </section>
          </>
        )}
      </div>
    </>
  );
}
