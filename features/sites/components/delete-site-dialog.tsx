'use client';

import { useState } from 'react';
import { toast } from 'sonner';

import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { errorMessage } from '@/lib/api/client';
import type { SiteSummary } from '@/lib/dal/sites';

import { useDeleteSite } from '../api/use-site-mutations';

type DeleteSiteDialogProps = {
  site: SiteSummary | null;
  onClose: () => void;
  onDeleted?: (site: SiteSummary) => void;
};

/** Asks before deleting a site, saying how many boards go with it. */
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
      toast.success(`Deleted ${site.name}.`);
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
      title="Delete this site?"
      confirmLabel="Delete site"
      pending={remove.isPending}
      error={error}
      onConfirm={confirm}
      onClose={close}
    >
      <p>
        <strong>{site?.name}</strong> will be deleted
        {boards === 0
          ? '. It has no boards.'
          : ` with its ${boards === 1 ? 'board' : `${boards} boards`} and all their revisions.`}
        {' '}
        This cannot be undone.
      </p>
    </ConfirmDialog>
  );
}
