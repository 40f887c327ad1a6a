import 'server-only';

import { Op, type Transaction } from 'sequelize';

import { can } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import { issueRefusal, sameName, type Refusal } from '@/lib/boards/record-rules';
import { layoutWays } from '@/lib/boards/layout';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { readWays } from '@/lib/dal/board-repository';
import { boardUrl, liveSnapshot } from '@/lib/dal/board-snapshot';
import { sizeSnapshot } from '@/lib/dal/board-sizing';
import { findWritableBoard } from '@/lib/dal/boards';
import { nextRevision } from '@/lib/dal/revisions';
import { env } from '@/lib/env';
import { badRequest, conflict, HttpError, unprocessable } from '@/lib/errors';
import { enqueueMail } from '@/lib/mail/outbox';
import { BOARD_STATUS_PHRASES, wayTitle } from '@/lib/names';
import { AuditEvent, Board, BoardRevision, Comment, Organisation, Site, User } from '@/models';
import type { BoardStatus } from '@/models/board';

/** What an issue would issue now, for the confirmation, and whether the caller may. */
export type IssuePreview = {
  /** The revision number the board would be issued as. */
  revision: number;
  /** The ways counted by way number, in the words of the boards list and the schedule. */
  ways: string;
  /** Devices on the rail, and ways with a circuit (recorded in the audit trail). */
  devices: number;
  circuits: number;
  verdicts: { passes: number; nearLimit: number; fails: number };
  /** Why the caller may not issue it (separation of duties), or null. */
  refusal: Refusal | null;
};

/** Separation of duties for this issuer and board (lib/boards/record-rules.ts issueRefusal). */
export async function issueRefusalFor(actor: Actor, board: Board, transaction?: Transaction): Promise<Refusal | null> {
  const org = await Organisation.findByPk(actor.organisationId, { attributes: ['allowSelfIssue'], transaction });
  return issueRefusal({
    issuerId: actor.userId,
    designChangedById: board.designChangedById,
    allowSelfIssue: org?.allowSelfIssue ?? false,
  });
}

/**
 * Who gets the review e-mails: the designer who made the board and the last designer
 * (or admin) who changed or submitted it, if still active members; failing both, every
 * active designer of the organisation.
 */
async function designerAddresses(board: Board, transaction: Transaction): Promise<string[]> {
  const last = await AuditEvent.findOne({
    where: {
      boardId: board.id,
      organisationId: board.organisationId,
      action: { [Op.in]: ['board.saved', 'board.status'] },
      userId: { [Op.ne]: null },
    },
    order: [['id', 'DESC']],
    transaction,
  });
  const ids = [board.createdById, last?.userId].filter((id): id is string => !!id);
  const people = ids.length
    ? await User.findAll({
        where: { id: { [Op.in]: ids }, organisationId: board.organisationId, active: true },
        transaction,
      })
    : [];
  const designers = people.filter((u) => can(u.role, 'boards.edit'));
  const chosen = designers.length
    ? designers
    : await User.findAll({
        where: { organisationId: board.organisationId, role: 'designer', active: true },
        transaction,
      });
  return [...new Set(chosen.map((u) => u.email))];
}

/** The comment list of one revision as plain text lines for an e-mail. */
async function commentLines(board: Board, transaction: Transaction): Promise<string[]> {
  // One after another: both run on the transaction's one connection
  const comments = await Comment.findAll({
    where: { boardId: board.id, revision: board.revision },
    include: [{ model: User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC']],
    transaction,
  });
  const ways = await readWays(board.id, transaction);
  const refs = new Map(layoutWays(board.phases, ways).map((p) => [p.id, p.label]));
  return comments.map((c) => {
    const ref = c.wayId ? refs.get(c.wayId) : null;
    const where = c.wayId ? (ref ? wayTitle(ref) : 'A way since removed') : 'Board';
    const who = (c as Comment & { author?: User }).author?.name ?? 'A former member';
    return `- ${where} (${who}): ${c.body}`;
  });
}

/** The designer's view of a returned board's review: the editor, opened at the review notes. */
function returnedReviewUrl(boardId: string): string {
  return new URL(`/boards/${boardId}#review-notes`, env().APP_URL).href;
}

/**
 * Approves a board in review: it becomes issued with the next revision number, and the
 * board and its sizing are frozen in a BoardRevision with the issuer's declaration (their
 * name, typed). Someone other than the last person to change the design issues it, unless
 * the organisation allows self-issue. A board with failing ways is issued only when the
 * reviewer says so. The designers are e-mailed.
 */
export async function approveBoard(
  actor: Actor,
  boardId: string,
  input: { acknowledgeFailures?: boolean; declaration: string; revision?: number },
): Promise<{ revision: number; status: BoardStatus }> {
  return db().transaction(async (transaction) => {
    // Lock the board and check its stage
    const board = await findWritableBoard(actor, boardId, transaction);
    if (board.status !== 'in-review') {
      throw conflict(`Only a board in review can be approved; this board is ${BOARD_STATUS_PHRASES[board.status]}.`);
    }
    // Separation of duties, then the declaration
    const refusal = await issueRefusalFor(actor, board, transaction);
    if (refusal) throw new HttpError(refusal.status, refusal.message);
    if (!sameName(input.declaration, actor.name)) {
      throw badRequest(
        [{ path: 'declaration', message: `Type your own name (${actor.name}) to confirm that you issue this board.` }],
        'The declaration does not match your name.',
      );
    }
    // Freeze the board and size it
    const snapshot = await liveSnapshot(actor, board, transaction);
    const { sizing, issues } = sizeSnapshot(snapshot);
    if (!sizing) throw unprocessable('The board cannot be sized, so it cannot be issued.', { issues });
    if (sizing.summary.counts.fails > 0 && !input.acknowledgeFailures) {
      throw unprocessable(
        `${sizing.summary.counts.fails} way(s) fail a check. Return the board, or confirm that it is issued as it is.`,
        { issues: [{ path: 'acknowledgeFailures', message: 'Confirm to issue a board with failing ways.' }] },
      );
    }
    // The next revision number: the draft's, unless that one was issued already
    const revision = await nextRevision(board, transaction);
    if (input.revision !== undefined && input.revision !== revision) {
      throw conflict(`The board would now be issued as revision ${revision}, not ${input.revision}; look at it again.`);
    }
    const issuedAt = new Date();
    const declaration = input.declaration.trim();
    await BoardRevision.create(
      { boardId, revision, snapshot, sizing, issuedById: actor.userId, issuedAt, declaration },
      { transaction },
    );
    await board.update({ status: 'issued', revision, version: board.version + 1 }, { transaction });
    const { passes, nearLimit, fails } = sizing.summary.counts;
    await audit(
      actor,
      'review.approved',
      {
        revision,
        declaration,
        devices: snapshot.ways.length,
        circuits: snapshot.ways.filter((w) => w.circuit).length,
        verdicts: { passes, nearLimit, fails },
        acknowledgedFailures: fails > 0,
        designChangedById: board.designChangedById,
      },
      { boardId, transaction },
    );
    // Tell the designers
    const lines = await commentLines(board, transaction);
    for (const to of await designerAddresses(board, transaction)) {
      await enqueueMail(
        {
          organisationId: board.organisationId,
          to,
          subject: `Issued: ${board.name}, revision ${revision}`,
          text: [
            `${actor.name} approved ${board.name} (${snapshot.siteName}). It is issued as revision ${revision}.`,
            `Declared by ${declaration}.`,
            '',
            ...(lines.length ? ['Comments on this revision:', ...lines, ''] : []),
            `Board: ${boardUrl(boardId)}`,
            `Schedule: ${new URL(`/boards/${boardId}/schedule?revision=${revision}`, env().APP_URL).href}`,
          ].join('\n'),
        },
        transaction,
      );
    }
    return { revision, status: 'issued' as const };
  });
}

/**
 * Returns a board in review to draft with the reviewer's comments (a closing comment may
 * come with the call; at least one comment on this revision is needed). The designers are e-mailed.
 */
export async function returnBoard(
  actor: Actor,
  boardId: string,
  input: { comment?: string },
): Promise<{ revision: number; status: BoardStatus }> {
  return db().transaction(async (transaction) => {
    // Lock the board and check its stage
    const board = await findWritableBoard(actor, boardId, transaction);
    if (board.status !== 'in-review') {
      throw conflict(`Only a board in review can be returned; this board is ${BOARD_STATUS_PHRASES[board.status]}.`);
    }
    // The closing comment, and at least one comment in all
    if (input.comment) {
      const c = await Comment.create(
        { boardId, wayId: null, revision: board.revision, authorId: actor.userId, body: input.comment },
        { transaction },
      );
      await audit(actor, 'board.comment', { commentId: c.id, wayId: null }, { boardId, transaction });
    }
    const count = await Comment.count({ where: { boardId, revision: board.revision }, transaction });
    if (!count) {
      throw badRequest([{ path: 'comment', message: 'Say what needs changing before returning the board.' }]);
    }
    await board.update({ status: 'draft', version: board.version + 1 }, { transaction });
    await audit(actor, 'review.returned', { revision: board.revision, comments: count }, { boardId, transaction });
    // Tell the designers, with every comment of this revision
    const lines = await commentLines(board, transaction);
    const site = await Site.findByPk(board.siteId, { attributes: ['name'], transaction });
    for (const to of await designerAddresses(board, transaction)) {
      await enqueueMail(
        {
          organisationId: board.organisationId,
          to,
          subject: `Returned for changes: ${board.name}, revision ${board.revision}`,
          text: [
            `${actor.name} returned ${board.name} (${site?.name ?? ''}) to draft with these comments:`,
            '',
            ...lines,
            '',
            `Read the comments beside the ways they are about: ${returnedReviewUrl(boardId)}`,
          ].join('\n'),
        },
        transaction,
      );
    }
    return { revision: board.revision, status: 'draft' as const };
  });
}
