'use client';

import type { ColumnDef } from '@tanstack/react-table';
import { UserCheck, UserX } from 'lucide-react';
import { useState } from 'react';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { byText, DataTable, useSortableTable } from '@/components/ui/data-table';
import { Select } from '@/components/ui/field';
import { When } from '@/components/ui/when';
import { errorMessage } from '@/lib/api/client';
import type { Member } from '@/lib/members/types';
import type { Role } from '@/lib/domain';

import { useUpdateMember } from '../api/use-members';
import { ROLE_CHOICES, roleLabel } from '../utils/roles';

type MembersTableProps = {
  members: Member[];
  /** The signed-in admin, whose own role and access cannot be taken away here. */
  currentUserId: string;
};

/** The organisation's members: change a role, deactivate or reactivate; a card per member on a phone. */
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

  const columns: ColumnDef<Member>[] = [
    nameColumn((m) =>
      m.id === currentUserId ? <span className="ml-2 text-xs font-normal text-ink-faint">(you)</span> : null,
    ),
    emailColumn,
    {
      id: 'role',
      accessorFn: (m) => roleLabel(m.role),
      header: 'Role',
      sortingFn: byText,
      cell: ({ row: { original: member } }) =>
        member.id === currentUserId ? (
          roleLabel(member.role)
        ) : (
          <Select
            aria-label={`Role of ${member.name}`}
            className="h-9 w-40"
            value={member.role}
            disabled={busyId === member.id || !member.active}
            onChange={(event) => void changeRole(member, event.target.value as Role)}
          >
            {ROLE_CHOICES.map((r) => (
              <option key={r.value} value={r.value}>
                {r.label}
              </option>
            ))}
          </Select>
        ),
    },
    {
      id: 'access',
      accessorFn: (m) => (m.active ? 'Active' : 'Deactivated'),
      header: 'Access',
      meta: { card: 'badge' },
      cell: ({ row: { original: member } }) =>
        member.active ? (
          <span className="inline-flex items-center gap-1.5 text-sm text-verdict-pass">
            <UserCheck aria-hidden className="h-4 w-4" /> Active
          </span>
        ) : (
          <span className="inline-flex items-center gap-1.5 text-sm text-ink-soft">
            <UserX aria-hidden className="h-4 w-4" /> Deactivated
          </span>
        ),
    },
    sinceColumn('Member since'),
    {
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      enableSorting: false,
      meta: { align: 'right', card: 'actions' },
      cell: ({ row: { original: member } }) => {
        const busy = busyId === member.id;
        if (member.id === currentUserId) return null;
        return member.active ? (
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
        );
      },
    },
  ];
  const table = useSortableTable(members, columns);

  return (
    <>
      <DataTable table={table} caption="Members" phoneCards />
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

/** Invitations sent but not yet taken up; a card per invitation on a phone. */
export function PendingInvitations({ invitations }: { invitations: Member[] }) {
  const table = useSortableTable(invitations, [
    nameColumn(() => null),
    emailColumn,
    { id: 'role', accessorFn: (m) => roleLabel(m.role), header: 'Role', sortingFn: byText },
    sinceColumn('Invited'),
  ]);
  return <DataTable table={table} caption="Invitations waiting to be accepted" phoneCards />;
}

/** The person's name (the card's title), with what `after` adds beside it. */
function nameColumn(after: (m: Member) => React.ReactNode): ColumnDef<Member> {
  return {
    id: 'name',
    accessorKey: 'name',
    header: 'Name',
    sortingFn: byText,
    meta: { card: 'title' },
    cell: ({ row: { original: m } }) => (
      <span className="font-medium">
        {m.name}
        {after(m)}
      </span>
    ),
  };
}

const emailColumn: ColumnDef<Member> = {
  id: 'email',
  accessorKey: 'email',
  header: 'E-mail',
  sortingFn: byText,
  meta: { card: 'sub' },
  cell: ({ getValue }) => <span className="break-all text-ink-soft">{getValue<string>()}</span>,
};

/** When the member joined or was invited (`createdAt`), newest first when sorted. */
function sinceColumn(header: string): ColumnDef<Member> {
  return {
    id: 'createdAt',
    accessorKey: 'createdAt',
    header,
    sortDescFirst: true,
    cell: ({ row }) => (
      <span className="text-ink-soft">
        <When iso={row.original.createdAt} />
      </span>
    ),
  };
}
