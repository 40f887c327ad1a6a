import 'server-only';

import type { Actor } from '@/lib/auth/session';
import { transition } from '@/lib/boards/lifecycle';
import { issueRefusal, sameName } from '@/lib/boards/record-rules';
import { sizeDesign } from '@/lib/boards/size-design';
import { db } from '@/lib/db';
import { liveSnapshot } from '@/lib/dal/board-snapshot';
import { writeBoard } from '@/lib/dal/board-repository';
import { findWritableBoard } from '@/lib/dal/boards';
import { insertComment } from '@/lib/dal/comments';
import { queueNotices, revisionComments } from '@/lib/dal/notices';
import { lockSiteOfBoard } from '@/lib/dal/site-feed';
import { nextRevision } from '@/lib/dal/revisions';
import { env } from '@/lib/env';
import { badRequest, conflict, HttpError, unprocessable } from '@/lib/errors';
import type { IssuedFacts, ReturnedFacts } from '@/lib/mail/templates';
import { BoardRevision, Comment, Organisation } from '@/models';
import type { BoardStatus } from '@/models/board';

/**
 * Approves a board in review: issued with the next revision number, the board and its sizing
 * frozen in a BoardRevision with the issuer's typed declaration. Not by the last to change the
 * design unless self-issue is allowed; failing ways only when the reviewer confirms. The designers are e-mailed.
 */
export async function approveBoard(
  actor: Actor,
  boardId: string,
  input: { acknowledgeFailures?: boolean; declaration: string; revision?: number },
): Promise<{ revision: number; status: BoardStatus }> {
  return db().transaction(async (transaction) => {
    // The site first (the order of every write on a site), so that the supply carried to this
    // board, frozen below, is not re-sized by a change upstream while it is being issued
    await lockSiteOfBoard(actor, boardId, transaction);
    // Lock the board and check its stage
    const board = await findWritableBoard(actor, boardId, transaction);
    const step = transition(board.status, 'approve', { revision: board.revision });
    if (step.refused) throw conflict(step.message);
    // Separation of duties (lib/boards/record-rules.ts), then the declaration
    const org = await Organisation.findByPk(actor.organisationId, { attributes: ['allowSelfIssue'], transaction });
    const { designChangedById } = board;
    const refusal = issueRefusal({ issuerId: actor.userId, designChangedById, allowSelfIssue: !!org?.allowSelfIssue });
    if (refusal) throw new HttpError(refusal.status, refusal.message);
    if (!sameName(input.declaration, actor.name)) {
      throw badRequest(
        [{ path: 'declaration', message: `Type your own name (${actor.name}) to confirm that you issue this board.` }],
        'The declaration does not match your name.',
      );
    }
    // Freeze the board and size it
    const snapshot = await liveSnapshot(actor, board, transaction);
    const { sizing, issues } = sizeDesign({ ...snapshot.settings, ways: snapshot.ways });
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
    const { passes, nearLimit, fails } = sizing.summary.counts;
    const details = {
      revision,
      declaration,
      devices: snapshot.ways.length,
      circuits: snapshot.ways.filter((w) => w.circuit).length,
      verdicts: { passes, nearLimit, fails },
      acknowledgedFailures: fails > 0,
      designChangedById: board.designChangedById,
    };
    const events = step.audit ? [{ action: step.audit, details }] : [];
    await writeBoard(actor, board, { set: { status: step.to, revision }, events }, transaction);
    // Tell the designers (the comments of the issued revision)
    const issued: IssuedFacts = {
      appUrl: env().APP_URL,
      boardId,
      boardName: board.name,
      siteName: snapshot.siteName,
      revision,
      approverName: actor.name,
      declaration,
      comments: await revisionComments({ ...board, revision }, transaction),
    };
    await queueNotices(step, board, { issued }, transaction);
    return { revision, status: step.to };
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
    const step = transition(board.status, 'return', { revision: board.revision });
    if (step.refused) throw conflict(step.message);
    // The closing comment, and at least one comment in all
    if (input.comment) await insertComment(actor, board, null, input.comment, transaction);
    const count = await Comment.count({ where: { boardId, revision: board.revision }, transaction });
    if (!count) {
      throw badRequest([{ path: 'comment', message: 'Say what needs changing before returning the board.' }]);
    }
    const events = step.audit ? [{ action: step.audit, details: { revision: board.revision, comments: count } }] : [];
    const { siteName } = await writeBoard(actor, board, { set: { status: step.to }, events }, transaction);
    // Tell the designers, with every comment of this revision
    const returned: ReturnedFacts = {
      appUrl: env().APP_URL,
      boardId,
      boardName: board.name,
      siteName,
      revision: board.revision,
      returnerName: actor.name,
      comments: await revisionComments(board, transaction),
    };
    await queueNotices(step, board, { returned }, transaction);
    return { revision: board.revision, status: step.to };
  });
}
