import type { Metadata } from 'next';
import { notFound } from 'next/navigation';

import { AuditTrail } from '@/features/audit/components/audit-trail';
import { BoardEditor } from '@/features/board-editor/components/board-editor';
import { DerivedSupply } from '@/features/board-editor/components/derived-supply';
import { RevisionDiff } from '@/features/review/components/revision-diff';
import { can } from '@/lib/auth/permissions';
import { requireActor } from '@/lib/auth/session';
import { idParamsSchema } from '@/lib/boards/schemas';
import { readBoard, readBoardFrame } from '@/lib/dal/board-repository';
import { getReturnNotes } from '@/lib/dal/comments';
import { HttpError } from '@/lib/errors';

import { LabelFindings } from './_components/label-findings';

export const metadata: Metadata = { title: 'Board editor' };

type Props = { params: Promise<{ boardId: string }> };

/** The board editor for one board of the member's organisation (read-only for some roles). */
export default async function BoardPage({ params }: Props) {
  // Params, session and the board (the DAL scopes it to the organisation)
  const parsed = idParamsSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const actor = await requireActor('boards.read');
  let board;
  try {
    board = await readBoard(actor, parsed.data.boardId);
  } catch (err) {
    if (err instanceof HttpError && err.status === 404) notFound();
    throw err;
  }
  // An archived board is read-only for everyone; a returned one shows its review
  const [{ archived }, reviewNotes] = await Promise.all([
    readBoardFrame(actor, board.id),
    getReturnNotes(actor, board.id),
  ]);
  // What the role may do here; every route checks again on the server
  const abilities = {
    edit: can(actor.role, 'boards.edit') && !archived,
    size: can(actor.role, 'sizing.run'),
    submit: can(actor.role, 'boards.submit') && !archived,
  };
  return (
    <div className="flex flex-col gap-6">
      <BoardEditor
        board={board}
        can={abilities}
        reviewNotes={archived ? null : reviewNotes}
        readOnlyBecause={archived ? 'Archived: read only. An admin may restore it.' : null}
      />
      <DerivedSupply board={board} canEdit={abilities.edit} />
      <LabelFindings board={board} />
      <div className="grid gap-6 lg:grid-cols-2">
        <section aria-labelledby="revisions" className="rounded-card border border-line bg-paper-raised p-4">
          <h2 id="revisions" className="mb-2 text-base font-semibold text-ink">
            Revisions
          </h2>
          <RevisionDiff boardId={board.id} />
        </section>
        <AuditTrail boardId={board.id} className="rounded-card border border-line bg-paper-raised p-4" />
      </div>
    </div>
  );
}
