import 'server-only';

import AsyncLock from 'async-lock';
import { QueryTypes, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import {
  readTreeBoards,
  readTreeStored,
  siteHasStaleSizing,
  siteHasSubMains,
  siteIsTree,
  sizingHash,
  writeTreeSizings,
  type TreeSizingRow,
} from '@/lib/dal/board-repository';
import { auditMany } from '@/lib/dal/audit';
import { conflict, HttpError, notFound, type FieldIssue } from '@/lib/errors';
import { reviewSizingOf } from '@/lib/boards/review-page-data';
import { wayName } from '@/lib/names';
import type { RippleBoard, SiteOrigin, SiteRipple } from '@/lib/sites/tree-types';
import { sizingOutcome } from '@/lib/supply';
import {
  sameOrigin,
  sameSupply,
  sizeTree,
  storedOutcome,
  wayLabelsOf,
  type SizedSite,
  type TreeBoard,
} from '@/lib/supply/size-tree';

/**
 * A site's boards as one supply tree, on the server: the tree read from the database, sized with
 * lib/supply's `sizeTree` (size-tree.ts) and stored in `board_sizings`: for every board the values
 * carried to it, its outcome and the site's tree version; its whole sizing now for the board
 * written, at its first read for any other whose sizing changed (`pending`, migration 0013).
 *
 * Concurrency: every write that changes what is carried down (a board's design or feed, the
 * site's origin) locks the site row (`lockSite`, SELECT … FOR UPDATE) before it re-sizes, and
 * re-sizes the whole site from what is committed plus its own change. Writes on one tree are so
 * serialised on the site row, and the last one sizes every board against its parents' latest
 * state: no board is left sized against a stale parent. Each stored sizing records the site's
 * tree version it was carried at.
 */

/**
 * Re-sizes of one site run one at a time in this process (`oneSiteWriteAtATime`). The site row's
 * lock is what keeps them right; this only keeps a burst of them (an origin changed again and
 * again, ten readers of a site left pending) from sizing the site side by side and then queueing
 * on that lock with their results held: on one event loop that cost every request of the process
 * time, and the one holding the lock waited behind the others' sizing.
 */
const siteWrites = new AsyncLock({ maxPending: Infinity });

/** Runs `f` once no other re-size of the site is running in this process. */
export function oneSiteWriteAtATime<T>(siteId: string, f: () => Promise<T>): Promise<T> {
  return siteWrites.acquire(siteId, f);
}

/** The site row as locked, and how (`share`: boards of a site without sub-mains, written side by side). */
export type SiteLock = {
  id: string;
  name: string;
  origin: SiteOrigin | null;
  treeVersion: number;
  archived: boolean;
  mode: 'share' | 'update';
};

/** The site locks each transaction holds (a lock is taken once per transaction and site). */
const held = new WeakMap<Transaction, Map<string, SiteLock>>();

/** The lock this transaction holds on the site, if any. */
export function heldSiteLock(transaction: Transaction, siteId: string): SiteLock | null {
  return held.get(transaction)?.get(siteId) ?? null;
}

/**
 * The site row, locked for the rest of the transaction (404 for another organisation's):
 * `update` (SELECT … FOR UPDATE) for a write on a tree, `share` (FOR SHARE) for a board of a site
 * whose boards are independent (no sub-mains), so that those saves run side by side while a
 * tree write (a first link, an origin change) waits for them and they for it. A transaction
 * never upgrades a share lock (two would deadlock): it asks for the mode it needs first.
 */
export async function lockSite(
  actor: Pick<Actor, 'organisationId'>,
  siteId: string,
  transaction: Transaction,
  mode: 'share' | 'update' = 'update',
): Promise<SiteLock> {
  const prior = heldSiteLock(transaction, siteId);
  if (prior && (prior.mode === 'update' || mode === 'share')) return prior;
  if (prior) throw conflict('The site’s supply tree changed while this was being saved; save again.');
  const rows = await db().query<Omit<SiteLock, 'mode'>>(
    `SELECT id, name, origin, tree_version AS "treeVersion", archived_at IS NOT NULL AS archived FROM sites
     WHERE id = $1 AND organisation_id = $2 ${mode === 'update' ? 'FOR UPDATE' : 'FOR SHARE'}`,
    { bind: [siteId, actor.organisationId], type: QueryTypes.SELECT, transaction },
  );
  if (!rows.length) throw notFound('The site');
  const lock: SiteLock = { ...rows[0], mode };
  if (!held.has(transaction)) held.set(transaction, new Map());
  held.get(transaction)!.set(siteId, lock);
  return lock;
}

/**
 * Locks the site for a board write: `update` when the site has sub-mains or the write links a
 * board (`tree`), else `share`. A first link that commits between the look and the lock is
 * caught after it (the write is refused with 409, to be saved again).
 */
export async function lockSiteForWrite(
  actor: Pick<Actor, 'organisationId'>,
  siteId: string,
  transaction: Transaction,
  opts: { tree?: boolean } = {},
): Promise<SiteLock> {
  const prior = heldSiteLock(transaction, siteId);
  if (prior && (prior.mode === 'update' || !opts.tree)) return prior;
  const mode = opts.tree || (await siteHasSubMains(siteId, transaction)) ? 'update' : 'share';
  const lock = await lockSite(actor, siteId, transaction, mode);
  if (mode === 'share' && (await siteHasSubMains(siteId, transaction))) {
    throw conflict('The site’s supply tree changed while this was being saved; save again.');
  }
  return lock;
}

/**
 * Re-sizes every board of the site (the caller holds the site row: `lockSite`), stores each
 * board's outcome with what was carried to it (and its whole sizing, or `pending`: see `store`),
 * raises the site's tree version, and records in
 * the history of every board other than `writtenBoardId` whose supply or verdicts changed that
 * its supply changed, with the ways whose verdict changed. Answers the ripple for the whole site.
 */
export async function resizeSite(
  actor: Actor,
  site: { id: string; origin: SiteOrigin | null; treeVersion: number },
  transaction: Transaction,
  opts: {
    writtenBoardId?: string | null;
    cause?: string;
    /** Hands back the boards as read and their sizing (to answer the tree without sizing it twice). */
    sizedOut?: { sized?: SizedSite; boards?: TreeBoard[] };
    /**
     * Only this board (a site without sub-mains under a share lock: its boards are independent,
     * so the others are unchanged and the tree version stays).
     */
    only?: string;
    /** The site sized before the lock was taken (`presizeSite`): used when its boards are still the committed ones. */
    presized?: PresizedSite;
    /**
     * 'all': every board's sizing is stored whole (a read found one pending). Otherwise only the
     * written board's (`writtenBoardId`, `only`); any other whose sizing changed is left pending.
     */
    store?: 'all';
  } = {},
): Promise<SiteRipple> {
  const pre = opts.presized && !opts.only && sameOrigin(opts.presized.origin, site.origin) ? opts.presized : null;
  const current = pre ? await readTreeStored(site.id, transaction) : null;
  let boards: TreeBoard[];
  let sized: SizedSite;
  if (
    pre &&
    current &&
    current.length === pre.boards.length &&
    current.every((c, i) => c.id === pre.boards[i].id && c.version === pre.boards[i].version)
  ) {
    // Nobody changed a board since it was sized (each write of a board or its ways raises its
    // version): that sizing is the committed tree's, compared with what is stored now
    boards = pre.boards.map((b, i) => ({ ...b, stored: current[i].stored }));
    ({ sized } = pre);
  } else {
    boards = await readTreeBoards(site.id, transaction, { only: opts.only, stored: 'outcome' });
    sized = sizeTree(site.id, site.origin, boards);
  }
  if (opts.sizedOut) Object.assign(opts.sizedOut, { sized, boards });
  const treeVersion = opts.only ? site.treeVersion : site.treeVersion + 1;
  if (!opts.only) {
    await db().query('UPDATE sites SET tree_version = $2 WHERE id = $1', { bind: [site.id, treeVersion], transaction });
  }

  // Each board's row: its sizing written whole (the board written, or every board when
  // `store` is 'all'), kept (the very text stored already), or left to its first read (`pending`)
  const rows: TreeSizingRow[] = [];
  const ripple: RippleBoard[] = [];
  for (const b of boards) {
    const s = sized.boards.get(b.id);
    if (!s) continue;
    const carried = s.carried && { ...s.carried, treeVersion };
    const outcome = s.sizing && sizingOutcome(s.sizing);
    const supplyChanged = !b.stored || !sameSupply(b.stored.carried?.supply, s.carried?.supply);
    const whole = opts.store === 'all' || b.id === opts.writtenBoardId || b.id === opts.only || s.sizing === null;
    // The JSON text (and its hash) only of a sizing to store, or that may be the one stored: a
    // board whose supply changed is left pending unmade (its checks carry the supply's values)
    const text = whole || (!supplyChanged && !b.stored?.pending) ? s.sizing && JSON.stringify(s.sizing) : null;
    const sha = sizingHash(text);
    // The very text stored already is kept, if the review page's cut of it was stored with it
    // (a row stored before migration 0015 is written whole again)
    const same = sha !== null && b.stored?.sha === sha && !b.stored.pending;
    const write = same && b.stored?.review ? 'keep' : whole || same ? 'whole' : 'pending';
    rows.push({
      board_id: b.id,
      version: b.version,
      write,
      sizing: text,
      sha,
      issues: JSON.stringify(s.issues),
      carried: carried && JSON.stringify(carried),
      outcome: outcome && JSON.stringify(outcome),
      review: write === 'whole' && s.sizing ? JSON.stringify(reviewSizingOf(s.sizing)) : null,
    });
    const was = b.stored ? storedOutcome(b.stored) : null;
    const before = new Map(Object.entries(was?.verdicts ?? {}));
    const after = new Map(Object.entries(outcome?.verdicts ?? {}));
    const changed = [...new Set([...before.keys(), ...after.keys()])].filter((id) => before.get(id) !== after.get(id));
    // The way labels only when a verdict changed (the rail's layout, for nothing otherwise)
    const labels = changed.length ? wayLabelsOf(b) : null;
    const changedWays = changed.map((wayId) => ({
      wayId,
      wayLabel: labels?.get(wayId) ?? null,
      before: before.get(wayId) ?? null,
      after: after.get(wayId) ?? null,
    }));
    // A board never sized before has nothing to compare with
    if (!b.stored) continue;
    if (!changedWays.length && !supplyChanged) continue;
    ripple.push({
      boardId: b.id,
      name: b.name,
      supplyChanged,
      worstBefore: was?.worst ?? null,
      worstAfter: s.result?.worstVerdict ?? outcome?.worst ?? null,
      changedWays,
    });
  }
  await writeTreeSizings(rows, treeVersion, transaction);
  // Each board below whose supply or verdicts changed: its history says so (one insert for all)
  await auditMany(
    actor,
    ripple
      .filter((r) => r.boardId !== opts.writtenBoardId)
      .map((r) => ({
        action: 'board.supply-changed' as const,
        boardId: r.boardId,
        details: {
          cause: opts.cause ?? 'A change upstream',
          supplyChanged: r.supplyChanged,
          ways: r.changedWays.map((w) => ({
            wayId: w.wayId,
            way: w.wayLabel ? wayName(w.wayLabel) : null,
            before: w.before,
            after: w.after,
          })),
        },
      })),
    { transaction },
  );
  return { siteId: site.id, treeVersion, boards: ripple };
}

/** A site sized outside its lock (`presizeSite`), for `resizeSite` to use if nothing changed meanwhile. */
export type PresizedSite = {
  origin: SiteOrigin | null;
  boards: TreeBoard[];
  sized: SizedSite;
};

/**
 * Reads and sizes the caller's organisation's site with `origin`, before the site row is locked:
 * the engine then runs while other writes of the same site hold
 * its lock, and the locked section (`resizeSite` with `presized`) only checks that every board is
 * still at the version sized (else it reads and sizes again, under the lock), compares and stores.
 */
export async function presizeSite(
  actor: Pick<Actor, 'organisationId'>,
  siteId: string,
  origin: SiteOrigin | null,
): Promise<PresizedSite> {
  const boards = await readTreeBoards(siteId, undefined, { stored: false, organisationId: actor.organisationId });
  const sized = sizeTree(siteId, origin, boards);
  return { origin, boards, sized };
}

/** A feed that cannot be: 422 naming the field, and the boards of a loop when it is one. */
export function feedRefusal(issues: FieldIssue[], cycle?: { boardId: string; name: string }[]): HttpError {
  return new HttpError(422, issues.map((i) => i.message).join('; '), { issues, ...(cycle ? { cycle } : {}) });
}

/**
 * Re-sizes the site of a board whose stored sizing is older than the board (a board linked by a
 * seed or a script, a version moved on by an archive) when the board is in a tree: the site has
 * an origin or sub-mains. Answers false when it is not (the board alone is sized as before).
 */
export async function resizeSiteOfStaleBoard(actor: Actor, board: { id: string; siteId: string }): Promise<boolean> {
  const tree = await siteIsTree(actor, board.siteId);
  if (!tree) return false;
  await oneSiteWriteAtATime(board.siteId, () =>
    db().transaction(async (transaction) => {
      const site = await lockSite(actor, board.siteId, transaction, 'update');
      // Another reader may have stored them all meanwhile
      if (!(await siteHasStaleSizing(site.id, transaction))) return;
      await resizeSite(actor, site, transaction, { cause: 'The stored sizing was older than the board', store: 'all' });
    }),
  );
  return true;
}
