import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { commentsOf } from '@/lib/dal/comments';
import { findBoard } from '@/lib/dal/board-repository';
import { AuditEvent, User } from '@/models';
import type { ReturnNotes } from '@/lib/boards/review-types';

/**
 * The review of a board that was returned for its current revision and is a draft again: who
 * returned it and when, and the comments of that revision still open (the designer marks
 * them answered). Null when the board was not returned, or every comment is answered.
 */
export async function getReturnNotes(actor: Actor, boardId: string): Promise<ReturnNotes | null> {
  const board = await findBoard(actor, boardId);
  if (board.status !== 'draft') return null;
  const returned = await AuditEvent.findOne({
    where: { boardId, organisationId: actor.organisationId, action: 'review.returned' },
    order: [['id', 'DESC']],
  });
  if (!returned || Number(returned.details.revision) !== board.revision) return null;
  const comments = await commentsOf(boardId, board.revision);
  const open = comments.filter((c) => !c.answeredAt);
  if (!open.length) return null;
  const who = returned.userId ? await User.findByPk(returned.userId, { attributes: ['name'] }) : null;
  return {
    revision: board.revision,
    returnedByName: who?.name ?? 'A former member',
    returnedAt: returned.createdAt.toISOString(),
    reasons: open.filter((c) => !c.wayId),
    wayComments: open.filter((c) => c.wayId),
    answered: comments.length - open.length,
  };
}
