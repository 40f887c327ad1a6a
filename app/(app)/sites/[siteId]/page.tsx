import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { z } from 'zod';

import { BoardsView } from '@/features/boards/components/boards-view';
import { SiteView } from '@/features/site-view/components/site-view';
import { SiteDetails } from '@/features/sites/components/site-details';
import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';
import { getSite } from '@/lib/dal/sites';
import { HttpError } from '@/lib/errors';

type Props = { params: Promise<{ siteId: string }> };

export const metadata: Metadata = { title: 'Site' };

export default async function SitePage({ params }: Props) {
  // A junk id is simply not found
  const { siteId } = await params;
  if (!z.uuid().safeParse(siteId).success) notFound();
  // Session; the layout has already sent signed-out visitors away
  const actor = await getActor();
  if (!actor) redirect('/login');
  // Read the site through the DAL, scoped to the organisation
  const site = await getSite(actor, siteId).catch((err: unknown) => {
    if (err instanceof HttpError && err.status === 404) notFound();
    throw err;
  });
  return (
    <>
      <SiteDetails site={site} role={actor.role} />
      <SiteView
        siteId={site.id}
        siteName={site.name}
        canLink={can(actor.role, 'boards.edit') && !site.archived}
        canPrint={can(actor.role, 'schedule.print-draft')}
      />
      <BoardsView role={actor.role} siteId={site.id} />
    </>
  );
}
