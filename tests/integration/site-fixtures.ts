import crypto from 'node:crypto';

import { QueryTypes } from 'sequelize';
import { expect } from 'vitest';

import * as feedRoute from '@/app/api/boards/[boardId]/feed/route';
import * as sizingRoute from '@/app/api/boards/[boardId]/sizing/route';
import * as originRoute from '@/app/api/sites/[siteId]/origin/route';
import { reviewSizingOf, type ReviewSizing } from '@/lib/boards/review-page-data';
import type { BoardSettings, WayInput } from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import type { DerivedSupply } from '@/lib/sites/tree-types';
import type { BoardResult, Verdict } from '@/lib/sizing';
import type { SiteTreeInput } from '@/lib/supply';
import { Board, Site, Way } from '@/models';

import { twoLevel } from '../unit/supply/fixtures';
import { ctx, jsonRequest } from './helpers';

/**
 * A site tree of lib/supply's unit fixtures (tests/unit/supply/fixtures.ts, hand-worked there)
 * stored as boards and ways of one site of an organisation, with the feeds left "from the
 * origin" (the tests link them through the routes). Ids are fresh; `ids` maps the fixture's.
 */
export async function storeTree(organisationId: string, tree: SiteTreeInput, opts: { siteName?: string } = {}) {
  const site = await Site.create({ organisationId, name: opts.siteName ?? `Tree ${crypto.randomUUID().slice(0, 6)}` });
  const ids = new Map<string, string>();
  const boards = new Map<string, Board>();
  for (const b of tree.boards) {
    ids.set(b.id, crypto.randomUUID());
    for (const w of b.board.ways) ids.set(w.id, crypto.randomUUID());
  }
  for (const b of tree.boards) {
    const settings: BoardSettings = {
      name: b.name,
      location: '',
      phases: b.board.phases,
      // Typed values unlike the origin's: a board fed from a way must not be sized with them
      supply: { earthing: 'TT', uoV: 230, zeOhm: 21, pfcKa: 0.5, source: 'public' },
      incoming: b.board.incoming as BoardSettings['incoming'],
      enclosureModules: b.board.enclosureModules,
      rails: 1,
      dwelling: b.board.dwelling ?? false,
    };
    const row = await Board.create({ ...settings, id: ids.get(b.id), organisationId, siteId: site.id });
    boards.set(b.id, row);
    const ways: WayInput[] = b.board.ways.map((w, position) => ({
      id: ids.get(w.id)!,
      rail: 0,
      position,
      device: structuredClone(w.device) as WayInput['device'],
      circuit: structuredClone(w.circuit ?? null) as WayInput['circuit'],
    }));
    await Way.bulkCreate(ways.map((w) => ({ ...w, boardId: row.id })));
  }
  return { site, ids, boards, id: (fixtureId: string) => ids.get(fixtureId)! };
}

/** A board's row of `board_sizings` as stored, read straight from the table. */
export type SizingRow = {
  sizing: BoardResult | null;
  text: string | null;
  sha: string | null;
  pending: boolean;
  outcome: { verdicts: Record<string, Verdict>; worst: Verdict } | null;
  review: ReviewSizing | null;
  carried: DerivedSupply | null;
  version: number;
  boardVersion: number;
  treeVersion: number | null;
};

/** What is stored for a board now, without any route re-sizing it on the way. */
export async function sizingRow(boardId: string): Promise<SizingRow> {
  const [row] = await db().query<SizingRow>(
    `SELECT s.sizing, s.sizing::text AS text, encode(s.sizing_sha256, 'hex') AS sha, s.pending, s.outcome, s.review, s.carried,
       s.version, b.version AS "boardVersion", s.tree_version AS "treeVersion"
     FROM board_sizings s JOIN boards b ON b.id = s.board_id WHERE s.board_id = $1`,
    { bind: [boardId], type: QueryTypes.SELECT },
  );
  return row;
}

/**
 * The board's stored sizing as a reader gets it: a sizing left pending by a change upstream
 * (migration 0013) is stored by its first read (the sizing route, signed in as the caller's
 * user). What the change upstream stored at once must be what that read sizes from what was
 * committed: the same outcome (way verdicts, worst verdict), values carried and, when it left
 * one, the same hash.
 */
export async function storedSizing(boardId: string): Promise<SizingRow> {
  const now = await sizingRow(boardId);
  if (!now.pending) {
    expect(now.review, 'the review page’s cut, stored with it').toEqual(now.sizing && reviewSizingOf(now.sizing));
    return now;
  }
  expect(now.sizing, 'a pending sizing is not stored').toBeNull();
  expect(now.review, 'nor its cut for the review page').toBeNull();
  const res = await sizingRoute.POST(jsonRequest('POST'), ctx({ boardId }));
  await res.arrayBuffer();
  const read = await sizingRow(boardId);
  expect(read.pending, 'stored by its first read').toBe(false);
  expect(crypto.createHash('sha256').update(read.text!).digest('hex')).toBe(read.sha);
  if (now.sha !== null) expect(read.sha, 'the hash left while pending is the stored text’s').toBe(now.sha);
  expect(now.outcome, 'the outcome stored while pending is the stored sizing’s').toEqual(read.outcome);
  expect(now.carried?.supply, 'the supply carried').toEqual(read.carried?.supply);
  expect(read.review, 'the review page’s cut, stored with it').toEqual(read.sizing && reviewSizingOf(read.sizing));
  return read;
}

/** A route's JSON answer, which must have `status` (else the test fails with the body). */
export async function answerOf<T>(res: Promise<Response>, status = 200): Promise<T> {
  const r = await res;
  const body = await r.json();
  if (r.status !== status) throw new Error(`expected ${status}, got ${r.status}: ${JSON.stringify(body)}`);
  return body as T;
}

/**
 * The two-level tree (tests/unit/supply/fixtures.ts `twoLevel`) stored for the organisation,
 * given its origin and linked through the routes: Workshop DB1's way w-sub feeds the finishing
 * room. The caller is signed in as a designer of that organisation.
 */
export async function linkedTwoLevel(organisationId: string) {
  const fx = twoLevel();
  const t = await storeTree(organisationId, fx);
  await answerOf(originRoute.PUT(jsonRequest('PUT', fx.origin), ctx({ siteId: t.site.id })));
  await answerOf(
    feedRoute.PUT(
      jsonRequest('PUT', { feed: { from: 'way', boardId: t.id('db1'), wayId: t.id('w-sub') } }),
      ctx({ boardId: t.id('fin') }),
    ),
  );
  return { fx, t };
}
