import 'server-only';

import type { Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { transition } from '@/lib/boards/lifecycle';
import { boardRemoval, mayRestore } from '@/lib/boards/record-rules';
import {
  settingsOf,
  type BoardCreateInput,
  type BoardDto,
  type BoardSaveInput,
  type BoardSummary,
} from '@/lib/boards/schemas';
import { diffWays } from '@/lib/boards/way-diff';
import { db } from '@/lib/db';
import { latestEventDetails, type AuditAction } from '@/lib/dal/audit';
import {
  findBoard,
  insertBoard,
  readArchiveState,
  readBoard,
  readBoardSummaries,
  readWays,
  writeBoard,
  type BoardRecord,
} from '@/lib/dal/board-repository';
import {
  afterBoardRemoval,
  afterBoardReturn,
  beforeBoardRemoval,
  lockSiteOfBoard,
  type Relink,
  type RemovalPlan,
  type TreeWriteRequest,
} from '@/lib/dal/site-feed';
import { lockSite, type SiteLock } from '@/lib/dal/site-tree';
import { findSite } from '@/lib/dal/sites';
import { conflict, forbidden, HttpError } from '@/lib/errors';
import type { FeedChange, SiteRipple } from '@/lib/sites/tree-types';
import { BoardRevision } from '@/models';

/** The organisation's boards for the lists, optionally of one site (404 for another's site). */
export async function listBoards(
  actor: Actor,
  opts: { siteId?: string; archived?: boolean } = {},
): Promise<BoardSummary[]> {
  if (opts.siteId) await findSite(actor, opts.siteId);
  return readBoardSummaries(actor, opts);
}

/** 409 for any change to an archived board (or a board on an archived site): it is read-only. */
export async function assertNotArchived(board: BoardRecord, transaction?: Transaction): Promise<void> {
  const state = await readArchiveState(board.id, transaction);
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
export async function findWritableBoard(actor: Actor, boardId: string, transaction: Transaction): Promise<BoardRecord> {
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
  return db().transaction((transaction) =>
    insertBoard(actor, input, [{ action: 'board.created', details: { name: input.name } }], transaction),
  );
}

/**
 * One change of a board of the caller's organisation, in a transaction with its row locked:
 * `change` checks the row (throwing to refuse) and says what to write (`writeBoard`); `after`
 * runs once it is written, in the same transaction.
 */
async function changeBoard(
  actor: Actor,
  boardId: string,
  change: (board: BoardRecord, transaction: Transaction) => Promise<Parameters<typeof writeBoard>[2]>,
  opts: {
    deleted?: boolean;
    tree?: boolean;
    after?: (board: BoardRecord, transaction: Transaction) => Promise<unknown>;
  } = {},
): Promise<BoardDto> {
  return db().transaction(async (transaction) => {
    // The site first, then the board: every write on one site's tree takes them in this order
    await lockSiteOfBoard(actor, boardId, transaction, { tree: opts.tree });
    const board = await findBoard(actor, boardId, { transaction, lock: true, deleted: opts.deleted });
    const written = await writeBoard(actor, board, await change(board, transaction), transaction);
    await opts.after?.(board, transaction);
    return written;
  });
}

/**
 * Refuses a save of the locked board with 409: archived, at a stage that is not saved
 * (lib/boards/lifecycle.ts: a board in review), or at another version than `version`.
 */
export async function assertSavable(board: BoardRecord, version: number | undefined, transaction: Transaction) {
  // An archive also moves the version on: say that it is archived, not that someone saved
  await assertNotArchived(board, transaction);
  // The stage first, then the version
  const step = transition(board.status, 'save', { revision: board.revision });
  if (step.refused) throw conflict(step.message);
  assertVersion(board, version);
  return step;
}

/** 409 with the stored version when the caller holds another one (`version` undefined: not checked). */
export function assertVersion(board: BoardRecord, version: number | undefined): void {
  if (version !== undefined && board.version !== version) {
    throw conflict('Someone else saved this board after you opened it.', { currentVersion: board.version });
  }
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

/** What a removal did to the site's tree: the boards that went back to the origin. */
export type RemovalAnswer = { feedChanges: FeedChange[]; ripple: SiteRipple | null };

/**
 * A removal (delete or archive, as `decide` says once the row is locked), with the site's tree
 * as lib/dal/site-feed.ts beforeBoardRemoval says. The version moves on, so an editor still
 * open cannot save the board.
 */
async function takeOff(
  actor: Actor,
  boardId: string,
  opts: { confirmFeedChanges?: boolean },
  decide: (board: BoardRecord, transaction: Transaction) => Promise<'deleted' | 'archived'>,
): Promise<{ effect: 'deleted' | 'archived' } & RemovalAnswer> {
  let effect: 'deleted' | 'archived' = 'deleted';
  let plan: RemovalPlan | null = null;
  let ripple: SiteRipple | null = null;
  const change = async (board: BoardRecord, transaction: Transaction) => {
    effect = await decide(board, transaction);
    plan = await beforeBoardRemoval(actor, board, { effect, ...opts }, transaction);
    // The feeds it lets go are kept in its history event, so that coming back takes them up
    const details = {
      name: board.name,
      ...(effect === 'archived' && { revision: board.revision }),
      feeds: plan.relinks,
    };
    const set =
      effect === 'deleted'
        ? { deletedAt: new Date(), deletedById: actor.userId }
        : { archivedAt: new Date(), archivedById: actor.userId };
    return { set, events: [{ action: `board.${effect}` as const, details }] };
  };
  const after = async (board: BoardRecord, transaction: Transaction) => {
    ripple = await afterBoardRemoval(actor, board, plan!, effect, transaction);
  };
  await changeBoard(actor, boardId, change, { tree: true, after });
  return { effect, feedChanges: (plan as RemovalPlan | null)?.detach ?? [], ripple };
}

/**
 * Removes a board (lib/boards/record-rules.ts boardRemoval): a board never issued is deleted
 * (hidden everywhere, its rows kept so that the delete can be undone); a board ever issued is
 * archived, by an admin only. A board that feeds others asks first (see `takeOff`).
 */
export async function removeBoard(actor: Actor, boardId: string, opts: { confirmFeedChanges?: boolean } = {}) {
  return takeOff(actor, boardId, opts, async (board, transaction) => {
    const rule = boardRemoval(actor.role, {
      everIssued: await everIssued(boardId, transaction),
      archived: (await readArchiveState(board.id, transaction)) !== null,
    });
    if (rule.refused) throw new HttpError(rule.status, rule.message);
    return rule.effect === 'delete' ? 'deleted' : 'archived';
  });
}

/** Archives a board (admins: records.archive), issued or not; a board that feeds others asks first. */
export async function archiveBoard(
  actor: Actor,
  boardId: string,
  opts: { confirmFeedChanges?: boolean } = {},
): Promise<RemovalAnswer> {
  if (!mayRestore(actor.role, 'archived')) throw forbidden('archive boards');
  return takeOff(actor, boardId, opts, async (board) => {
    if (board.archivedAt) throw conflict('This board is archived already.');
    return 'archived';
  });
}

/** What bringing a board back undoes: its removal's history event, the event it writes, the columns it clears. */
const BRINGING_BACK = {
  archived: { removal: 'board.archived', event: 'board.restored', set: { archivedAt: null, archivedById: null } },
  deleted: { removal: 'board.deleted', event: 'board.undeleted', set: { deletedAt: null, deletedById: null } },
} as const;

/**
 * Brings an archived (admins) or deleted board back into the lists as it was. It takes up the
 * feeds its removal let go (kept in the removal's history event: its own feed, and the boards
 * it fed) where they still hold, else rejoins the tree at the origin; the site re-sized.
 */
async function bringBack(actor: Actor, boardId: string, from: 'archived' | 'deleted'): Promise<BoardDto> {
  if (!mayRestore(actor.role, from)) throw forbidden(`restore ${from} boards`);
  const { removal, event, set } = BRINGING_BACK[from];
  const held = { site: null as SiteLock | null, relinks: [] as Relink[] };
  const back = await changeBoard(
    actor,
    boardId,
    async (board, transaction) => {
      if (!board[from === 'archived' ? 'archivedAt' : 'deletedAt']) throw conflict(`This board is not ${from}.`);
      // The site locked for a tree write (`changeBoard` took that lock: this is the row as locked)
      held.site = await lockSite(actor, board.siteId, transaction, 'update');
      const details = await latestEventDetails(board.id, removal, transaction);
      held.relinks = Array.isArray(details?.feeds) ? (details.feeds as Relink[]) : [];
      return { set: { ...set }, events: [{ action: event, details: { name: board.name } }] };
    },
    {
      tree: true,
      deleted: from === 'deleted',
      after: (board, transaction) => afterBoardReturn(actor, board, held.site!, transaction, held.relinks),
    },
  );
  return readBoard(actor, back.id);
}

/** Brings an archived board back into the lists (admins), fed from the origin. */
export const restoreBoard = (actor: Actor, boardId: string) => bringBack(actor, boardId, 'archived');

/** Undoes the delete of a draft board: it comes back as it was, fed from the origin. */
export const undeleteBoard = (actor: Actor, boardId: string) => bringBack(actor, boardId, 'deleted');

/**
 * Saves the whole board at the version the editor opened, with the board row locked
 * (concurrent saves queue on it; every one after the first is stale: 409, nothing written).
 * Only the ways that changed are written (they lose their label check); a new way's id that
 * exists anywhere is refused, so no way of another board is touched. Saving an issued board
 * starts the next draft revision.
 */
export async function saveBoard(
  actor: Actor,
  boardId: string,
  input: BoardSaveInput,
  out?: TreeWriteRequest['out'],
): Promise<BoardDto> {
  try {
    return await changeBoard(
      actor,
      boardId,
      async (board, transaction) => {
        const step = await assertSavable(board, input.version, transaction);
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
      },
      { tree: input.settings.feed?.from === 'way' },
    );
  } catch (err) {
    // A new way's id that some way already has (on this board or any other)
    const { parent } = err as { parent?: { constraint?: string } };
    if (parent?.constraint === 'ways_pkey')
      throw conflict('A new way reuses the id of an existing way; reload the board.');
    throw err;
  }
}
