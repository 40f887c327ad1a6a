import { notFound, redirect } from 'next/navigation';
import { z } from 'zod';

import { ReviewView } from '@/features/review/components/review-view';
import { can } from '@/lib/auth/permissions';
import { reviewPageData } from '@/lib/boards/review-page-data';
import { getActor } from '@/lib/auth/session';
import { getReviewSource } from '@/lib/dal/review-page';
import { HttpError } from '@/lib/errors';

export const metadata = { title: 'Review' };

/** The inspector's review of one board. */
export default async function ReviewPage({ params }: { params: Promise<{ boardId: string }> }) {
  const { boardId } = await params;
  const actor = await getActor();
  if (!actor) redirect('/login');
  if (!z.uuid().safeParse(boardId).success) notFound();
  const data = await getReviewSource(actor, boardId).catch((err: unknown) => {
    if (err instanceof HttpError && err.status === 404) notFound();
    throw err;
  });
  return (
    <ReviewView
      data={reviewPageData(data)}
      canReview={can(actor.role, 'boards.review')}
      canComment={can(actor.role, 'boards.review') || can(actor.role, 'boards.edit')}
    />
  );
}
