'use client';

import { Archive, ChevronRight, Pencil } from 'lucide-react';
import { toast } from 'sonner';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';

import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { PageHeader } from '@/components/ui/page-header';
import { ArchivedBadge } from '@/components/ui/status-badge';
import { When } from '@/components/ui/when';
import { errorMessage } from '@/lib/api/client';
import { can } from '@/lib/auth/permissions';
import type { SiteSummary } from '@/lib/sites/types';
import type { Role } from '@/lib/domain';

import { useRestoreSite } from '../api/use-site-mutations';
import { useSite } from '../api/use-sites';
import { DeleteSiteDialog } from './delete-site-dialog';
import { SiteFormDialog } from './site-form';

type SiteDetailsProps = {
  /** The site as the server page read it; kept fresh on the client afterwards. */
  site: SiteSummary;
  role: Role;
};

/** A site's heading: name, client, address and board count; edit and delete for editors. */
export function SiteDetails({ site: initial, role }: SiteDetailsProps) {
  const router = useRouter();
  const canEdit = can(role, 'boards.edit');
  const query = useSite(initial.id, initial);
  const [editing, setEditing] = useState(false);
  const [deleting, setDeleting] = useState(false);
  const site = query.data ?? initial;

  return (
    <>
      <PageHeader
        eyebrow={
          <Link href="/sites" className="inline-flex items-center gap-1 hover:text-ink">
            Sites <ChevronRight aria-hidden className="h-3.5 w-3.5" />
          </Link>
        }
        title={site.name}
        description={site.archived ? <SiteArchived site={site} canRestore={can(role, 'records.archive')} /> : undefined}
        actions={
          canEdit && !site.archived ? (
            <>
              <Button variant="secondary" onClick={() => setEditing(true)}>
                <Pencil aria-hidden className="h-4 w-4" />
                Edit site
              </Button>
              <Button variant="quiet" onClick={() => setDeleting(true)} className="hover:text-verdict-fail">
                <Archive aria-hidden className="h-4 w-4" />
                Archive
              </Button>
            </>
          ) : null
        }
      />
      {query.isError ? (
        <ErrorState
          className="mb-6"
          title="This site could not be refreshed"
          message={query.error.message}
          onRetry={() => void query.refetch()}
          retrying={query.isFetching}
        />
      ) : null}
      <dl className="mb-8 grid gap-x-8 gap-y-4 rounded-card border border-line bg-paper-raised px-5 py-4 text-sm sm:grid-cols-2 lg:grid-cols-4">
        <Detail term="Client">{site.client || <span className="text-ink-faint">Not recorded</span>}</Detail>
        <Detail term="Address">{site.address || <span className="text-ink-faint">Not recorded</span>}</Detail>
        <Detail term="Boards">{site.boardCount}</Detail>
        <Detail term="Last change">
          <When iso={site.updatedAt} />
        </Detail>
      </dl>
      {canEdit ? (
        <>
          <SiteFormDialog open={editing} site={site} onClose={() => setEditing(false)} />
          <DeleteSiteDialog
            site={deleting ? site : null}
            onClose={() => setDeleting(false)}
            onDeleted={() => router.push('/sites')}
          />
        </>
      ) : null}
    </>
  );
}

function Detail({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-semibold tracking-wide text-ink-soft uppercase">{term}</dt>
      <dd className="mt-1 break-words text-ink">{children}</dd>
    </div>
  );
}

/** An archived site's state, and the admin's way back. */
function SiteArchived({ site, canRestore }: { site: SiteSummary; canRestore: boolean }) {
  const restore = useRestoreSite();
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <ArchivedBadge />
      <span>
        Archived by {site.archived!.byName} on {new Date(site.archived!.at).toLocaleDateString('en-GB')}: read-only,
        kept whole.
      </span>
      {canRestore ? (
        <Button
          size="sm"
          variant="secondary"
          disabled={restore.isPending}
          onClick={() =>
            restore.mutate(site.id, {
              onSuccess: () => toast.success(`Restored ${site.name} and its boards.`),
              onError: (err) => toast.error(errorMessage(err)),
            })
          }
        >
          Restore
        </Button>
      ) : null}
    </span>
  );
}
