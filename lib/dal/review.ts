import 'server-only';

import { Op, type Transaction } from 'sequelize';

import { can } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import { issueRefusal, sameName, type Refusal } from '@/lib/boards/record-rules';
import { countWays, countWords } from '@/lib/boards/counts';
import { layoutWays } from '@/lib/boards/layout';
import {
  diffRevisions,
  type BoardSnapshot,
  type RevisionDiff,
  type SnapshotWay,
} from '@/lib/boards/revision-diff';
import { settingsOf, type BoardSettings } from '@/lib/boards/schemas';
import type { BoardDto } from '@/lib/boards/types';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { sizeSnapshot, sizeStoredBoard } from '@/lib/dal/board-sizing';
import { assertNotArchived, findBoard, findWritableBoard, getBoard } from '@/lib/dal/boards';
import { env } from '@/lib/env';
import { badRequest, conflict, forbidden, HttpError, notFound, unprocessable, type FieldIssue } from '@/lib/errors';
import { enqueueMail } from '@/lib/mail/outbox';
import { BOARD_STATUS_PHRASES, wayTitle } from '@/lib/names';
import type { BoardResult } from '@/lib/sizing';
import {
  AuditEvent,
  Board,
  BoardRevision,
  Comment,
  Organisation,
  OutgoingMail,
  Site,
  User,
  Way,
} from '@/models';
import type { BoardStatus } from '@/models/board';
import type { LabelStatus } from '@/models/way';

export type CommentDto = {
  id: string;
  wayId: string | null;
  revision: number;
  body: string;
  authorName: string;
  createdAt: string;
  /** When the designer marked it answered; null while open. */
  answeredAt: string | null;
};

export type RevisionSummary = {
  revision: number;
  issuedAt: string;
  issuedByName: string;
  /** The issuer's typed name (null for revisions issued before declarations were asked). */
  declaration: string | null;
};

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

/** Everything the review page shows. */
export type ReviewData = {
  board: BoardDto;
  organisationName: string;
  sizing: BoardResult | null;
  /** Why the board could not be sized (empty when it could). */
  sizingIssues: FieldIssue[];
  /** Printed way reference per way id (null for devices without one). */
  refs: Record<string, string | null>;
  comments: CommentDto[];
  revisions: RevisionSummary[];
  issue: IssuePreview;
};


function snapshotWay(way: SnapshotWay): SnapshotWay {
  return { id: way.id, rail: way.rail, position: way.position, device: way.device, circuit: way.circuit };
}

async function organisationName(actor: Actor, transaction?: Transaction): Promise<string> {
  const org = await Organisation.findByPk(actor.organisationId, { attributes: ['name'], transaction });
  return org?.name ?? '';
}

/** The live board as a snapshot (what would be frozen if it were issued now). */
async function liveSnapshot(actor: Actor, board: Board, transaction?: Transaction): Promise<BoardSnapshot> {
  // One after another: inside a transaction they share one connection, and pg refuses
  // (from pg 9) a query sent while another is running on it
  const site = await Site.findByPk(board.siteId, { attributes: ['name'], transaction });
  const ways = await Way.findAll({
    where: { boardId: board.id },
    order: [['rail', 'ASC'], ['position', 'ASC']],
    transaction,
  });
  const orgName = await organisationName(actor, transaction);
  return {
    settings: settingsOf(board),
    siteName: site?.name ?? '',
    organisationName: orgName,
    ways: ways.map((w) => snapshotWay(w as unknown as SnapshotWay)),
  };
}

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
  const rows = await Comment.findAll({
    where: { boardId },
    include: [{ model: User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC']],
  });
  return rows.map(commentDto);
}

/** The issued revisions of a board, newest first. */
export async function listRevisions(actor: Actor, boardId: string): Promise<RevisionSummary[]> {
  await findBoard(actor, boardId);
  const rows = await BoardRevision.findAll({
    where: { boardId },
    attributes: ['revision', 'issuedAt', 'issuedById', 'declaration'],
    include: [{ model: User, as: 'issuedBy', attributes: ['name'] }],
    order: [['revision', 'DESC']],
  });
  return rows.map((r) => ({
    revision: r.revision,
    issuedAt: r.issuedAt.toISOString(),
    issuedByName: (r as BoardRevision & { issuedBy?: User }).issuedBy?.name ?? 'A former member',
    declaration: r.declaration,
  }));
}

/** The revision number a board in review would be issued as: its own, unless that one was issued. */
async function nextRevision(board: Board, transaction?: Transaction): Promise<number> {
  const last = ((await BoardRevision.max('revision', { where: { boardId: board.id }, transaction })) as number | null) ?? 0;
  return Math.max(board.revision, last + 1);
}

/** Separation of duties for this issuer and board (lib/boards/record-rules.ts issueRefusal). */
async function issueRefusalFor(actor: Actor, board: Board, transaction?: Transaction): Promise<Refusal | null> {
  const org = await Organisation.findByPk(actor.organisationId, { attributes: ['allowSelfIssue'], transaction });
  return issueRefusal({
    issuerId: actor.userId,
    designChangedById: board.designChangedById,
    allowSelfIssue: org?.allowSelfIssue ?? false,
  });
}

/** The review page's data: the board, its sizing, comments and issued revisions. */
export async function getReview(actor: Actor, boardId: string): Promise<ReviewData> {
  const board = await getBoard(actor, boardId);
  const [orgName, comments, revisions, row] = await Promise.all([
    organisationName(actor),
    listComments(actor, boardId),
    listRevisions(actor, boardId),
    findBoard(actor, boardId),
  ]);
  const { sizing, issues } = sizeStoredBoard(board);
  const refs = Object.fromEntries(layoutWays(board.phases, board.ways).map((p) => [p.id, p.label]));
  const counts = sizing?.summary.counts;
  const issue: IssuePreview = {
    revision: await nextRevision(row),
    ways: countWords(countWays(board.phases, board.ways)),
    devices: board.ways.length,
    circuits: board.ways.filter((w) => w.circuit).length,
    verdicts: { passes: counts?.passes ?? 0, nearLimit: counts?.nearLimit ?? 0, fails: counts?.fails ?? 0 },
    refusal: await issueRefusalFor(actor, row),
  };
  return {
    board,
    organisationName: orgName,
    sizing,
    sizingIssues: issues,
    refs,
    comments,
    revisions,
    issue,
  };
}

/** Whoever may comment: the reviewers, and the designers answering them. */
function mayComment(actor: Actor): boolean {
  return can(actor.role, 'boards.review') || can(actor.role, 'boards.edit');
}

/** Adds a comment on the board (wayId null) or on one of its ways, for the board's current revision. */
export async function addComment(
  actor: Actor,
  boardId: string,
  input: { wayId?: string | null; body: string },
): Promise<CommentDto> {
  if (!mayComment(actor)) throw forbidden('comment on boards');
  const created = await db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction });
    await assertNotArchived(board, transaction);
    const wayId = input.wayId ?? null;
    if (wayId) {
      const onBoard = await Way.count({ where: { id: wayId, boardId }, transaction });
      if (!onBoard) throw badRequest([{ path: 'wayId', message: 'That way is not on this board.' }]);
    }
    const comment = await Comment.create(
      { boardId, wayId, revision: board.revision, authorId: actor.userId, body: input.body },
      { transaction },
    );
    await audit(actor, 'board.comment', { commentId: comment.id, wayId }, { boardId, transaction });
    return comment;
  });
  return commentDto(Object.assign(created, { author: { name: actor.name } as User }));
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
  const ways = await Way.findAll({ where: { boardId: board.id }, transaction });
  const refs = new Map(
    layoutWays(board.phases, ways as unknown as SnapshotWay[]).map((p) => [p.id, p.label]),
  );
  return comments.map((c) => {
    const ref = c.wayId ? refs.get(c.wayId) : null;
    const where = c.wayId ? (ref ? wayTitle(ref) : 'A way since removed') : 'Board';
    const who = (c as Comment & { author?: User }).author?.name ?? 'A former member';
    return `- ${where} (${who}): ${c.body}`;
  });
}

function boardUrl(boardId: string): string {
  return new URL(`/boards/${boardId}`, env().APP_URL).href;
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

/** One state of a board: an issued revision, or the live board ('current'). */
export type RevisionState = {
  revision: number;
  issued: { at: string; byName: string } | null;
  snapshot: BoardSnapshot;
  sizing: BoardResult | null;
};

/** An issued revision, or the live board when `revision` is 'current'. */
export async function getRevision(
  actor: Actor,
  boardId: string,
  revision: number | 'current',
): Promise<RevisionState> {
  const board = await findBoard(actor, boardId);
  if (revision === 'current') {
    const snapshot = await liveSnapshot(actor, board);
    return { revision: board.revision, issued: null, snapshot, sizing: sizeSnapshot(snapshot).sizing };
  }
  const row = await BoardRevision.findOne({
    where: { boardId, revision },
    include: [{ model: User, as: 'issuedBy', attributes: ['name'] }],
  });
  if (!row) throw notFound(`Revision ${revision}`);
  return {
    revision: row.revision,
    issued: {
      at: row.issuedAt.toISOString(),
      byName: (row as BoardRevision & { issuedBy?: User }).issuedBy?.name ?? 'A former member',
    },
    snapshot: row.snapshot as unknown as BoardSnapshot,
    sizing: row.sizing as unknown as BoardResult,
  };
}

/** The changes from one state of a board to another. */
export async function getRevisionDiff(
  actor: Actor,
  boardId: string,
  from: number | 'current',
  to: number | 'current',
): Promise<{ from: number; to: number; toIsLive: boolean; diff: RevisionDiff }> {
  const [a, b] = await Promise.all([getRevision(actor, boardId, from), getRevision(actor, boardId, to)]);
  return { from: a.revision, to: b.revision, toIsLive: to === 'current', diff: diffRevisions(a.snapshot, b.snapshot) };
}

/** What a printed schedule (or label strip) is made from. */
export type ScheduleSource = {
  boardId: string;
  boardUrl: string;
  snapshot: BoardSnapshot;
  sizing: BoardResult | null;
  sizingIssues: FieldIssue[];
  revision: number;
  status: BoardStatus;
  /** True for an issued revision (frozen), false for the live draft. */
  frozen: boolean;
  issued: { at: string; byName: string } | null;
  /** The label walk's results, when a walk applies to this revision. */
  labels: Record<string, { status: LabelStatus; note: string }> | null;
  updatedAt: string;
};

/**
 * The board state to print. Without `revision`: the issued revision of an issued board
 * (labels matched or not), else the live draft. Installers print issued revisions only (a board
 * never issued is refused); the others may print the live draft too.
 */
export async function getScheduleSource(
  actor: Actor,
  boardId: string,
  revision?: number,
): Promise<ScheduleSource> {
  const board = await findBoard(actor, boardId);
  const draftsAllowed = actor.role !== 'installer';
  const issuedNow = board.status === 'issued' || board.status === 'labels-matched';
  let target = revision;
  if (target === undefined) {
    if (issuedNow || draftsAllowed) target = board.revision;
    else {
      target = ((await BoardRevision.max('revision', { where: { boardId } })) as number | null) ?? undefined;
      if (target === undefined) throw forbidden('print a board that has not been issued');
    }
  }
  const url = boardUrl(boardId);
  const row = await BoardRevision.findOne({
    where: { boardId, revision: target },
    include: [{ model: User, as: 'issuedBy', attributes: ['name'] }],
  });
  if (row) {
    const snapshot = row.snapshot as unknown as BoardSnapshot;
    // The walk checks the board as built, which is the current issued revision
    let labels: ScheduleSource['labels'] = null;
    if (issuedNow && row.revision === board.revision) {
      const ways = await Way.findAll({
        where: { boardId },
        attributes: ['id', 'labelStatus', 'labelNote'],
      });
      const inSnapshot = new Set(snapshot.ways.map((w) => w.id));
      labels = Object.fromEntries(
        ways.filter((w) => inSnapshot.has(w.id)).map((w) => [w.id, { status: w.labelStatus, note: w.labelNote }]),
      );
    }
    return {
      boardId,
      boardUrl: url,
      snapshot,
      sizing: row.sizing as unknown as BoardResult,
      sizingIssues: [],
      revision: row.revision,
      status: row.revision === board.revision ? board.status : 'issued',
      frozen: true,
      issued: {
        at: row.issuedAt.toISOString(),
        byName: (row as BoardRevision & { issuedBy?: User }).issuedBy?.name ?? 'A former member',
      },
      labels,
      updatedAt: row.issuedAt.toISOString(),
    };
  }
  if (target !== board.revision) throw notFound(`Revision ${target}`);
  if (!draftsAllowed) throw forbidden('print a board that has not been issued');
  const snapshot = await liveSnapshot(actor, board);
  const { sizing, issues } = sizeSnapshot(snapshot);
  return {
    boardId,
    boardUrl: url,
    snapshot,
    sizing,
    sizingIssues: issues,
    revision: board.revision,
    status: board.status,
    frozen: false,
    issued: null,
    labels: null,
    updatedAt: board.updatedAt.toISOString(),
  };
}

export type ScheduleMail = {
  id: string;
  to: string;
  revision: number;
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
  lastError: string | null;
  sentByName: string;
  createdAt: string;
  sentAt: string | null;
};

/** Queues the schedule PDF to an address through the outbox and records who sent it. */
export async function emailSchedule(
  actor: Actor,
  source: Pick<ScheduleSource, 'boardId' | 'revision' | 'snapshot' | 'frozen' | 'boardUrl'>,
  input: { to: string; message?: string; pdf: Uint8Array; fileName: string },
): Promise<{ id: string; status: 'queued' }> {
  await findBoard(actor, source.boardId);
  const name = source.snapshot.settings.name;
  return db().transaction(async (transaction) => {
    const id = await enqueueMail(
      {
        organisationId: actor.organisationId,
        to: input.to,
        subject: `Board schedule: ${name}, revision ${source.revision}${source.frozen ? '' : ' (draft)'}`,
        text: [
          `${actor.name} sent you the board schedule of ${name} (${source.snapshot.siteName}), revision ${source.revision}${source.frozen ? '' : ', not yet issued'}.`,
          ...(input.message ? ['', input.message] : []),
          '',
          `The schedule is attached as a PDF. Board: ${source.boardUrl}`,
        ].join('\n'),
        attachments: [
          {
            filename: input.fileName,
            contentType: 'application/pdf',
            contentBase64: Buffer.from(input.pdf).toString('base64'),
          },
        ],
      },
      transaction,
    );
    await audit(
      actor,
      'schedule.emailed',
      { mailId: id, to: input.to, revision: source.revision },
      { boardId: source.boardId, transaction },
    );
    return { id, status: 'queued' as const };
  });
}

/** The schedule e-mails sent for a board, newest first, with their outbox status. */
export async function listScheduleEmails(actor: Actor, boardId: string): Promise<ScheduleMail[]> {
  await findBoard(actor, boardId);
  const events = await AuditEvent.findAll({
    where: { boardId, organisationId: actor.organisationId, action: 'schedule.emailed' },
    order: [['id', 'DESC']],
    limit: 50,
  });
  const ids = events.map((e) => String(e.details.mailId ?? '')).filter(Boolean);
  const [mails, users] = await Promise.all([
    OutgoingMail.findAll({ where: { id: { [Op.in]: ids }, organisationId: actor.organisationId } }),
    User.findAll({
      where: { id: { [Op.in]: events.map((e) => e.userId).filter((u): u is string => !!u) } },
      attributes: ['id', 'name'],
    }),
  ]);
  const mailById = new Map(mails.map((m) => [m.id, m]));
  const nameById = new Map(users.map((u) => [u.id, u.name]));
  return events.flatMap((e) => {
    const mail = mailById.get(String(e.details.mailId));
    if (!mail) return [];
    return [
      {
        id: mail.id,
        to: mail.toAddress,
        revision: Number(e.details.revision),
        status: mail.status,
        attempts: mail.attempts,
        lastError: mail.lastError,
        sentByName: (e.userId && nameById.get(e.userId)) || 'A former member',
        createdAt: mail.createdAt.toISOString(),
        sentAt: mail.sentAt ? mail.sentAt.toISOString() : null,
      },
    ];
  });
}

/** The board's status and revision, for pages that only need those. */
export async function boardStage(
  actor: Actor,
  boardId: string,
): Promise<{ status: BoardStatus; revision: number; name: string }> {
  const board = await findBoard(actor, boardId);
  return { status: board.status, revision: board.revision, name: board.name };
}

/** A returned board's review as the designer reads it in the editor. */
export type ReturnNotes = {
  revision: number;
  returnedByName: string;
  returnedAt: string;
  /** Comments on the whole board: the reason for the return, open ones only. */
  reasons: CommentDto[];
  /** Open comments on single ways, to show beside them. */
  wayComments: CommentDto[];
  /** How many comments of this return are answered already. */
  answered: number;
};

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
  const comments = await Comment.findAll({
    where: { boardId, revision: board.revision },
    include: [{ model: User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC']],
  });
  const open = comments.filter((c) => !c.answeredAt).map(commentDto);
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

/** Marks comments of a board answered (the designer has dealt with them). */
export async function answerComments(actor: Actor, boardId: string, commentIds: string[]): Promise<{ answered: number }> {
  if (!can(actor.role, 'comments.answer')) throw forbidden('mark review comments answered');
  return db().transaction(async (transaction) => {
    const board = await findBoard(actor, boardId, { transaction, lock: true });
    await assertNotArchived(board, transaction);
    const ids = [...new Set(commentIds)];
    const found = await Comment.findAll({ where: { boardId, id: { [Op.in]: ids } }, transaction });
    if (found.length !== ids.length) {
      throw badRequest([{ path: 'commentIds', message: 'Some of those comments are not on this board.' }]);
    }
    const open = found.filter((c) => !c.answeredAt);
    if (open.length) {
      await Comment.update(
        { answeredAt: new Date(), answeredById: actor.userId },
        { where: { id: { [Op.in]: open.map((c) => c.id) } }, transaction },
      );
      await audit(actor, 'comments.answered', { commentIds: open.map((c) => c.id) }, { boardId, transaction });
    }
    return { answered: open.length };
  });
}
