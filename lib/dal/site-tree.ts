import 'server-only';

import AsyncLock from 'async-lock';
import { QueryTypes, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { asOneStatement, db, inFewTrips, type Statement } from '@/lib/db';
import {
  forgetTreeBoards,
  heldTreeBoards,
  readTreeBoards,
  treeStoredOf,
  treeStoredStatement,
  type TreeStored,
  siteHasStaleSizing,
  siteHasSubMains,
  siteIsTree,
  sizingHash,
  treeSizingStatements,
  type TreeSizingRow,
} from '@/lib/dal/board-repository';
import { auditStatement, type AuditEntry } from '@/lib/dal/audit';
import { conflict, HttpError, notFound, type FieldIssue } from '@/lib/errors';
import { reviewSizingOf } from '@/lib/boards/review-page-data';
import { wayName } from '@/lib/names';
import type { RippleBoard, SiteOrigin, SiteRipple } from '@/lib/sites/tree-types';
import { runPresize } from '@/lib/sites/presize-pool';
import type { PresizeAnswer } from '@/lib/sites/presize';
import {
  briefsOf,
  sameSupply,
  sizeTree,
  storedOutcome,
  wayLabelsOf,
  type SizedBrief,
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

/** The one re-size of each site being sized ahead of its turn to write (`presizeThenWrite`). */
const sitePresizes = new AsyncLock({ maxPending: Infinity });

/**
 * Runs `presize` (reads and sizing, no lock held in the database), then `write` with its answer
 * once no other re-size of the site is running in this process (`oneSiteWriteAtATime`). One
 * re-size of a site is sized while the one before it writes: the event loop sizes the next while
 * PostgreSQL stores the last, and no more than one sizing waits with its result held. `write`
 * calls `written` once its last statement is done: the next write of the site then begins its
 * transaction while this one commits (it waits for the site row's lock in the database, which is
 * what keeps the writes right).
 */
export function presizeThenWrite<P, T>(
  siteId: string,
  presize: () => Promise<P>,
  write: (presized: P, written: () => void) => Promise<T>,
): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    sitePresizes.acquire(siteId, (release) => {
      presize().then(
        (presized) =>
          oneSiteWriteAtATime(siteId, () => {
            // The next re-size of the site may size once this one's turn to write has come
            release();
            let written!: () => void;
            const turn = new Promise<void>((done) => (written = done));
            const result = write(presized, written);
            result.then(written, written);
            result.then(resolve, reject);
            return turn;
          }),
        (err: unknown) => {
          release();
          reject(err);
        },
      );
    });
  });
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
  const { sql, bind } = siteLockStatement(actor, siteId, mode);
  const rows = await db().query<Omit<SiteLock, 'mode'>>(sql, { bind, type: QueryTypes.SELECT, transaction });
  if (!rows.length) throw notFound('The site');
  const lock: SiteLock = { ...rows[0], mode };
  if (!held.has(transaction)) held.set(transaction, new Map());
  held.get(transaction)!.set(siteId, lock);
  return lock;
}

/** The statement of `lockSite`. */
const siteLockStatement = (
  actor: Pick<Actor, 'organisationId'>,
  siteId: string,
  mode: 'share' | 'update',
): Statement => ({
  sql: `SELECT id, name, origin, tree_version AS "treeVersion", archived_at IS NOT NULL AS archived FROM sites
     WHERE id = $1 AND organisation_id = $2 ${mode === 'update' ? 'FOR UPDATE' : 'FOR SHARE'}`,
  bind: [siteId, actor.organisationId],
});

/** An archived site refuses every write (409). */
export const ARCHIVED_SITE = 'This site is archived, so it is read-only; an admin may restore it.';

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

/** How `resizeSite` re-sizes and what it records. */
export type ResizeOptions = {
  writtenBoardId?: string | null;
  cause?: string;
  /** Hands back the boards as read and their sizing (to answer the tree without sizing it twice). */
  sizedOut?: SizedOut;
  /**
   * Only this board (a site without sub-mains under a share lock: its boards are independent,
   * so the others are unchanged and the tree version stays).
   */
  only?: string;
  /**
   * 'all': every board's sizing is stored whole (a read found one pending). Otherwise only the
   * written board's (`writtenBoardId`, `only`); any other whose sizing changed is left pending.
   */
  store?: 'all';
  /** The site's new origin, stored with the tree version (the caller holds the site as changed: `site.origin`). */
  origin?: SiteOrigin;
  /** History entries of the write itself, recorded before those of the boards below. */
  events?: AuditEntry[];
};

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
  opts: ResizeOptions = {},
): Promise<SiteRipple> {
  const boards = await readTreeBoards(site.id, transaction, { only: opts.only, stored: 'outcome' });
  const sized = sizeTree(site.id, site.origin, boards);
  const briefs = briefsOf(sized);
  if (opts.sizedOut) Object.assign(opts.sizedOut, { boards, sized });
  const { ripple, writes } = planResize(actor, site, { boards, briefs, sized }, opts);
  if (writes.length) {
    const { sql, bind } = asOneStatement(writes);
    await db().query(sql, { bind, transaction });
  }
  return ripple;
}

/**
 * The boards as presized with what is stored for them now, if they are still the committed ones
 * (same boards, same versions: each write of a board or its ways raises its version), so that
 * the presize's sizing is the committed tree's. Else null, and the boards held for a presize are
 * forgotten (out of date: the next presize reads them again).
 */
function presizedWithStored(siteId: string, pre: PresizedSite, current: readonly TreeStored[]): TreeBoard[] | null {
  const same =
    current.length === pre.boards.length &&
    current.every((c, i) => c.id === pre.boards[i].id && c.version === pre.boards[i].version);
  if (!same) {
    forgetTreeBoards(siteId);
    return null;
  }
  return pre.boards.map((b, i) => ({ ...b, stored: current[i].stored }));
}

type PlanOptions = Pick<ResizeOptions, 'store' | 'writtenBoardId' | 'only' | 'origin' | 'events' | 'cause'>;

/** A board's sizing is stored whole: every board's (`store`), the written board's, or a refused board's. */
const storedWhole = (b: TreeBoard, brief: SizedBrief | undefined, opts: PlanOptions) =>
  opts.store === 'all' || b.id === opts.writtenBoardId || b.id === opts.only || brief?.refused === true;

/** Whether the values carried to the board are not the stored ones. */
const supplyChangedOf = (b: TreeBoard, brief: SizedBrief | undefined) =>
  !b.stored || !sameSupply(b.stored.carried?.supply, brief?.carried?.supply);

/**
 * Whether the board's sizing itself is needed (its JSON text and hash): to store it whole, or
 * because it may be the one stored. A board whose supply changed is left pending unmade (its
 * checks carry the supply's values).
 */
const needsSizing = (b: TreeBoard, brief: SizedBrief | undefined, opts: PlanOptions) =>
  brief?.refused === false && (storedWhole(b, brief, opts) || (!supplyChangedOf(b, brief) && !b.stored?.pending));

const needsSizings = (boards: readonly TreeBoard[], briefs: Map<string, SizedBrief>, opts: PlanOptions) =>
  boards.some((b) => needsSizing(b, briefs.get(b.id), opts));

/**
 * What a re-size writes (the site's tree version, and origin when given; each board's row; the
 * history) and answers, from the boards with what is stored for them, each one's brief and,
 * when `needsSizings`, the sizings themselves.
 */
function planResize(
  actor: Actor,
  site: { id: string; treeVersion: number },
  { boards, briefs, sized }: { boards: readonly TreeBoard[]; briefs: Map<string, SizedBrief>; sized: SizedSite | null },
  opts: PlanOptions,
): { ripple: SiteRipple; writes: Statement[] } {
  const treeVersion = opts.only ? site.treeVersion : site.treeVersion + 1;
  const siteWrite: Statement | null = opts.origin
    ? {
        sql: 'UPDATE sites SET origin = $3::jsonb, tree_version = $2, updated_at = now() WHERE id = $1',
        bind: [site.id, treeVersion, JSON.stringify(opts.origin)],
      }
    : opts.only
      ? null
      : { sql: 'UPDATE sites SET tree_version = $2 WHERE id = $1', bind: [site.id, treeVersion] };

  // Each board's row: its sizing written whole (the board written, or every board when
  // `store` is 'all'), kept (the very text stored already), or left to its first read (`pending`)
  const rows: TreeSizingRow[] = [];
  const ripple: RippleBoard[] = [];
  for (const b of boards) {
    const brief = briefs.get(b.id);
    if (!brief) continue;
    const carried = brief.carried && { ...brief.carried, treeVersion };
    const { outcome } = brief;
    const full = needsSizing(b, brief, opts) ? sized!.boards.get(b.id)!.sizing : null;
    const text = full && JSON.stringify(full);
    const sha = sizingHash(text);
    // The very text stored already is kept, if the review page's cut of it was stored with it
    // (a row stored before migration 0015 is written whole again)
    const same = sha !== null && b.stored?.sha === sha && !b.stored.pending;
    const write = same && b.stored?.review ? 'keep' : storedWhole(b, brief, opts) || same ? 'whole' : 'pending';
    rows.push({
      board_id: b.id,
      version: b.version,
      write,
      sizing: text,
      sha,
      issues: JSON.stringify(brief.issues),
      carried: carried && JSON.stringify(carried),
      outcome: outcome && JSON.stringify(outcome),
      review: write === 'whole' && full ? JSON.stringify(reviewSizingOf(full)) : null,
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
    const supplyChanged = supplyChangedOf(b, brief);
    if (!changedWays.length && !supplyChanged) continue;
    ripple.push({
      boardId: b.id,
      name: b.name,
      supplyChanged,
      worstBefore: was?.worst ?? null,
      worstAfter: brief.worst,
      changedWays,
    });
  }
  // Each board below whose supply or verdicts changed: its history says so. The site, the
  // boards' rows and the history are written in one statement
  const history = auditStatement(actor, [
    ...(opts.events ?? []),
    ...ripple
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
  ]);
  const writes = [siteWrite, ...treeSizingStatements(rows, treeVersion), history].filter((w) => w !== null);
  return { ripple: { siteId: site.id, treeVersion, boards: ripple }, writes };
}

/** What `resizeSite` hands back to answer the tree without sizing it twice: the boards as read and their sizing. */
export type SizedOut = { boards?: TreeBoard[]; sized?: SizedSite };

/** A site sized outside its lock (`presizeSite`), for `writePresizedSite` to write if nothing changed meanwhile. */
export type PresizedSite = PresizeAnswer & {
  origin: SiteOrigin | null;
  boards: TreeBoard[];
};

/**
 * Reads and sizes the caller's organisation's site with `origin`, before the site row is locked
 * (in the presize pool's thread on a production server, lib/sites/presize-pool.ts): the engine
 * then runs while other writes of the same site hold its lock, and the locked section
 * (`writePresizedSite`) only checks that every board is still at the version sized, compares and
 * stores.
 */
export async function presizeSite(
  actor: Pick<Actor, 'organisationId'>,
  siteId: string,
  origin: SiteOrigin | null,
): Promise<PresizedSite> {
  // The boards as last read, if any (`writePresizedSite` compares their versions with the
  // committed ones under the lock, and writes nothing when they are not)
  const boards =
    heldTreeBoards(siteId, actor.organisationId) ??
    (await readTreeBoards(siteId, undefined, { stored: false, organisationId: actor.organisationId }));
  return { origin, boards, ...(await runPresize({ siteId, origin, boards })) };
}

/**
 * Writes the re-size of a presized site (`presizeSite`) in two round trips (lib/db.ts
 * `inFewTrips`): the site row locked with what is stored for its boards read after the lock,
 * then the writes of `planResize` with COMMIT. Answers null, having written nothing, when its
 * boards are no longer the ones presized or a board's sizing is needed whole (to store it, or to
 * compare it with the stored one): the caller then re-sizes under `lockSite` as before. 404 for
 * another organisation's site, 409 for an archived one.
 */
export async function writePresizedSite(
  actor: Actor,
  siteId: string,
  presized: PresizedSite,
  opts: {
    cause: string;
    events: (site: SiteLock) => AuditEntry[];
    /** Called as the last trip (the writes and COMMIT) is sent: the next write of the site may begin. */
    written?: () => void;
  },
): Promise<{ site: SiteLock; ripple: SiteRipple } | null> {
  return inFewTrips(async (trip) => {
    const [locked, stored] = await trip([siteLockStatement(actor, siteId, 'update'), treeStoredStatement(siteId)]);
    if (!locked.length) throw notFound('The site');
    const site: SiteLock = { ...(locked[0] as Omit<SiteLock, 'mode'>), mode: 'update' };
    if (site.archived) throw conflict(ARCHIVED_SITE);
    const boards = presizedWithStored(siteId, presized, treeStoredOf(stored));
    if (!boards) return null;
    const plan: PlanOptions = { origin: presized.origin ?? undefined, cause: opts.cause, events: opts.events(site) };
    if (needsSizings(boards, presized.briefs, plan)) return null;
    const { ripple, writes } = planResize(actor, site, { boards, briefs: presized.briefs, sized: null }, plan);
    // The next write of the site sends its lock now: PostgreSQL grants it as this one commits,
    // and what it reads after the lock is what this one committed
    const last = trip([asOneStatement(writes)], 'commit');
    opts.written?.();
    await last;
    return { site, ripple };
  });
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
