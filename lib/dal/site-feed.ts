import 'server-only';

import type { Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import type { BoardFeed, WayInput } from '@/lib/boards/schemas';
import {
  readBoardSiteId,
  readFeedingWayBoard,
  readTreeBoards,
  siteIsTree,
  writeBoardFeed,
} from '@/lib/dal/board-repository';
import { audit } from '@/lib/dal/audit';
import { conflict, HttpError, notFound, type FieldIssue } from '@/lib/errors';
import { fedFromWords, wayName } from '@/lib/names';
import { feedLoop, unfitReason } from '@/lib/sites/feed-rules';
import type { FedFrom, FeedChange, SiteRipple } from '@/lib/sites/tree-types';
import { wayLabelsOf, type TreeBoard } from '@/lib/supply/size-tree';

import { feedRefusal, lockSite, lockSiteForWrite, resizeSite, type SiteLock } from './site-tree';

/**
 * A board's feed and the site tree around a board write (called by lib/dal/board-repository.ts
 * writeBoard): before the write, the site row is locked, a new feed is checked (same
 * organisation and site, a way fit to feed the board, no loop) and a write that takes a feeding
 * way away from other boards is refused with 409 naming them unless it is confirmed; after the
 * write, the whole site is re-sized (lib/dal/site-tree.ts resizeSite).
 */

/** What a board write asks of the tree. */
export type TreeWriteRequest = {
  /** The board's new feed (undefined: unchanged). */
  feed?: BoardFeed;
  /** The save may take feeding ways from other boards (they go back to the origin). */
  confirmFeedChanges?: boolean;
  /** Where the ripple of the write is handed back to the caller. */
  out?: { ripple: SiteRipple | null };
};

/** What `beforeTreeWrite` found, for `afterTreeWrite`. */
type TreeWritePlan = {
  site: SiteLock;
  /** Boards that go back to the origin, and why. */
  detach: FeedChange[];
  /** The board's new feed to write, when it changes. */
  feed: BoardFeed | null;
};

/** The site of the caller's organisation's board (else 404), locked as lib/dal/site-tree.ts lockSiteForWrite says. */
export async function lockSiteOfBoard(
  actor: Actor,
  boardId: string,
  transaction: Transaction,
  opts: { tree?: boolean } = {},
) {
  const siteId = await readBoardSiteId(actor, boardId, transaction);
  if (!siteId) throw notFound('The board');
  return lockSiteForWrite(actor, siteId, transaction, opts);
}

const sameFeed = (a: BoardFeed, b: BoardFeed) => JSON.stringify(a) === JSON.stringify(b);

/**
 * Before a board write that changes its design or feed: locks the site, checks the new feed
 * and finds the boards that would lose their feed. Refuses with 404 (a board or way not of
 * this organisation and site... another organisation's is never named), 422 (a loop, a way
 * that cannot feed the board) or 409 (other boards would change, not confirmed).
 */
export async function beforeTreeWrite(
  actor: Actor,
  board: { id: string; siteId: string; name: string; phases: 1 | 3 },
  write: { ways?: { remove: string[]; insert: WayInput[]; update: WayInput[] }; phases?: 1 | 3 } & TreeWriteRequest,
  transaction: Transaction,
): Promise<TreeWritePlan> {
  const site = await lockSiteForWrite(actor, board.siteId, transaction, { tree: write.feed?.from === 'way' });
  // A site without sub-mains: its boards are independent, and this write links none
  if (site.mode === 'share') return { site, detach: [], feed: null };
  const boards = await readTreeBoards(board.siteId, transaction, { stored: false });
  const byId = new Map(boards.map((b) => [b.id, b]));
  const me = byId.get(board.id);
  const phases = write.phases ?? board.phases;

  // The new feed
  let feed: BoardFeed | null = null;
  if (write.feed && me && !sameFeed(write.feed, me.feed)) {
    feed = write.feed;
    if (feed.from === 'way') feed = await checkFeed(actor, { ...board, phases }, feed, byId, transaction);
  }

  // Feeding ways of this board that the write removes or makes unfit, and whom they feed
  const removed = new Set(write.ways?.remove ?? []);
  const updated = new Map((write.ways?.update ?? []).map((w) => [w.id, w]));
  const fed = boardsFedFrom(board, boards, 'way-removed');
  const detach = fed.filter((c) => removed.has(c.from.wayId));
  const issues: FieldIssue[] = [];
  for (const c of fed) {
    const next = updated.get(c.from.wayId);
    if (!next || removed.has(c.from.wayId)) continue;
    const wayWords = c.from.wayLabel ? wayName(c.from.wayLabel) : 'The way';
    const why = unfitReason(next, wayWords, c.name, byId.get(c.boardId)!.phases);
    if (why) {
      const i = (write.ways?.update ?? []).indexOf(next);
      issues.push({ path: `ways.${i}`, message: `${why}; link ${c.name} elsewhere first` });
    }
  }
  if (issues.length) throw feedRefusal(issues);
  refuseUnconfirmed(detach, write.confirmFeedChanges, (names) => `This save takes away the way that feeds ${names}`);
  return { site, detach, feed };
}

/** 409 naming the boards that would go back to the origin (`feedChanges`), unless there are none or it is confirmed. */
function refuseUnconfirmed(detach: FeedChange[], confirmed: boolean | undefined, takesAway: (names: string) => string) {
  if (confirmed || !detach.length) return;
  const names = detach.map((c) => c.name).join(', ');
  const them = detach.length === 1 ? 'it' : 'them';
  throw conflict(`${takesAway(names)}; confirm to feed ${them} from the origin.`, { feedChanges: detach });
}

/** The boards fed from a way of `parent`, each as a change of its feed back to the origin. */
function boardsFedFrom(
  parent: { id: string; name: string },
  boards: readonly TreeBoard[],
  reason: FeedChange['reason'],
): (FeedChange & { from: FedFrom })[] {
  const me = boards.find((b) => b.id === parent.id);
  const labels = me ? wayLabelsOf(me) : new Map<string, string | null>();
  return boards.flatMap((d) => {
    if (d.feed.from !== 'way' || d.feed.boardId !== parent.id) return [];
    const { wayId } = d.feed;
    const from = { boardId: parent.id, boardName: parent.name, wayId, wayLabel: labels.get(wayId) ?? null };
    return [{ boardId: d.id, name: d.name, from: { ...from, device: '', cable: '' }, to: 'origin' as const, reason }];
  });
}

/** Checks a feed from a way: same organisation (else 404), same site, a fit way, no loop (else 422). */
async function checkFeed(
  actor: Actor,
  board: { id: string; siteId: string; name: string; phases: 1 | 3 },
  feed: Extract<BoardFeed, { from: 'way' }>,
  byId: Map<string, TreeBoard>,
  transaction: Transaction,
): Promise<BoardFeed> {
  const refuse = (path: 'feed.boardId' | 'feed.wayId', message: string) => feedRefusal([{ path, message }]);
  const [found] = await readFeedingWayBoard(actor, feed.boardId, feed.wayId, transaction);
  if (!found || found.deleted) throw notFound('The feeding way');
  if (found.site_id !== board.siteId)
    throw refuse('feed.boardId', `${found.board_name} is on another site; a board is fed from its own site`);
  if (feed.boardId === board.id) throw refuse('feed.boardId', `${board.name} cannot be fed from one of its own ways`);
  const parent = byId.get(feed.boardId)!;
  const cycle = feedLoop(byId, board.id, parent.id);
  if (cycle) {
    const names = [...cycle, cycle[0]].map((c) => c.name).join(' feeds ');
    throw feedRefusal([{ path: 'feed.boardId', message: `Boards cannot feed each other in a loop: ${names}` }], cycle);
  }
  const way = parent.ways.find((w) => w.id === feed.wayId)!;
  const label = wayLabelsOf(parent).get(way.id) ?? null;
  const wayWords = `${label ? wayName(label) : 'The way'} of ${parent.name}`;
  const why = unfitReason(way, wayWords, board.name, board.phases);
  if (why) throw refuse('feed.wayId', why);
  const taken = [...byId.values()].find(
    (b) => b.id !== board.id && b.feed.from === 'way' && b.feed.wayId === feed.wayId,
  );
  if (taken) throw refuse('feed.wayId', `${wayWords} already feeds ${taken.name}; a way feeds one board`);
  return feed;
}

/** Writes a board's feed, its history saying so (`details`, beside the new feed, say why). */
async function writeFeed(
  actor: Actor,
  boardId: string,
  feed: BoardFeed,
  details: Record<string, unknown>,
  transaction: Transaction,
): Promise<void> {
  await writeBoardFeed(boardId, feed.from === 'way' ? feed : null, transaction);
  await audit(actor, 'board.feed-changed', { feed, ...details }, { boardId, transaction });
}

const ORIGIN: BoardFeed = { from: 'origin' };

/**
 * After the board's own writes: writes its new feed, sends the boards that lost their feed back
 * to the origin (each history says so), and re-sizes the whole site. Answers the ripple.
 */
export async function afterTreeWrite(
  actor: Actor,
  board: { id: string; name: string },
  plan: TreeWritePlan,
  transaction: Transaction,
): Promise<SiteRipple> {
  if (plan.feed) await writeFeed(actor, board.id, plan.feed, {}, transaction);
  for (const c of plan.detach) {
    const note = `The way of ${board.name} that fed this board was removed; it is now fed from the origin.`;
    await writeFeed(actor, c.boardId, ORIGIN, { reason: c.reason, was: fedFromWords(c.from), note }, transaction);
  }
  return resizeSite(actor, plan.site, transaction, {
    writtenBoardId: board.id,
    cause: `${board.name} was changed`,
    only: plan.site.mode === 'share' ? board.id : undefined,
  });
}

/**
 * A board leaving its site's tree (deleted, or archived), planned before the write.
 *
 * What a designer expects: the boards fed from one of its ways are not left sized against a
 * board that is no longer part of the design, and they are not moved silently either. So a
 * removal that would take the supply of other boards away is refused with 409 naming them
 * (`feedChanges`, like a save that removes a feeding way) unless it is confirmed; confirmed, they
 * are fed from the origin (their history says which board fed them and why), to be linked again
 * from their own editor or the site view. The board itself lets go of the way that fed it, with a
 * history entry naming that way: the way is free to feed another board, and an archived board
 * (which the tree still reads, read-only) no longer loads the sub-main. Undo of a delete, or a
 * restore, brings the board back fed from the origin; its history says where it was fed from.
 * Either way the whole site is re-sized in the same transaction.
 */
export type RemovalPlan = {
  site: SiteLock;
  /** The boards fed from the removed board's ways: they go back to the origin. */
  detach: FeedChange[];
  /** Where the removed board itself was fed from (null: the origin). */
  ownFeed: FedFromWords | null;
  /** The feeds let go (the removed board's own, then each board it fed), to take up again if it comes back. */
  relinks: Relink[];
};

/** A feed from a way that a removal let go: which board, and the feed as it was. */
export type Relink = { boardId: string; feed: Extract<BoardFeed, { from: 'way' }> };

type FedFromWords = { boardName: string; wayLabel: string | null };

/** Where a feed from a way comes from, in words: the feeding board's name and the way's label. */
function feedingWay(byId: Map<string, TreeBoard>, feed: { boardId: string; wayId: string }): FedFromWords {
  const parent = byId.get(feed.boardId);
  return {
    boardName: parent?.name ?? 'another board',
    wayLabel: parent ? (wayLabelsOf(parent).get(feed.wayId) ?? null) : null,
  };
}

/** Locks the site (update: the tree may change) and finds whom the board's removal changes; 409 unconfirmed. */
export async function beforeBoardRemoval(
  actor: Actor,
  board: { id: string; siteId: string; name: string },
  opts: { effect: 'deleted' | 'archived'; confirmFeedChanges?: boolean },
  transaction: Transaction,
): Promise<RemovalPlan> {
  const site = await lockSite(actor, board.siteId, transaction, 'update');
  const boards = await readTreeBoards(board.siteId, transaction, { stored: false });
  const byId = new Map(boards.map((b) => [b.id, b]));
  const me = byId.get(board.id);
  const detach = boardsFedFrom(board, boards, 'board-removed').filter((c) => c.boardId !== board.id);
  const verb = opts.effect === 'deleted' ? 'Deleting' : 'Archiving';
  refuseUnconfirmed(
    detach,
    opts.confirmFeedChanges,
    (names) => `${verb} ${board.name} takes away the supply of ${names}, fed from its ways`,
  );
  let ownFeed: FedFromWords | null = null;
  const relinks: Relink[] = [];
  if (me?.feed.from === 'way') {
    ownFeed = feedingWay(byId, me.feed);
    relinks.push({ boardId: board.id, feed: me.feed });
  }
  for (const c of detach) {
    const feed = byId.get(c.boardId)?.feed;
    if (feed?.from === 'way') relinks.push({ boardId: c.boardId, feed });
  }
  return { site, detach, ownFeed, relinks };
}

/** After the removal's write: the feeds let go (each history says so), the whole site re-sized. */
export async function afterBoardRemoval(
  actor: Actor,
  board: { id: string; name: string },
  plan: RemovalPlan,
  effect: 'deleted' | 'archived',
  transaction: Transaction,
): Promise<SiteRipple | null> {
  if (!plan.detach.length && !plan.ownFeed) return null;
  const reason = 'board-removed';
  for (const c of plan.detach) {
    const note = `${board.name}, which fed this board, was ${effect}; it is now fed from the origin.`;
    const details = { reason, removedBoard: board.name, effect, was: fedFromWords(c.from), note };
    await writeFeed(actor, c.boardId, ORIGIN, details, transaction);
  }
  if (plan.ownFeed) {
    const was = fedFromWords(plan.ownFeed);
    const note = `This board was ${effect}, so it no longer takes its supply from ${was}; brought back, it is fed from the origin.`;
    await writeFeed(actor, board.id, ORIGIN, { reason, self: true, effect, was, note }, transaction);
  }
  return resizeSite(actor, plan.site, transaction, { writtenBoardId: board.id, cause: `${board.name} was ${effect}` });
}

/**
 * After a deleted or archived board came back, the site of a tree is re-sized: the board is
 * sized with what is carried to it now, not with what was carried before it left.
 */
export async function afterBoardReturn(
  actor: Actor,
  board: { id: string; name: string; siteId: string },
  site: SiteLock,
  transaction: Transaction,
  relinks: readonly Relink[] = [],
): Promise<SiteRipple | null> {
  if (relinks.length) await takeUpFeeds(actor, board, relinks, transaction);
  if (!(await siteIsTree(actor, site.id, transaction))) return null;
  return resizeSite(actor, site, transaction, { writtenBoardId: board.id, cause: `${board.name} came back` });
}

/**
 * A board coming back takes up the feeds its removal let go: its own, and each board it fed.
 * A feed is taken up only if it still holds: the board is still fed from the origin (nobody
 * pointed it elsewhere meanwhile), it is not deleted, and the way passes the checks of a feed
 * chosen by hand (`checkFeed`: there, fit, free, no loop). Each one taken up or left is in the
 * board's history.
 */
async function takeUpFeeds(
  actor: Actor,
  board: { id: string; name: string; siteId: string },
  relinks: readonly Relink[],
  transaction: Transaction,
): Promise<void> {
  const boards = await readTreeBoards(board.siteId, transaction, { stored: false });
  const byId = new Map(boards.map((b) => [b.id, b]));
  for (const r of relinks) {
    const target = byId.get(r.boardId);
    if (!target || target.feed.from !== 'origin') continue;
    // Each history entry says which board came back and where the feed was
    const was = fedFromWords(feedingWay(byId, r.feed));
    const returned = { reason: 'board-returned', returnedBoard: board.name, was };
    try {
      await checkFeed(actor, { ...target, siteId: board.siteId }, r.feed, byId, transaction);
    } catch (err) {
      if (!(err instanceof HttpError)) throw err;
      const why = err.status === 404 ? 'the way that fed it is gone' : err.message;
      const details = { feed: ORIGIN, ...returned, kept: true, why };
      await audit(actor, 'board.feed-changed', details, { boardId: target.id, transaction });
      continue;
    }
    await writeFeed(actor, target.id, r.feed, returned, transaction);
    byId.set(target.id, { ...target, feed: r.feed });
  }
}
