import 'server-only';

import type { Transaction } from 'sequelize';

import { can } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { findBoard, wayOnBoard, type BoardRecord } from '@/lib/dal/board-repository';
import { assertNotArchived, findWritableBoard } from '@/lib/dal/boards';
import { badRequest, forbidden } from '@/lib/errors';
import { AuditEvent, Comment, User } from '@/models';
import type { CommentDto, ReturnNotes } from '@/lib/boards/review-types';

function commentDto(c: Comment & { author?: User }): CommentDto {
  return {
    id: c.id,
    wayId: c.wayId,
    revision: c.revision,
    body: c.body,
    authorName: c.author?.name ?? 'A former member',
    createdAt: c.createdAt.toISOString(),
    answeredAt: c.answeredAt ? c.answeredAt.toISOString() : null,
  };
}

/** Every comment on a board, oldest first. */
export async function listComments(actor: Actor, boardId: string): Promise<CommentDto[]> {
  await findBoard(actor, boardId);
  return commentsOf(boardId);
}

/** Every comment on a board (or of one revision), oldest first, for a caller who has already read the board. */
export async function commentsOf(boardId: string, revision?: number, transaction?: Transaction) {
  const rows = await Comment.findAll({
    where: { boardId, ...(revision === undefined ? {} : { revision }) },
    include: [{ model: User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC']],
    transaction,
  });
  return rows.map(commentDto);
}

/** Writes the caller's comment (on a way, or with null on the board) for the board's current revision, and its trail entry. */
export async function insertComment(
  actor: Actor,
  board: BoardRecord,
  wayId: string | null,
  body: string,
  transaction: Transaction,
) {
  const created = await Comment.create(
    { boardId: board.id, wayId, revision: board.revision, authorId: actor.userId, body },
    { transaction },
  );
  await audit(actor, 'board.comment', { commentId: created.id, wayId }, { boardId: board.id, transaction });
  return created;
}

/** Adds a comment on the board (wayId null) or on one of its ways, for the board's current revision. */
export async function addComment(
  actor: Actor,
  boardId: string,
  input: { wayId?: string | null; body: string },
): Promise<CommentDto> {
  // Whoever may comment: the reviewers, and the designers answering them
  if (!can(actor.role, 'boards.review') && !can(actor.role, 'boards.edit')) throw forbidden('comment on boards');
  const created = await db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction });
    await assertNotArchived(board, transaction);
    const wayId = input.wayId ?? null;
    if (wayId && !(await wayOnBoard(boardId, wayId, transaction)))
      throw badRequest([{ path: 'wayId', message: 'That way is not on this board.' }]);
    return insertComment(actor, board, wayId, input.body, transaction);
  });
  return commentDto(Object.assign(created, { author: { name: actor.name } as User }));
}

/** Marks comments of a board answered (the designer has dealt with them). */
export async function answerComments(
  actor: Actor,
  boardId: string,
  commentIds: string[],
): Promise<{ answered: number }> {
  if (!can(actor.role, 'comments.answer')) throw forbidden('mark review comments answered');
  return db().transaction(async (transaction) => {
    await findWritableBoard(actor, boardId, transaction);
    const ids = [...new Set(commentIds)];
    const found = await Comment.findAll({ where: { boardId, id: ids }, transaction });
    if (found.length !== ids.length) {
      throw badRequest([{ path: 'commentIds', message: 'Some of those comments are not on this board.' }]);
    }
    const open = found.filter((c) => !c.answeredAt).map((c) => c.id);
    if (open.length) {
      await Comment.update(
        { answeredAt: new Date(), answeredById: actor.userId },
        { where: { id: open }, transaction },
      );
      await audit(actor, 'comments.answered', { commentIds: open }, { boardId, transaction });
    }
    return { answered: open.length };
  });
}

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
