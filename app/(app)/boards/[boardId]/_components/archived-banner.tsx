'use client';

import { useMutation } from '@tanstack/react-query';
import { Archive } from 'lucide-react';
import { useRouter } from 'next/navigation';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { apiFetch, errorMessage } from '@/lib/api/client';
import type { ArchiveState } from '@/lib/boards/review-types';

type Props = {
  boardId: string;
  siteId: string;
  state: NonNullable<ArchiveState>;
  /** Admins may restore. */
  canRestore: boolean;
};

/** Every page of an archived board says so, and an admin can bring it back from there. */
export function ArchivedBanner({ boardId, siteId, state, canRestore }: Props) {
  const router = useRouter();
  const restore = useMutation({
    mutationFn: () =>
      apiFetch(state.through === 'site' ? `/api/sites/${siteId}/restore` : `/api/boards/${boardId}/restore`, {
        method: 'POST',
      }),
    onSuccess: () => {
      toast.success(state.through === 'site' ? 'The site and its boards are restored.' : 'The board is restored.');
      router.refresh();
    },
    onError: (err) => toast.error(errorMessage(err)),
  });
  const when = new Date(state.at).toLocaleDateString('en-GB');
  return (
    <div
      role="status"
      data-testid="archived-banner"
      className="flex flex-wrap items-center justify-between gap-3 rounded-card border border-dashed border-ink/40 bg-paper-sunk px-4 py-3 text-sm text-ink"
    >
      <p className="flex items-center gap-2">
        <Archive aria-hidden className="h-4 w-4" />
        <span>
          <strong>Archived</strong>
          {state.through === 'site' ? ' with its site' : ''} by {state.byName} on {when}. It is read-only and kept
          whole: revisions, schedules, comments, label checks and photos stay readable.
        </span>
      </p>
      {canRestore ? (
        <Button size="sm" variant="secondary" onClick={() => restore.mutate()} disabled={restore.isPending}>
          {restore.isPending ? 'Restoring…' : state.through === 'site' ? 'Restore the site' : 'Restore the board'}
        </Button>
      ) : null}
    </div>
  );
}
