import 'server-only';

import { isDeepStrictEqual } from 'node:util';

import { QueryTypes, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { engineInputOf, type BoardFeed, type BoardSettings, type WayInput } from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import {
  engineIssues,
  readTreeBoards,
  readTreeStored,
  sizeDesign,
  siteHasSubMains,
  siteIsTree,
} from '@/lib/dal/board-repository';
import { auditMany } from '@/lib/dal/audit';
import { conflict, HttpError, notFound, type FieldIssue } from '@/lib/errors';
import type { BoardStatus } from '@/lib/domain';
import { wayName } from '@/lib/names';
import type { DerivedSupply, RippleBoard, SiteOrigin, SiteRipple } from '@/lib/sites/tree-types';
import { parseBoardInput, type BoardInput, type BoardResult, type SupplyInput } from '@/lib/sizing';
import {
  sizeSite,
  sizingOutcome,
  SiteTreeError,
  wayLabels,
  type SiteBoardInput,
  type SiteBoardResult,
  type SiteResult,
  type SizingOutcome,
} from '@/lib/supply';

/**
 * A site's boards as one supply tree, on the server: the tree read from the database, sized with
 * lib/supply's `sizeSite` and stored with every board's sizing (`board_sizings`, with the values
 * carried to it and the site's tree version).
 *
 * Concurrency: every write that changes what is carried down (a board's design or feed, the
 * site's origin) locks the site row (`lockSite`, SELECT … FOR UPDATE) before it re-sizes, and
 * re-sizes the whole site from what is committed plus its own change. Writes on one tree are so
 * serialised on the site row, and the last one sizes every board against its parents' latest
 * state: no board is left sized against a stale parent. Each stored sizing records the site's
 * tree version it was carried at.
 */

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

/** One board of a site as the tree needs it: settings, ways, feed and what was stored for it. */
export type TreeBoard = BoardSettings & {
  id: string;
  status: BoardStatus;
  version: number;
  archived: boolean;
  ways: WayInput[];
  feed: BoardFeed;
  /**
   * What was stored for it: the whole sizing (`readTreeBoards` by default), or (`stored:
   * 'outcome'`) its `outcome` only, with the whole sizing only for a row stored without one.
   */
  stored: {
    version: number;
    sizing?: BoardResult | null;
    carried: DerivedSupply | null;
    outcome?: SizingOutcome | null;
  } | null;
};

/** What sizing the whole site gives each board: the stored form and the tree's values. */
export type SizedSite = {
  /** Per board: its sizing (null: the engine refused it), the issues, and what was carried to it. */
  boards: Map<
    string,
    { sizing: BoardResult | null; issues: FieldIssue[]; carried: DerivedSupply | null; result: SiteBoardResult | null }
  >;
  /** The tree as sizeSite answered it (boards it could size, parents first). */
  site: SiteResult;
  /** Feeds that could not be followed (a broken or refused link): board id → why. */
  detached: Map<string, string>;
};

/** The origin's supply fields alone (a board's typed supply less its volt drop used). */
export const originSupply = (o: SiteOrigin): SupplyInput => ({
  earthing: o.earthing,
  uoV: o.uoV,
  zeOhm: o.zeOhm,
  pfcKa: o.pfcKa,
  source: o.source,
});

/** The tree issues (lib/supply validateTree) that name a board's feed: board index → message. */
function feedIssues(err: SiteTreeError): Map<number, string> {
  const out = new Map<number, string>();
  for (const i of err.issues) {
    const m = /^boards\.(\d+)\.(feed|board)/.exec(i.path);
    if (m) out.set(Number(m[1]), [out.get(Number(m[1])), i.message].filter(Boolean).join('; '));
  }
  return out;
}

/**
 * Sizes a site's boards as one tree. The origin is the site's; a site without one yet sizes
 * each board fed from the origin with its own typed supply (as before the tree existed). A
 * board the engine refuses is stored with its issues and cannot feed anything; a board whose
 * feed cannot be followed (a refused parent, a way no longer fit to feed it) is sized with its
 * typed supply and says why (`problem`). Pure apart from nothing: no database.
 */
export function sizeTree(siteId: string, origin: SiteOrigin | null, boards: readonly TreeBoard[]): SizedSite {
  const out: SizedSite['boards'] = new Map();
  const detached = new Map<string, string>();
  const byId = new Map(boards.map((b) => [b.id, b]));
  // Boards the engine refuses on their own: stored with their issues, never in the tree. With
  // the site's origin, each board parsed here is handed to sizeSite (parsed once, not twice).
  const inTree = new Set<string>();
  const inputs = new Map(boards.map((b) => [b.id, engineInputOf(b, b.ways)]));
  const parsed = new Map<string, BoardInput>();
  for (const b of boards) {
    try {
      parsed.set(b.id, parseBoardInput({ ...inputs.get(b.id)!, supply: origin ? originSupply(origin) : b.supply }));
      inTree.add(b.id);
    } catch (err) {
      out.set(b.id, { sizing: null, issues: engineIssues(err), carried: null, result: null });
    }
  }
  // Feeds from a board outside the tree are cut
  const feedOf = new Map<string, BoardFeed>();
  for (const b of boards) {
    if (!inTree.has(b.id)) continue;
    if (b.feed.from === 'way' && !inTree.has(b.feed.boardId)) {
      const parent = byId.get(b.feed.boardId);
      detached.set(
        b.id,
        parent
          ? `${parent.name} cannot be sized (see its checks), so no values can be carried to ${b.name}.`
          : `The board that fed ${b.name} is no longer on the site.`,
      );
      feedOf.set(b.id, { from: 'origin' });
    } else feedOf.set(b.id, b.feed);
  }
  // Each group of boards under one origin: the site's, or (none given) each root's typed supply
  const roots = boards.filter((b) => inTree.has(b.id) && feedOf.get(b.id)?.from === 'origin');
  const groups: { origin: SiteOrigin; ids: string[] }[] = [];
  if (origin) groups.push({ origin, ids: boards.filter((b) => inTree.has(b.id)).map((b) => b.id) });
  else {
    const below = new Map<string, string[]>();
    for (const b of boards) {
      const f = feedOf.get(b.id);
      if (f?.from === 'way') below.set(f.boardId, [...(below.get(f.boardId) ?? []), b.id]);
    }
    const seen = new Set<string>();
    for (const r of roots) {
      const ids: string[] = [];
      const visit = (id: string) => {
        if (seen.has(id)) return;
        seen.add(id);
        ids.push(id);
        for (const c of below.get(id) ?? []) visit(c);
      };
      visit(r.id);
      groups.push({ origin: originSupply(r.supply), ids });
    }
    // Boards in a loop (never reached from a root): cut
    for (const b of boards) {
      if (inTree.has(b.id) && !seen.has(b.id)) {
        detached.set(b.id, `${b.name} is fed in a loop of boards.`);
        feedOf.set(b.id, { from: 'origin' });
        groups.push({ origin: originSupply(b.supply), ids: [b.id] });
      }
    }
  }

  const all: SiteBoardResult[] = [];
  for (const g of groups) {
    const members = g.ids.map((id) => byId.get(id)!);
    // A feed the tree refuses (a way no longer fit to feed, a loop) is cut, and the rest sized
    for (let attempt = 0; attempt <= members.length; attempt++) {
      const input: SiteBoardInput[] = members.map((b) => ({
        id: b.id,
        name: b.name,
        siteId,
        feed: feedOf.get(b.id)!,
        board: inputs.get(b.id)!,
      }));
      try {
        const sized = sizeSite({ siteId, origin: g.origin, boards: input, parsed: origin ? parsed : undefined });
        all.push(...sized.boards);
        break;
      } catch (err) {
        if (!(err instanceof SiteTreeError)) throw err;
        const bad = feedIssues(err);
        if (!bad.size) throw err;
        for (const [i, message] of bad) {
          const b = members[i];
          detached.set(b.id, message);
          feedOf.set(b.id, { from: 'origin' });
        }
      }
    }
  }

  for (const r of all) {
    const b = byId.get(r.boardId)!;
    const problem = r.problem ?? detached.get(b.id) ?? null;
    let sizing = r.sizing;
    let issues: FieldIssue[] = [];
    if (!sizing || detached.has(b.id)) {
      // Nothing could be carried to it: sized with the origin's or its typed supply, saying why
      ({ sizing, issues } = sizeDesign({ ...b, supply: origin ? originSupply(origin) : b.supply }));
    }
    const fromWay = b.feed.from === 'way';
    const carried: DerivedSupply | null =
      !origin && !fromWay
        ? null
        : {
            from: fromWay ? 'way' : 'origin',
            supply: r.supply && !detached.has(b.id) ? r.supply : origin ? originSupply(origin) : b.supply,
            fedFrom: detached.has(b.id) ? null : r.fedFrom,
            phase: r.phase,
            zdb: detached.has(b.id) ? null : r.zdb,
            pfc: detached.has(b.id) ? null : r.pfc,
            vdUsed: detached.has(b.id) ? null : r.vdUsed,
            subMainCurrent: detached.has(b.id) ? null : r.subMainCurrent,
            problem,
            treeVersion: 0,
          };
    out.set(b.id, { sizing, issues, carried, result: { ...r, problem, sizing } });
  }
  return { boards: out, site: { siteId, origin: origin ?? groups[0]?.origin ?? null!, boards: all }, detached };
}

/** A board's way labels ("3L2"), by way id. */
export const wayLabelsOf = (b: TreeBoard) => wayLabels({ phases: b.phases, ways: engineInputOf(b, b.ways).ways });

/** What a stored sizing gave: its way verdicts and worst verdict (its stored outcome, else from the sizing). */
function storedOutcome(stored: NonNullable<TreeBoard['stored']>): SizingOutcome | null {
  return stored.outcome ?? (stored.sizing ? sizingOutcome(stored.sizing) : null);
}

// Compared as values: the stored copy is jsonb, which orders its keys its own way
const sameSupply = (a: SupplyInput | null | undefined, b: SupplyInput | null | undefined) =>
  isDeepStrictEqual(a ?? null, b ?? null);
const sameOrigin = (a: SiteOrigin | null, b: SiteOrigin | null) => isDeepStrictEqual(a, b);

/**
 * Re-sizes every board of the site (the caller holds the site row: `lockSite`), stores each
 * board's sizing with what was carried to it, raises the site's tree version, and records in
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
  } = {},
): Promise<SiteRipple> {
  const pre = opts.presized && !opts.only && sameOrigin(opts.presized.origin, site.origin) ? opts.presized : null;
  const current = pre ? await readTreeStored(site.id, transaction) : null;
  let boards: TreeBoard[];
  let sized: SizedSite;
  let sizingJson: ReadonlyMap<string, string | null> | null = null;
  if (
    pre &&
    current &&
    current.length === pre.boards.length &&
    current.every((c, i) => c.id === pre.boards[i].id && c.version === pre.boards[i].version)
  ) {
    // Nobody changed a board since it was sized (each write of a board or its ways raises its
    // version): that sizing is the committed tree's, compared with what is stored now
    boards = pre.boards.map((b, i) => ({ ...b, stored: current[i].stored }));
    ({ sized, sizingJson } = pre);
  } else {
    boards = await readTreeBoards(site.id, transaction, { only: opts.only, stored: 'outcome' });
    sized = sizeTree(site.id, site.origin, boards);
  }
  if (opts.sizedOut) Object.assign(opts.sizedOut, { sized, boards });
  const treeVersion = opts.only ? site.treeVersion : site.treeVersion + 1;
  if (!opts.only) {
    await db().query('UPDATE sites SET tree_version = $2 WHERE id = $1', { bind: [site.id, treeVersion], transaction });
  }

  const rows: {
    board_id: string;
    version: number;
    sizing: string | null;
    issues: string;
    carried: string | null;
    outcome: string | null;
  }[] = [];
  const ripple: RippleBoard[] = [];
  for (const b of boards) {
    const s = sized.boards.get(b.id);
    if (!s) continue;
    const carried = s.carried && { ...s.carried, treeVersion };
    const outcome = s.sizing && sizingOutcome(s.sizing);
    rows.push({
      board_id: b.id,
      version: b.version,
      sizing: sizingJson?.has(b.id) ? sizingJson.get(b.id)! : s.sizing && JSON.stringify(s.sizing),
      issues: JSON.stringify(s.issues),
      carried: carried && JSON.stringify(carried),
      outcome: outcome && JSON.stringify(outcome),
    });
    const was = b.stored ? storedOutcome(b.stored) : null;
    const before = new Map(Object.entries(was?.verdicts ?? {}));
    const after = new Map(Object.entries(outcome?.verdicts ?? {}));
    const labels = wayLabelsOf(b);
    const changedWays = [...new Set([...before.keys(), ...after.keys()])]
      .filter((id) => before.get(id) !== after.get(id))
      .map((wayId) => ({
        wayId,
        wayLabel: labels.get(wayId) ?? null,
        before: before.get(wayId) ?? null,
        after: after.get(wayId) ?? null,
      }));
    // A board never sized before has nothing to compare with
    if (!b.stored) continue;
    const supplyChanged = !sameSupply(b.stored.carried?.supply, s.carried?.supply);
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
  if (rows.length) {
    // Each sizing its own bind parameter (sent as text, parsed once by PostgreSQL), not one
    // JSON document holding the sizings as escaped strings
    const bind: unknown[] = [treeVersion];
    const values = rows.map((r) => {
      const at = bind.push(r.board_id, r.version, r.sizing, r.issues, r.carried, r.outcome);
      return `($${at - 5}::uuid, $${at - 4}::int, $${at - 3}::json, $${at - 2}::jsonb, $${at - 1}::jsonb, $${at}::jsonb, $1::int)`;
    });
    await db().query(
      `INSERT INTO board_sizings (board_id, version, sizing, issues, carried, outcome, tree_version)
       VALUES ${values.join(', ')}
       ON CONFLICT (board_id) DO UPDATE SET version = EXCLUDED.version, sizing = EXCLUDED.sizing,
         issues = EXCLUDED.issues, carried = EXCLUDED.carried, outcome = EXCLUDED.outcome,
         tree_version = EXCLUDED.tree_version`,
      { bind, transaction },
    );
  }
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
  /** Each board's sizing as the JSON text to store. */
  sizingJson: ReadonlyMap<string, string | null>;
};

/**
 * Reads and sizes the caller's organisation's site with `origin`, before the site row is locked:
 * the engine and the serialising of the sizings then run while other writes of the same site hold
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
  const sizingJson = new Map([...sized.boards].map(([id, b]) => [id, b.sizing && JSON.stringify(b.sizing)]));
  return { origin, boards, sized, sizingJson };
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
  await db().transaction(async (transaction) => {
    const site = await lockSite(actor, board.siteId, transaction, 'update');
    await resizeSite(actor, site, transaction, { cause: 'The stored sizing was older than the board' });
  });
  return true;
}
