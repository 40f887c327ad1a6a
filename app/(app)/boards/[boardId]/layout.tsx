import { notFound } from 'next/navigation';
import { z } from 'zod';

import { can } from '@/lib/auth/permissions';
import { getActor } from '@/lib/auth/session';
import { isIssued } from '@/lib/boards/lifecycle';
import { readBoardFrame } from '@/lib/dal/board-repository';
import { HttpError } from '@/lib/errors';

import { ArchivedBanner } from './_components/archived-banner';
import { BoardNav } from './_components/board-nav';

type Props = { children: React.ReactNode; params: Promise<{ boardId: string }> };

/** Every page of one board shares its name and the way between its four views. */
export default async function BoardLayout({ children, params }: Props) {
  const { boardId } = await params;
  if (!z.uuid().safeParse(boardId).success) notFound();
  const actor = await getActor();
  if (!actor) notFound();
  const board = await readBoardFrame(actor, boardId).catch((err: unknown) => {
    if (err instanceof HttpError && err.status === 404) notFound();
    throw err;
  });
  const issued = isIssued(board.status);
  const tabs = [
    { href: `/boards/${boardId}`, label: 'Board', show: true },
    // Reviewers review; designers read the review of their boards
    {
      href: `/boards/${boardId}/review`,
      label: 'Review',
      show: can(actor.role, 'boards.review') || can(actor.role, 'boards.edit'),
    },
    {
      href: `/boards/${boardId}/schedule`,
      label: 'Schedule',
      show:
        can(actor.role, 'schedule.print') && (can(actor.role, 'schedule.print-draft') || issued || board.revision > 1),
    },
    { href: `/boards/${boardId}/walk`, label: 'Label walk', show: can(actor.role, 'walk.record') },
  ].filter((t) => t.show);
  const { archived } = board;
  return (
    <div className="flex flex-col gap-4">
      <BoardNav tabs={tabs} />
      {archived ? (
        <ArchivedBanner
          boardId={boardId}
          siteId={board.siteId}
          state={archived}
          canRestore={can(actor.role, 'records.archive')}
        />
      ) : null}
      {children}
    </div>
  );
}
