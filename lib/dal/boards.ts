import 'server-only';

import { isDeepStrictEqual } from 'node:util';

import { literal, Op, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { countWays, type CountedWay } from '@/lib/boards/counts';
import { transition } from '@/lib/boards/lifecycle';
import { boardRemoval, mayRestore } from '@/lib/boards/record-rules';
import {
  settingsOf,
  type BoardCreateInput,
  type BoardDto,
  type BoardSaveInput,
  type BoardSummary,
  type WayInput,
} from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import type { AuditAction } from '@/lib/dal/audit';
import { findBoard, readWays, writeBoard, type BoardEvent } from '@/lib/dal/board-repository';
import { lockSiteOfBoard, type TreeWriteRequest } from '@/lib/dal/site-feed';
import { findSite } from '@/lib/dal/sites';
import { conflict, forbidden, HttpError } from '@/lib/errors';
import { Board, BoardRevision, Site, User, Way } from '@/models';
import type { ArchiveState } from '@/lib/boards/review-types';

export { findBoard, readBoard as getBoard, requireBoard } from '@/lib/dal/board-repository';

/**
 * The organisation's boards, optionally of one site: the live ones, or with `archived` the
 * archived ones (archived themselves or on an archived site). Deleted boards never show.
 */
export async function listBoards(
  actor: Actor,
  opts: { siteId?: string; archived?: boolean } = {},
): Promise<BoardSummary[]> {
  if (opts.siteId) await findSite(actor, opts.siteId);
  const archived = opts.archived
    ? { [Op.or]: [{ archivedAt: { [Op.ne]: null } }, { '$site.archived_at$': { [Op.ne]: null } }] }
    : { archivedAt: null, '$site.archived_at$': null };
  const boards = await Board.findAll({
    where: {
      organisationId: actor.organisationId,
      deletedAt: null,
      ...archived,
      ...(opts.siteId ? { siteId: opts.siteId } : {}),
    },
    include: [{ model: Site, as: 'site', attributes: ['name', 'archivedAt'] }],
    order: [['updatedAt', 'DESC']],
  });
  // Ways counted by way number, as the editor and the schedule count them (counts.ts)
  const ways = await Way.findAll({
    where: { boardId: { [Op.in]: boards.map((b) => b.id) } },
    attributes: ['boardId', 'id', 'rail', 'position', 'device', [literal('circuit is not null'), 'circuit']],
    raw: true,
  });
  const byBoard = new Map<string, CountedWay[]>();
  for (const w of ways as unknown as (CountedWay & { boardId: string })[]) {
    const list = byBoard.get(w.boardId) ?? [];
    list.push(w);
    byBoard.set(w.boardId, list);
  }
  const issued = (await BoardRevision.count({
    where: { boardId: { [Op.in]: boards.map((b) => b.id) } },
    group: ['boardId'],
  })) as unknown as { boardId: string; count: number }[];
  const everIssuedIds = new Set(issued.map((c) => c.boardId));
  return boards.map((b) => {
    const counts = countWays(b.phases, byBoard.get(b.id) ?? []);
    return {
      id: b.id,
      siteId: b.siteId,
      siteName: (b as Board & { site?: Site }).site?.name ?? '',
      name: b.name,
      location: b.location,
      phases: b.phases,
      status: b.status,
      revision: b.revision,
      wayCount: counts.ways,
      counts,
      updatedAt: b.updatedAt.toISOString(),
      archivedAt: (b.archivedAt ?? (b as Board & { site?: Site }).site?.archivedAt)?.toISOString() ?? null,
      everIssued: everIssuedIds.has(b.id),
    };
  });
}

/** A board's archive state, for its pages (the "archived" banner) and for refusals. */
export async function archiveStateOf(board: Board, transaction?: Transaction): Promise<ArchiveState> {
  let at = board.archivedAt;
  let by = board.archivedById;
  let through: 'board' | 'site' = 'board';
  if (!at) {
    const site = await Site.findByPk(board.siteId, { attributes: ['archivedAt', 'archivedById'], transaction });
    if (!site?.archivedAt) return null;
    [at, by, through] = [site.archivedAt, site.archivedById, 'site'];
  }
  const who = by ? await User.findByPk(by, { attributes: ['name'], transaction }) : null;
  return { at: at.toISOString(), byName: who?.name ?? 'A former member', through };
}

/** The archive state of one board of the caller's organisation (404 otherwise). */
export async function getArchiveState(actor: Actor, boardId: string): Promise<ArchiveState> {
  return archiveStateOf(await findBoard(actor, boardId));
}

/** 409 for any change to an archived board (or a board on an archived site): it is read-only. */
export async function assertNotArchived(board: Board, transaction?: Transaction): Promise<void> {
  const state = await archiveStateOf(board, transaction);
  if (state) {
    throw conflict(
      state.through === 'site'
        ? 'This board’s site is archived, so the board is read-only; an admin may restore the site.'
        : 'This board is archived, so it is read-only; an admin may restore it.',
      { archived: true },
    );
  }
}

/** The board, locked for a change, refusing an archived one (409). */
export async function findWritableBoard(actor: Actor, boardId: string, transaction: Transaction): Promise<Board> {
  const board = await findBoard(actor, boardId, { transaction, lock: true });
  await assertNotArchived(board, transaction);
  return board;
}

/** Whether the board has an issued revision (then it is kept for good). */
export async function everIssued(boardId: string, transaction?: Transaction): Promise<boolean> {
  return (await BoardRevision.count({ where: { boardId }, transaction })) > 0;
}

export async function createBoard(actor: Actor, input: BoardCreateInput): Promise<BoardDto> {
  const site = await findSite(actor, input.siteId);
  if (site.archivedAt) throw conflict('This site is archived; an admin may restore it before boards are added.');
  return db().transaction(async (transaction) => {
    const created = await Board.create(
      { ...input, organisationId: actor.organisationId, createdById: actor.userId, designChangedById: actor.userId },
      { transaction },
    );
    return writeBoard(
      actor,
      created,
      {
        ways: { remove: [], insert: [], update: [] },
        feed: input.feed,
        events: [{ action: 'board.created', details: { name: input.name } }],
      },
      transaction,
    );
  });
}

/**
 * One change of a board of the caller's organisation, in a transaction with its row locked:
 * `change` checks the row (throwing to refuse) and says what to write (`writeBoard`).
 */
async function changeBoard(
  actor: Actor,
  boardId: string,
  change: (board: Board, transaction: Transaction) => Promise<Parameters<typeof writeBoard>[2]>,
  opts: { deleted?: boolean } = {},
): Promise<BoardDto> {
  return db().transaction(async (transaction) => {
    // The site first, then the board: every write on one site's tree takes them in this order
    await lockSiteOfBoard(actor, boardId, transaction);
    const board = await findBoard(actor, boardId, { transaction, lock: true, deleted: opts.deleted });
    return writeBoard(actor, board, await change(board, transaction), transaction);
  });
}

export async function renameBoard(
  actor: Actor,
  boardId: string,
  input: { name?: string; location?: string },
): Promise<BoardDto> {
  return changeBoard(actor, boardId, async (board, transaction) => {
    await assertNotArchived(board, transaction);
    return { set: input, events: [{ action: 'board.renamed', details: input }] };
  });
}

/**
 * Removes a board (lib/boards/record-rules.ts boardRemoval): a board never issued is deleted
 * (hidden everywhere, its rows kept so that the delete can be undone); a board ever issued is
 * archived, by an admin only. The version moves on, so an editor still open cannot save it.
 */
export async function removeBoard(actor: Actor, boardId: string): Promise<{ effect: 'deleted' | 'archived' }> {
  let effect: 'deleted' | 'archived' = 'deleted';
  await changeBoard(actor, boardId, async (board, transaction) => {
    const rule = boardRemoval(actor.role, {
      everIssued: await everIssued(boardId, transaction),
      archived: (await archiveStateOf(board, transaction)) !== null,
    });
    if (rule.refused) throw new HttpError(rule.status, rule.message);
    if (rule.effect === 'delete') {
      return {
        set: { deletedAt: new Date(), deletedById: actor.userId },
        events: [{ action: 'board.deleted', details: { name: board.name } }],
      };
    }
    effect = 'archived';
    return archiving(actor, board);
  });
  return { effect };
}

const archiving = (actor: Actor, board: Board) => ({
  set: { archivedAt: new Date(), archivedById: actor.userId },
  events: [{ action: 'board.archived', details: { name: board.name, revision: board.revision } } satisfies BoardEvent],
});

/** Archives a board (admins: records.archive), issued or not. */
export async function archiveBoard(actor: Actor, boardId: string): Promise<void> {
  if (!mayRestore(actor.role, 'archived')) throw forbidden('archive boards');
  await changeBoard(actor, boardId, async (board) => {
    if (board.archivedAt) throw conflict('This board is archived already.');
    return archiving(actor, board);
  });
}

/** Brings an archived board back into the lists (admins). */
export async function restoreBoard(actor: Actor, boardId: string): Promise<BoardDto> {
  if (!mayRestore(actor.role, 'archived')) throw forbidden('restore archived boards');
  return changeBoard(actor, boardId, async (board) => {
    if (!board.archivedAt) throw conflict('This board is not archived.');
    return {
      set: { archivedAt: null, archivedById: null },
      events: [{ action: 'board.restored', details: { name: board.name } }],
    };
  });
}

/** Undoes the delete of a draft board: it comes back as it was. */
export async function undeleteBoard(actor: Actor, boardId: string): Promise<BoardDto> {
  if (!mayRestore(actor.role, 'deleted')) throw forbidden('restore deleted boards');
  return changeBoard(
    actor,
    boardId,
    async (board) => {
      if (!board.deletedAt) throw conflict('This board is not deleted.');
      return {
        set: { deletedAt: null, deletedById: null },
        events: [{ action: 'board.undeleted', details: { name: board.name } }],
      };
    },
    { deleted: true },
  );
}

/** What changed between the stored ways and the saved ones, for the audit trail. */
export function diffWays(before: WayInput[], after: WayInput[]) {
  const old = new Map(before.map((w) => [w.id, w]));
  const now = new Map(after.map((w) => [w.id, w]));
  const added = after.filter((w) => !old.has(w.id)).map((w) => w.id);
  const removed = before.filter((w) => !now.has(w.id)).map((w) => w.id);
  const moved: string[] = [];
  const changed: string[] = [];
  for (const w of after) {
    const o = old.get(w.id);
    if (!o) continue;
    if (o.rail !== w.rail || o.position !== w.position) moved.push(w.id);
    // Compared by value: stored JSON comes back with its keys in PostgreSQL's order
    if (!isDeepStrictEqual(o.device, w.device) || !isDeepStrictEqual(o.circuit, w.circuit)) {
      changed.push(w.id);
    }
  }
  return { added, removed, moved, changed };
}

/**
 * Saves the whole board at the version the editor opened, in one transaction with the board
 * row locked (concurrent saves queue on it, and every one after the first finds a newer
 * version): a stale save gets 409 with the current version and nothing is written. Removed
 * ways go, new ones are inserted (a new way's id that exists anywhere is refused: no way of
 * another board is ever touched), moved or changed ones are written and lose their label
 * check; a way left as it was is not written, so it keeps its label check. Saving an issued
 * board (labels matched or not) starts the next draft revision.
 */
export async function saveBoard(
  actor: Actor,
  boardId: string,
  input: BoardSaveInput,
  out?: TreeWriteRequest['out'],
): Promise<BoardDto> {
  try {
    return await changeBoard(actor, boardId, async (board, transaction) => {
      // An archive also moves the version on: say that it is archived, not that someone saved
      await assertNotArchived(board, transaction);
      // The stage first (lib/boards/lifecycle.ts: a board in review is not saved), then the version
      const step = transition(board.status, 'save', { revision: board.revision });
      if (step.refused) throw conflict(step.message);
      if (board.version !== input.version) {
        throw conflict('Someone else saved this board after you opened it.', { currentVersion: board.version });
      }
      const diff = diffWays(await readWays(boardId, transaction), input.ways);
      const added = new Set(diff.added);
      const touched = new Set([...diff.changed, ...diff.moved]);
      const { startsRevision } = step;
      const wayEvents = (action: AuditAction, ids: string[]) => ids.map((wayId) => ({ action, details: { wayId } }));
      return {
        set: {
          ...settingsOf(input.settings),
          designChangedById: actor.userId,
          status: step.to,
          ...(startsRevision ? { revision: board.revision + 1 } : {}),
        },
        ways: {
          remove: diff.removed,
          insert: input.ways.filter((w) => added.has(w.id)),
          update: input.ways.filter((w) => touched.has(w.id)),
        },
        // The site's tree (lib/dal/site-feed.ts): a new feed, feeding ways taken away, the ripple
        feed: input.settings.feed,
        confirmFeedChanges: input.confirmFeedChanges,
        out,
        events: [
          ...wayEvents('way.added', diff.added),
          ...wayEvents('way.removed', diff.removed),
          ...wayEvents('way.moved', diff.moved),
          ...wayEvents('way.changed', diff.changed),
          {
            action: step.audit ?? 'board.saved',
            details: { version: board.version + 1, ...(startsRevision ? { newRevision: board.revision + 1 } : {}) },
          },
        ],
      };
    });
  } catch (err) {
    // A new way's id that some way already has (on this board or any other)
    const { parent } = err as { parent?: { constraint?: string } };
    if (parent?.constraint === 'ways_pkey')
      throw conflict('A new way reuses the id of an existing way; reload the board.');
    throw err;
  }
}
