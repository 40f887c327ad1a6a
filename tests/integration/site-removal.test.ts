import crypto from 'node:crypto';

import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';

import * as archiveRoute from '@/app/api/boards/[boardId]/archive/route';
import * as feedRoute from '@/app/api/boards/[boardId]/feed/route';
import * as restoreRoute from '@/app/api/boards/[boardId]/restore/route';
import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as undoRoute from '@/app/api/boards/[boardId]/undo-delete/route';
import * as treeRoute from '@/app/api/sites/[siteId]/tree/route';
import { describeAuditEntry } from '@/features/audit/utils/describe-event';
import type { BoardDto } from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import type { FeedChange, SiteTreeDto } from '@/lib/sites/tree-types';
import { AuditEvent, Board } from '@/models';

import { ctx, jsonRequest, makeOrganisation, signInAs } from './helpers';
import { answerOf, storedSizing, linkedTwoLevel as linkedTwoLevelOf } from './site-fixtures';

// Deleting, archiving, restoring and undeleting a board of a supply tree (two levels: Workshop
// DB1 feeds the finishing room's board from its way w-sub; tests/unit/supply/fixtures.ts). A
// board that feeds others is not removed unasked: 409 naming the boards fed from it; confirmed,
// they go back to the origin in the same request, with their history saying why, and the whole
// site is re-sized there and then (what is stored, read from board_sizings, never sized against
// a board that is gone).

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Removal');
});

const call = answerOf;

const url = (confirm: boolean) => `http://127.0.0.1/api${confirm ? '?confirmFeedChanges=1' : ''}`;
const remove = <T>(boardId: string, confirm: boolean, status = 200) =>
  call<T>(boardRoute.DELETE(jsonRequest('DELETE', undefined, url(confirm)), ctx({ boardId })), status);
const archive = <T>(boardId: string, confirm: boolean, status = 200) =>
  call<T>(archiveRoute.POST(jsonRequest('POST', undefined, url(confirm)), ctx({ boardId })), status);
const getBoard = (boardId: string) =>
  call<{ board: BoardDto }>(boardRoute.GET(jsonRequest('GET'), ctx({ boardId }))).then((b) => b.board);
const getTree = (siteId: string) =>
  call<{ tree: SiteTreeDto }>(treeRoute.GET(jsonRequest('GET'), ctx({ siteId }))).then((b) => b.tree);

/**
 * What is stored for a board now: the values carried to it and its outcome as the request stored
 * them; its whole sizing, when a change upstream left it pending, as its first read stores it,
 * checked against the hash the request stored (tests/integration/site-fixtures.ts).
 */
const stored = storedSizing;

async function fedFromWay(boardId: string): Promise<string | null> {
  const [row] = await db().query<{ fed_from_way_id: string | null }>(
    'SELECT fed_from_way_id FROM boards WHERE id = $1',
    { bind: [boardId], type: QueryTypes.SELECT },
  );
  return row.fed_from_way_id;
}

/** The two-level tree stored, given its origin and linked through the routes (site-fixtures.ts). */
async function linkedTwoLevel() {
  signInAs(team.users.designer);
  const linked = await linkedTwoLevelOf(team.org.id);
  // Linked: the finishing room is sized with what Workshop DB1's sub-main carries
  expect((await stored(linked.t.id('fin'))).carried?.from).toBe('way');
  return linked;
}

/** The finishing room is fed from the origin and sized with the origin's own values. */
async function expectAtOrigin(finId: string, originZe: number) {
  expect(await fedFromWay(finId)).toBeNull();
  const s = await stored(finId);
  expect(s.carried?.from).toBe('origin');
  expect(s.carried?.fedFrom).toBeNull();
  // At the origin, the board's "Zdb" is the origin's Ze itself (nothing below the intake)
  expect(s.carried?.supply.zeOhm).toBe(originZe);
  expect(s.version).toBe(s.boardVersion);
}

describe('removing a board of a supply tree', () => {
  it('deleting a board that feeds another asks first (409 naming it), and nothing changes', async () => {
    const { t } = await linkedTwoLevel();
    const res = await remove<{ error: string; feedChanges: FeedChange[] }>(t.id('db1'), false, 409);
    expect(res.error).toContain('Finishing room');
    expect(res.feedChanges).toEqual([
      expect.objectContaining({ boardId: t.id('fin'), to: 'origin', reason: 'board-removed' }),
    ]);
    expect(res.feedChanges[0].from).toMatchObject({ boardId: t.id('db1'), wayId: t.id('w-sub') });
    // Nothing written: Workshop DB1 is still there and still feeds the finishing room
    expect((await getBoard(t.id('db1'))).id).toBe(t.id('db1'));
    expect(await fedFromWay(t.id('fin'))).toBe(t.id('w-sub'));
  });

  it('confirmed, the boards fed from it go back to the origin in the same request, with history', async () => {
    const { t, fx } = await linkedTwoLevel();
    const res = await remove<{ effect: string; feedChanges: FeedChange[] }>(t.id('db1'), true);
    expect(res.effect).toBe('deleted');
    expect(res.feedChanges.map((c) => c.boardId)).toEqual([t.id('fin')]);
    await expectAtOrigin(t.id('fin'), fx.origin.zeOhm);
    const fin = await getBoard(t.id('fin'));
    expect(fin.feed).toEqual({ from: 'origin' });
    expect(fin.derivedSupply?.from).toBe('origin');
    const history = await AuditEvent.findAll({ where: { boardId: t.id('fin'), action: 'board.feed-changed' } });
    const entry = history.find((e) => (e.details as { reason?: string }).reason === 'board-removed')!;
    expect(describeAuditEntry({ action: entry.action, details: entry.details, wayLabel: null })).toBe(
      'fed the board from the site’s origin: Workshop DB1, which fed it, was deleted',
    );
    // The tree no longer has the deleted board, and the finishing room hangs from the origin
    const tree = await getTree(t.site.id);
    expect(tree.boards.map((b) => b.boardId)).toEqual([t.id('fin')]);
    expect(tree.boards[0].feed).toEqual({ from: 'origin' });
    expect(tree.edges).toEqual([]);
  });

  it('archiving a board that feeds another asks first, and confirmed detaches it (admins)', async () => {
    const { t, fx } = await linkedTwoLevel();
    signInAs(team.users.admin);
    const refused = await archive<{ feedChanges: FeedChange[] }>(t.id('db1'), false, 409);
    expect(refused.feedChanges.map((c) => c.name)).toEqual(['Finishing room board']);
    expect(await fedFromWay(t.id('fin'))).toBe(t.id('w-sub'));
    await archive(t.id('db1'), true);
    await expectAtOrigin(t.id('fin'), fx.origin.zeOhm);
    // Restored, Workshop DB1 takes up the feed its archive let go: the finishing room is fed
    // from its way again and sized with what it carries, in the same request
    await call(restoreRoute.POST(jsonRequest('POST'), ctx({ boardId: t.id('db1') })));
    expect(await fedFromWay(t.id('fin'))).toBe(t.id('w-sub'));
    expect((await stored(t.id('fin'))).carried?.from).toBe('way');
    const db1 = await stored(t.id('db1'));
    expect(db1.version).toBe(db1.boardVersion);
    const history = await AuditEvent.findAll({ where: { boardId: t.id('fin'), action: 'board.feed-changed' } });
    const entry = history.find((e) => (e.details as { reason?: string }).reason === 'board-returned')!;
    expect(describeAuditEntry({ action: entry.action, details: entry.details, wayLabel: null })).toBe(
      'fed the board again from Workshop DB1, way 1, as before Workshop DB1 was removed',
    );
  });

  it('undoing the delete of a board that fed another feeds that board from it again', async () => {
    const { t } = await linkedTwoLevel();
    await remove(t.id('db1'), true);
    expect(await fedFromWay(t.id('fin'))).toBeNull();
    await call(undoRoute.POST(jsonRequest('POST'), ctx({ boardId: t.id('db1') })));
    expect(await fedFromWay(t.id('fin'))).toBe(t.id('w-sub'));
    const fin = await getBoard(t.id('fin'));
    expect(fin.derivedSupply?.fedFrom).toMatchObject({ boardName: 'Workshop DB1', wayLabel: '1' });
    const tree = await getTree(t.site.id);
    expect(tree.edges).toEqual([expect.objectContaining({ fromWayId: t.id('w-sub'), toBoardId: t.id('fin') })]);
  });

  it('a feed taken meanwhile is not taken back: the board stays at the origin, its history says why', async () => {
    const { t, fx } = await linkedTwoLevel();
    await remove(t.id('fin'), false);
    // While the finishing room is deleted, another board of the site is fed from the freed way
    const finRow = await Board.findByPk(t.id('fin'));
    const spray = await Board.create({
      ...finRow!.get({ plain: true }),
      id: crypto.randomUUID(),
      name: 'Spray booth board',
      deletedAt: null,
      deletedById: null,
      fedFromWayId: null,
    });
    await call(
      feedRoute.PUT(
        jsonRequest('PUT', { feed: { from: 'way', boardId: t.id('db1'), wayId: t.id('w-sub') } }),
        ctx({ boardId: spray.id }),
      ),
    );
    await call(undoRoute.POST(jsonRequest('POST'), ctx({ boardId: t.id('fin') })));
    await expectAtOrigin(t.id('fin'), fx.origin.zeOhm);
    expect(await fedFromWay(spray.id)).toBe(t.id('w-sub'));
    const history = await AuditEvent.findAll({ where: { boardId: t.id('fin'), action: 'board.feed-changed' } });
    const entry = history.find((e) => (e.details as { reason?: string }).reason === 'board-returned')!;
    expect(describeAuditEntry({ action: entry.action, details: entry.details, wayLabel: null })).toBe(
      'kept the board fed from the site’s origin when Finishing room board came back: ' +
        'way 1 of Workshop DB1 already feeds Spray booth board; a way feeds one board',
    );
  });

  it('deleting a fed board takes its demand off the sub-main at once; undo feeds it from its way again', async () => {
    const { t } = await linkedTwoLevel();
    // The sub-main carries the finishing room's maximum demand, 13.75 A (tests/unit/supply)
    const subIb = async () => (await stored(t.id('db1'))).sizing?.ways.find((w) => w.id === t.id('w-sub'))?.result?.ibA;
    expect(await subIb()).toBeCloseTo(13.75, 9);
    // A board fed from a way feeds nothing: no question to ask
    const res = await remove<{ effect: string }>(t.id('fin'), false);
    expect(res.effect).toBe('deleted');
    // Its own link is let go (the way is free to feed another board) and its history says so
    expect(await fedFromWay(t.id('fin'))).toBeNull();
    const history = await AuditEvent.findAll({ where: { boardId: t.id('fin'), action: 'board.feed-changed' } });
    const entry = history.find((e) => (e.details as { reason?: string }).reason === 'board-removed')!;
    expect(describeAuditEntry({ action: entry.action, details: entry.details, wayLabel: null })).toBe(
      'let go of the way that fed the board (Workshop DB1, way 1): the board was deleted',
    );
    // Workshop DB1's sub-main now carries only its own typed load (0 W): re-sized in the request
    expect(await subIb()).toBe(0);
    const db1 = await stored(t.id('db1'));
    expect(db1.version).toBe(db1.boardVersion);
    // Undo: the board is back on the way that fed it (still free), and the sub-main carries its
    // demand again, all in the same request
    const back = await call<{ board: BoardDto }>(undoRoute.POST(jsonRequest('POST'), ctx({ boardId: t.id('fin') })));
    expect(await fedFromWay(t.id('fin'))).toBe(t.id('w-sub'));
    expect((await stored(t.id('fin'))).carried?.from).toBe('way');
    expect(await subIb()).toBeCloseTo(13.75, 9);
    expect(back.board.feed).toMatchObject({ from: 'way', boardId: t.id('db1'), wayId: t.id('w-sub') });
  });
});
