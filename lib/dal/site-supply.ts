import 'server-only';

import { QueryTypes, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import type { BoardDto } from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import { findBoard, readDraftTreeRows, readTreeBoards, writeBoard } from '@/lib/dal/board-repository';
import { assertSavable } from '@/lib/dal/boards';
import { lockSiteOfBoard } from '@/lib/dal/site-feed';
import type { AuditEntry } from '@/lib/dal/audit';
import { conflict, notFound } from '@/lib/errors';
import { treeDtoJson, treeDtoOf, treeOrder, treePartsJson, type TreeHead } from '@/lib/sites/tree-dto';
import type {
  BoardFeedInput,
  FedFrom,
  SiteOrigin,
  SiteOriginInput,
  SiteRipple,
  SiteTreeDto,
} from '@/lib/sites/tree-types';
import type { SupplyInput } from '@/lib/sizing';
import { unsizedBoard, type SiteResult } from '@/lib/supply';
import { originSupply, sizeTree } from '@/lib/supply/size-tree';

import {
  ARCHIVED_SITE,
  lockSite,
  presizeSite,
  presizeThenWrite,
  resizeSite,
  writePresizedSite,
  type SizedOut,
} from './site-tree';

/** The site tree's routes: the tree as the site view needs it, the origin, a board's feed. */

/** The caller's organisation's site row (404 otherwise). */
async function readSite(actor: Actor, siteId: string) {
  const rows = await db().query<TreeHead>(
    'SELECT id, name, origin, tree_version AS "treeVersion" FROM sites WHERE id = $1 AND organisation_id = $2',
    { bind: [siteId, actor.organisationId], type: QueryTypes.SELECT },
  );
  if (!rows.length) throw notFound('The site');
  return rows[0];
}

/** The caller's organisation's site's supply tree (404 otherwise), every board sized in it. */
export async function getSiteTree(actor: Actor, siteId: string): Promise<SiteTreeDto> {
  const site = await readSite(actor, siteId);
  const boards = await readTreeBoards(siteId, undefined, { stored: false });
  return treeDtoOf(site, boards, sizeTree(siteId, site.origin, boards));
}

/**
 * Sets the site's origin and re-sizes every board of the site in the same transaction (the
 * site row locked): answers the JSON text of `{ tree, ripple }` (`SiteTreeDto`, `SiteRipple`),
 * the tree's boards and edges as the presize wrote them. An archived site is read-only (409).
 */
export async function setSiteOrigin(actor: Actor, siteId: string, origin: SiteOriginInput): Promise<string> {
  const next = originSupply(origin);
  const cause = 'The site’s origin was changed';
  const events = (site: { origin: SiteOrigin | null }): AuditEntry[] => [
    { action: 'site.origin-changed', details: { siteId, from: site.origin, to: next }, boardId: null },
  ];
  // Sized before the lock, and written in two round trips when no board changed meanwhile (see
  // writePresizedSite); else read and re-sized under the lock
  const { site, ripple, parts } = await presizeThenWrite(
    siteId,
    () => presizeSite(actor, siteId, next),
    async (presized, written) => {
      const fast = await writePresizedSite(actor, siteId, presized, { cause, events, written });
      if (fast) return { ...fast, parts: () => presized.treeParts };
      return db().transaction(async (transaction) => {
        const site = await lockSite(actor, siteId, transaction);
        if (site.archived) throw conflict(ARCHIVED_SITE);
        const sizedOut: SizedOut = {};
        // The origin stored and its history entry recorded with the re-size's own writes
        const ripple = await resizeSite(actor, { ...site, origin: next }, transaction, {
          cause,
          sizedOut,
          origin: next,
          events: events(site),
        });
        // Everything written: the next write of the site may begin while this one commits
        written();
        const parts = (meta: TreeHead) => treePartsJson(treeDtoOf(meta, sizedOut.boards!, sizedOut.sized!));
        return { site, ripple, parts };
      });
    },
  );
  // The answer built once the site is free for the next write
  const meta = { ...site, origin: next, treeVersion: ripple.treeVersion };
  return `{"tree":${treeDtoJson(meta, parts(meta))},"ripple":${JSON.stringify(ripple)}}`;
}

/**
 * Sets where a board is fed from (lib/dal/site-feed.ts checks it), in one transaction with the
 * site and the board locked, and re-sizes the site. A stale `version` is 409; an archived board
 * or one in review is refused like a save.
 */
export async function setBoardFeed(
  actor: Actor,
  boardId: string,
  input: BoardFeedInput,
): Promise<{ board: BoardDto; ripple: SiteRipple | null }> {
  const out = { ripple: null as SiteRipple | null };
  const board = await db().transaction(async (transaction) => {
    await lockSiteOfBoard(actor, boardId, transaction, { tree: input.feed.from === 'way' });
    const row = await findBoard(actor, boardId, { transaction, lock: true });
    await assertSavable(row, input.version, transaction);
    const { feed, confirmFeedChanges } = input;
    return writeBoard(actor, row, { events: [], feed, confirmFeedChanges, out }, transaction);
  });
  return { board, ripple: out.ripple };
}

/**
 * What the tree gives a draft of a board (unsaved edits, or the stored board sent for review,
 * issued or printed): the supply carried to it (null: its typed supply), where it is fed from,
 * and the design current of each of its ways that feeds a board. 404 for another organisation's.
 */
export async function draftTreeContext(
  actor: Actor,
  boardId: string,
  transaction?: Transaction,
): Promise<{ supply: SupplyInput | null; subMains: Map<string, number>; fedFrom: FedFrom | null }> {
  const rows = await readDraftTreeRows(actor, boardId, transaction);
  if (!rows.length) throw notFound('The board');
  const { carried, feeds } = rows[0];
  const subMains = new Map<string, number>();
  for (const f of feeds ?? []) if (f.amps !== null) subMains.set(f.wayId, f.amps);
  const fedFrom = carried?.from === 'way' && !carried.problem ? carried.fedFrom : null;
  return { supply: carried?.supply ?? null, subMains, fedFrom };
}

/**
 * What the site pack prints (404 for another organisation's site): the site's name, the tree as
 * lib/supply answers it (the pack's diagram and carried values) and the boards whose schedules
 * follow, in tree order (archived boards are left out).
 */
export async function sitePackData(
  actor: Actor,
  siteId: string,
): Promise<{ siteName: string; site: SiteResult; boardIds: string[] }> {
  const site = await readSite(actor, siteId);
  const boards = (await readTreeBoards(siteId, undefined, { stored: false })).filter((b) => !b.archived);
  const sized = sizeTree(siteId, site.origin, boards);
  const inOrder = treeOrder(boards, sized);
  const byId = new Map(boards.map((b) => [b.id, b]));
  const results = inOrder.map((id) => {
    const s = sized.boards.get(id);
    return (
      s?.result ??
      unsizedBoard(byId.get(id)!, 0, `Cannot be sized: ${(s?.issues ?? []).map((i) => i.message).join('; ')}`)
    );
  });
  const origin = site.origin ?? sized.site.origin;
  return { siteName: site.name, site: { siteId, origin, boards: results }, boardIds: inOrder };
}
