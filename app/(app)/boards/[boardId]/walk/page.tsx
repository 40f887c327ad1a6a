import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { z } from 'zod';

import { EmptyState } from '@/components/ui/empty-state';
import { LabelWalk } from '@/features/label-walk/components/label-walk';
import { withStripTexts } from '@/features/schedule/utils/strip-texts';
import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';
import { isIssued } from '@/lib/boards/lifecycle';
import { getWalk } from '@/lib/dal/label-walk';
import { HttpError } from '@/lib/errors';

export const metadata = { title: 'Label walk' };

/** The label walk of one board, built for a phone. */
export default async function WalkPage({ params }: { params: Promise<{ boardId: string }> }) {
  const { boardId } = await params;
  const actor = await getActor();
  if (!actor) redirect('/login');
  if (!z.uuid().safeParse(boardId).success) notFound();
  const walk = await getWalk(actor, boardId).catch((err: unknown) => {
    if (err instanceof HttpError && err.status === 404) notFound();
    throw err;
  });
  if (!isIssued(walk.status)) {
    return (
      <EmptyState
        title="The label walk opens once the board is issued"
        action={
          <Link href={`/boards/${boardId}`} className="text-sm font-medium text-copper-dark hover:underline">
            Back to {walk.name}
          </Link>
        }
      >
        {walk.name} is {walk.status === 'draft' ? 'a draft' : 'in review'}; labels are checked against an issued
        schedule.
      </EmptyState>
    );
  }
  return <LabelWalk initial={await withStripTexts(walk)} canRecord={can(actor.role, 'walk.record')} />;
}
