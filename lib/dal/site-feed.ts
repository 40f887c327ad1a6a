import 'server-only';

import { QueryTypes, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { engineInputOf, type BoardFeed, type WayInput } from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import { auditMany } from '@/lib/dal/audit';
import { conflict, notFound, type FieldIssue } from '@/lib/errors';
import { fedFromWords, wayName } from '@/lib/names';
import type { FeedChange, SiteRipple } from '@/lib/sites/tree-types';
import { isProtectiveDevice } from '@/lib/sizing';
import { wayLabels } from '@/lib/supply';

import { feedRefusal, lockSite, readSiteBoards, resizeSite, type TreeBoard } from './site-tree';

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
export type TreeWritePlan = {
  site: Awaited<ReturnType<typeof lockSite>>;
  /** Boards that go back to the origin, and why. */
  detach: FeedChange[];
  /** The board's new feed to write, when it changes. */
  feed: BoardFeed | null;
};

/** The site of a board of the caller's organisation, locked (404 for another organisation's board). */
export async function lockSiteOfBoard(actor: Actor, boardId: string, transaction: Transaction) {
  const rows = await db().query<{ site_id: string }>(
    'SELECT site_id FROM boards WHERE id = $1 AND organisation_id = $2',
    { bind: [boardId, actor.organisationId], type: QueryTypes.SELECT, transaction },
  );
  if (!rows.length) throw notFound('The board');
  return lockSite(actor, rows[0].site_id, transaction);
}

/** Why a way cannot feed a board of these phases, or null when it can. */
function unfitReason(way: WayInput, wayWords: string, boardName: string, phases: 1 | 3): string | null {
  if (!isProtectiveDevice(way.device.kind) || !way.circuit) {
    return `${wayWords} cannot feed ${boardName}: a sub-main needs a protective device and a circuit`;
  }
  if (way.circuit.use !== 'distribution') {
    return `${wayWords} cannot feed ${boardName}: set its use to distribution (a sub-main) first`;
  }
  if (phases === 3 && way.circuit.phases !== 3) {
    return `${boardName} is three-phase, so it needs a three-phase sub-main, and ${wayWords} is single-phase`;
  }
  if (phases === 1 && way.circuit.phases === 3) {
    return `${boardName} is single-phase: feed it from a single-phase way (one phase), not the three-phase ${wayWords}`;
  }
  return null;
}

const labelsOf = (b: TreeBoard) => wayLabels({ phases: b.phases, ways: engineInputOf(b, b.ways).ways });

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
  const site = await lockSite(actor, board.siteId, transaction);
  const boards = await readSiteBoards(board.siteId, transaction, { stored: false });
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
  const detach: FeedChange[] = [];
  const removed = new Set(write.ways?.remove ?? []);
  const updated = new Map((write.ways?.update ?? []).map((w) => [w.id, w]));
  const labels = me ? labelsOf(me) : new Map<string, string | null>();
  const issues: FieldIssue[] = [];
  for (const d of boards) {
    if (d.feed.from !== 'way' || d.feed.boardId !== board.id) continue;
    const wayId = d.feed.wayId;
    const label = labels.get(wayId) ?? null;
    const from = {
      boardId: board.id,
      boardName: board.name,
      wayId,
      wayLabel: label,
      device: '',
      cable: '',
    };
    if (removed.has(wayId)) {
      detach.push({ boardId: d.id, name: d.name, from, to: 'origin', reason: 'way-removed' });
      continue;
    }
    const next = updated.get(wayId);
    if (next) {
      const why = unfitReason(next, label ? wayName(label) : 'The way', d.name, d.phases);
      if (why) {
        const i = (write.ways?.update ?? []).indexOf(next);
        issues.push({ path: `ways.${i}`, message: `${why}; link ${d.name} elsewhere first` });
      }
    }
  }
  if (issues.length) throw feedRefusal(issues);
  if (detach.length && !write.confirmFeedChanges) {
    const names = detach.map((c) => c.name).join(', ');
    throw conflict(
      `This save takes away the way that feeds ${names}; confirm to feed ${detach.length === 1 ? 'it' : 'them'} from the origin.`,
      { feedChanges: detach },
    );
  }
  return { site, detach, feed };
}

/** Checks a feed from a way: same organisation (else 404), same site, a fit way, no loop (else 422). */
async function checkFeed(
  actor: Actor,
  board: { id: string; siteId: string; name: string; phases: 1 | 3 },
  feed: Extract<BoardFeed, { from: 'way' }>,
  byId: Map<string, TreeBoard>,
  transaction: Transaction,
): Promise<BoardFeed> {
  const rows = await db().query<{ site_id: string; board_name: string; deleted: boolean }>(
    `SELECT b.site_id, b.name AS board_name, b.deleted_at IS NOT NULL AS deleted FROM ways w JOIN boards b ON b.id = w.board_id
     WHERE w.id = $1 AND b.id = $2 AND b.organisation_id = $3`,
    { bind: [feed.wayId, feed.boardId, actor.organisationId], type: QueryTypes.SELECT, transaction },
  );
  if (!rows.length || rows[0].deleted) throw notFound('The feeding way');
  if (rows[0].site_id !== board.siteId) {
    throw feedRefusal([
      { path: 'feed.boardId', message: `${rows[0].board_name} is on another site; a board is fed from its own site` },
    ]);
  }
  if (feed.boardId === board.id) {
    throw feedRefusal([{ path: 'feed.boardId', message: `${board.name} cannot be fed from one of its own ways` }]);
  }
  const parent = byId.get(feed.boardId)!;
  // A loop: follow the feeds up from the parent; meeting this board closes one
  const chain: TreeBoard[] = [];
  let at: TreeBoard | undefined = parent;
  while (at && !chain.includes(at)) {
    chain.push(at);
    if (at.id === board.id) break;
    at = at.feed.from === 'way' ? byId.get(at.feed.boardId) : undefined;
  }
  if (at?.id === board.id) {
    // In the direction the power would flow: this board feeds … feeds the parent, which would feed it
    const cycle = [...chain].reverse().map((b) => ({ boardId: b.id, name: b.name }));
    const names = [...cycle, cycle[0]].map((c) => c.name).join(' feeds ');
    throw feedRefusal([{ path: 'feed.boardId', message: `Boards cannot feed each other in a loop: ${names}` }], cycle);
  }
  const way = parent.ways.find((w) => w.id === feed.wayId)!;
  const label = labelsOf(parent).get(way.id) ?? null;
  const wayWords = `${label ? wayName(label) : 'The way'} of ${parent.name}`;
  const why = unfitReason(way, wayWords, board.name, board.phases);
  if (why) throw feedRefusal([{ path: 'feed.wayId', message: why }]);
  const taken = [...byId.values()].find(
    (b) => b.id !== board.id && b.feed.from === 'way' && b.feed.wayId === feed.wayId,
  );
  if (taken) {
    throw feedRefusal([
      { path: 'feed.wayId', message: `${wayWords} already feeds ${taken.name}; a way feeds one board` },
    ]);
  }
  return feed;
}

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
  if (plan.feed) {
    const f = plan.feed;
    const way = f.from === 'way' ? f : null;
    await db().query(
      `UPDATE boards SET fed_from_way_id = $2, sub_main_design_current_a = $3, sub_main_design_current_reason = $4,
         upstream_rcd_time_delayed = $5 WHERE id = $1`,
      {
        bind: [
          board.id,
          way?.wayId ?? null,
          way?.designCurrentOverride?.amps ?? null,
          way?.designCurrentOverride?.reason ?? null,
          way?.upstreamRcdTimeDelayed ?? false,
        ],
        transaction,
      },
    );
    await auditMany(actor, [{ action: 'board.feed-changed', details: { feed: f } }], {
      boardId: board.id,
      transaction,
    });
  }
  for (const c of plan.detach) {
    await db().query(
      `UPDATE boards SET fed_from_way_id = NULL, sub_main_design_current_a = NULL, sub_main_design_current_reason = NULL,
         upstream_rcd_time_delayed = false WHERE id = $1`,
      { bind: [c.boardId], transaction },
    );
    await auditMany(
      actor,
      [
        {
          action: 'board.feed-changed',
          details: {
            feed: { from: 'origin' },
            reason: c.reason,
            was: fedFromWords(c.from),
            note: `The way of ${board.name} that fed this board was removed; it is now fed from the origin.`,
          },
        },
      ],
      { boardId: c.boardId, transaction },
    );
  }
  return resizeSite(actor, plan.site, transaction, { writtenBoardId: board.id, cause: `${board.name} was changed` });
}
