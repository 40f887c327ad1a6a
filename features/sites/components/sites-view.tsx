'use client';

import { Building2, Plus } from 'lucide-react';
import { useCallback, useState } from 'react';
import { toast } from 'sonner';

import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { can } from '@/lib/auth/permissions';
import type { SiteSummary } from '@/lib/sites/types';
import type { Role } from '@/lib/domain';
import { errorMessage } from '@/lib/api/client';

import { useRestoreSite } from '../api/use-site-mutations';
import { useSites } from '../api/use-sites';
import { DeleteSiteDialog } from './delete-site-dialog';
import { SiteFormDialog } from './site-form';
import { SitesTable } from './sites-table';

/** The sites screen: the list with its loading, empty and error states, and the site dialogs. */
export function SitesView({ role }: { role: Role }) {
  const canEdit = can(role, 'boards.edit');
  const canArchive = can(role, 'records.archive');
  const [showArchived, setShowArchived] = useState(false);
  const sites = useSites(showArchived);
  const restore = useRestoreSite();
  const [creating, setCreating] = useState(false);
  const [editing, setEditing] = useState<SiteSummary | null>(null);
  const [deleting, setDeleting] = useState<SiteSummary | null>(null);
  const onRename = useCallback((site: SiteSummary) => setEditing(site), []);
  const onDelete = useCallback(
    (site: SiteSummary) => {
      if (!site.archived) return setDeleting(site);
      restore.mutate(site.id, {
        onSuccess: () => toast.success(`Restored ${site.name} and its boards.`),
        onError: (err) => toast.error(errorMessage(err)),
      });
    },
    [restore],
  );
  const removeLabelOf = useCallback(
    (site: SiteSummary) => (site.archived ? (canArchive ? 'Restore' : null) : 'Archive'),
    [canArchive],
  );

  const createButton = canEdit ? (
    <Button onClick={() => setCreating(true)}>
      <Plus aria-hidden className="h-4 w-4" />
      New site
    </Button>
  ) : null;

  let body: React.ReactNode;
  if (sites.isError) {
    body = (
      <ErrorState
        title="The sites could not be loaded"
        message={sites.error.message}
        onRetry={() => void sites.refetch()}
        retrying={sites.isFetching}
      />
    );
  } else if (sites.isSuccess && sites.data.length === 0) {
    body = (
      <EmptyState
        icon={<Building2 aria-hidden className="h-8 w-8" />}
        title={showArchived ? 'No archived sites' : 'No sites yet'}
        action={showArchived ? null : createButton}
      >
        {showArchived
          ? 'Archived sites are listed here; an admin can restore them.'
          : canEdit
            ? 'A site is a building or installation; its boards live under it. Add the first one.'
            : 'When a designer adds a site it appears here.'}
      </EmptyState>
    );
  } else {
    body = (
      <SitesTable
        sites={sites.data ?? []}
        loading={sites.isPending}
        canEdit={canEdit}
        onRename={onRename}
        onDelete={onDelete}
        removeLabelOf={removeLabelOf}
      />
    );
  }

  return (
    <>
      <PageHeader
        title="Sites"
        description="Buildings and installations, each with its boards."
        actions={
          <>
            <label className="inline-flex items-center gap-2 text-sm text-ink-soft">
              <input type="checkbox" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
              Show archived
            </label>
            {sites.isSuccess && sites.data.length > 0 && !showArchived ? createButton : null}
          </>
        }
      />
      {body}
      {canEdit ? (
        <>
          <SiteFormDialog open={creating} onClose={() => setCreating(false)} />
          <SiteFormDialog open={editing !== null} site={editing} onClose={() => setEditing(null)} />
          <DeleteSiteDialog site={deleting} onClose={() => setDeleting(null)} />
        </>
      ) : null}
    </>
  );
}
