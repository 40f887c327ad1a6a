'use client';

import { UserCheck, UserX } from 'lucide-react';
import { useState } from 'react';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Select } from '@/components/ui/field';
import { When } from '@/components/ui/when';
import { errorMessage } from '@/lib/api/client';
import { cn } from '@/lib/cn';
import type { Member } from '@/lib/members/types';
import type { Role } from '@/lib/domain';

import { useUpdateMember } from '../api/use-members';
import { ROLE_CHOICES, roleLabel } from '../utils/roles';

const th = 'h-11 px-4 text-left text-xs font-semibold tracking-wide whitespace-nowrap text-ink-soft uppercase';
const td = 'h-14 px-4 align-middle text-sm text-ink';

type MembersTableProps = {
  members: Member[];
  /** The signed-in admin, whose own role and access cannot be taken away here. */
  currentUserId: string;
};

/** The organisation's members: change a role, deactivate or reactivate. */
export function MembersTable({ members, currentUserId }: MembersTableProps) {
  const update = useUpdateMember();
  const [deactivating, setDeactivating] = useState<Member | null>(null);
  const [confirmError, setConfirmError] = useState<string | null>(null);
  const busyId = update.isPending ? update.variables?.userId : undefined;

  async function changeRole(member: Member, role: Role) {
    try {
      await update.mutateAsync({ userId: member.id, input: { role } });
      toast.success(`${member.name} is now ${roleLabel(role).toLowerCase()}.`);
    } catch (err) {
      toast.error(errorMessage(err));
    }
  }

  async function reactivate(member: Member) {
    try {
      await update.mutateAsync({ userId: member.id, input: { active: true } });
      toast.success(`${member.name} can sign in again.`);
    } catch (err) {
      toast.error(errorMessage(err));
    }
  }

  async function confirmDeactivate() {
    if (!deactivating) return;
    setConfirmError(null);
    try {
      await update.mutateAsync({ userId: deactivating.id, input: { active: false } });
      toast.success(`${deactivating.name} can no longer sign in.`);
      setDeactivating(null);
    } catch (err) {
      setConfirmError(errorMessage(err));
    }
  }

  return (
    <>
      <div className="relative overflow-x-auto rounded-card border border-line bg-paper-raised">
        <table className="w-full border-collapse">
          <caption className="sr-only">Members</caption>
          <thead className="bg-paper-sunk/60">
            <tr className="border-b border-line">
              <th scope="col" className={th}>
                Name
              </th>
              <th scope="col" className={th}>
                E-mail
              </th>
              <th scope="col" className={th}>
                Role
              </th>
              <th scope="col" className={th}>
                Access
              </th>
              <th scope="col" className={th}>
                Member since
              </th>
              <th scope="col" className={cn(th, 'text-right')}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {members.map((member) => {
              const self = member.id === currentUserId;
              const busy = busyId === member.id;
              return (
                <tr
                  key={member.id}
                  className={cn('border-b border-line last:border-0', !member.active && 'bg-paper/60')}
                >
                  <td className={cn(td, 'font-medium')}>
                    {member.name}
                    {self ? <span className="ml-2 text-xs font-normal text-ink-faint">(you)</span> : null}
                  </td>
                  <td className={cn(td, 'text-ink-soft')}>{member.email}</td>
                  <td className={td}>
                    {self ? (
                      roleLabel(member.role)
                    ) : (
                      <Select
                        aria-label={`Role of ${member.name}`}
                        className="h-9 w-40"
                        value={member.role}
                        disabled={busy || !member.active}
                        onChange={(event) => void changeRole(member, event.target.value as Role)}
                      >
                        {ROLE_CHOICES.map((r) => (
                          <option key={r.value} value={r.value}>
                            {r.label}
                          </option>
                        ))}
                      </Select>
                    )}
                  </td>
                  <td className={td}>
                    {member.active ? (
                      <span className="inline-flex items-center gap-1.5 text-verdict-pass">
                        <UserCheck aria-hidden className="h-4 w-4" /> Active
                      </span>
                    ) : (
                      <span className="inline-flex items-center gap-1.5 text-ink-soft">
                        <UserX aria-hidden className="h-4 w-4" /> Deactivated
                      </span>
                    )}
                  </td>
                  <td className={cn(td, 'text-ink-soft')}>
                    <When iso={member.createdAt} />
                  </td>
                  <td className={cn(td, 'text-right')}>
                    {self ? null : member.active ? (
                      <Button
                        variant="quiet"
                        size="sm"
                        disabled={busy}
                        onClick={() => setDeactivating(member)}
                        aria-label={`Deactivate ${member.name}`}
                        className="hover:text-verdict-fail"
                      >
                        Deactivate
                      </Button>
                    ) : (
                      <Button
                        variant="secondary"
                        size="sm"
                        disabled={busy}
                        onClick={() => void reactivate(member)}
                        aria-label={`Reactivate ${member.name}`}
                      >
                        Reactivate
                      </Button>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <ConfirmDialog
        open={deactivating !== null}
        title="Deactivate this member?"
        confirmLabel="Deactivate"
        pending={update.isPending}
        error={confirmError}
        onConfirm={() => void confirmDeactivate()}
        onClose={() => {
          setConfirmError(null);
          setDeactivating(null);
        }}
      >
        <p>
          <strong>{deactivating?.name}</strong> will be signed out on their next request and cannot sign in until
          reactivated. Their boards, reviews and records stay.
        </p>
      </ConfirmDialog>
    </>
  );
}

/** Invitations sent but not yet taken up. */
export function PendingInvitations({ invitations }: { invitations: Member[] }) {
  return (
    <div className="relative overflow-x-auto rounded-card border border-line bg-paper-raised">
      <table className="w-full border-collapse">
        <caption className="sr-only">Invitations waiting to be accepted</caption>
        <thead className="bg-paper-sunk/60">
          <tr className="border-b border-line">
            <th scope="col" className={th}>
              Name
            </th>
            <th scope="col" className={th}>
              E-mail
            </th>
            <th scope="col" className={th}>
              Role
            </th>
            <th scope="col" className={th}>
              Invited
            </th>
          </tr>
        </thead>
        <tbody>
          {invitations.map((invitation) => (
            <tr key={invitation.id} className="border-b border-line last:border-0">
              <td className={cn(td, 'font-medium')}>{invitation.name}</td>
              <td className={cn(td, 'text-ink-soft')}>{invitation.email}</td>
              <td className={td}>{roleLabel(invitation.role)}</td>
              <td className={cn(td, 'text-ink-soft')}>
                <When iso={invitation.createdAt} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
