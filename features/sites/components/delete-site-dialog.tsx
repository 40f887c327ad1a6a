'use client';

import { useState } from 'react';
import { toast } from 'sonner';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { errorMessage } from '@/lib/api/client';
import type { SiteSummary } from '@/lib/sites/types';

import { useDeleteSite } from '../api/use-site-mutations';

type DeleteSiteDialogProps = {
  site: SiteSummary | null;
  onClose: () => void;
  onDeleted?: (site: SiteSummary) => void;
};

/** Asks before archiving a site, saying how many boards go with it (nothing is deleted). */
export function DeleteSiteDialog({ site, onClose, onDeleted }: DeleteSiteDialogProps) {
  const remove = useDeleteSite();
  const [error, setError] = useState<string | null>(null);

  function close() {
    setError(null);
    onClose();
  }

  async function confirm() {
    if (!site) return;
    setError(null);
    try {
      await remove.mutateAsync(site.id);
      toast.success(`Archived ${site.name}. An admin can restore it.`);
      onDeleted?.(site);
      close();
    } catch (err) {
      setError(errorMessage(err));
    }
  }

  const boards = site?.boardCount ?? 0;
  return (
    <ConfirmDialog
      open={site !== null}
      title="Archive this site?"
      confirmLabel="Archive site"
      pending={remove.isPending}
      error={error}
      danger={false}
      onConfirm={confirm}
      onClose={close}
    >
      <p>
        <strong>{site?.name}</strong>
        {boards === 0
          ? ' and its deleted drafts leave the lists.'
          : ` and its ${boards === 1 ? 'board' : `${boards} boards`} leave the lists and become read-only.`}{' '}
        Nothing is deleted: revisions, schedules, comments, label checks and photos stay readable, and an admin can
        restore the site. A site holding an issued board can only be archived by an admin.
      </p>
    </ConfirmDialog>
  );
}
