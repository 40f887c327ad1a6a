import { createHash } from 'node:crypto';
import { isDeepStrictEqual } from 'node:util';

import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';

import * as feedRoute from '@/app/api/boards/[boardId]/feed/route';
import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as originRoute from '@/app/api/sites/[siteId]/origin/route';
import type { BoardDto } from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import { readTreeBoards } from '@/lib/dal/board-repository';
import { sizingOutcome } from '@/lib/supply';
import { sizeTree } from '@/lib/supply/size-tree';
import type { SiteOrigin } from '@/lib/sites/tree-types';

import { threeLevel } from '../unit/supply/fixtures';
import { ctx, jsonRequest, makeOrganisation, signInAs } from './helpers';
import { storeTree } from './site-fixtures';

// A concurrent change to two boards of one tree must not leave a board sized against a stale
// parent. Each write that changes the tree locks the site row and re-sizes the whole site from
// what is committed (lib/dal/site-tree.ts); here real requests run at the same time, each in its
// own transaction on its own connection, and afterwards every stored sizing must be what sizing
// the committed tree gives now, at the board's current version and the site's tree version.

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Concurrent tree');
});

async function ok(res: Promise<Response>): Promise<void> {
  const r = await res;
  if (r.status !== 200) throw new Error(`${r.status}: ${await r.text()}`);
}

async function load(boardId: string): Promise<BoardDto> {
  const r = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }));
  return (await r.json()).board;
}

function saveBody(board: BoardDto, change: (ways: BoardDto['ways']) => void) {
  const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = board;
  const ways = structuredClone(board.ways);
  change(ways);
  return {
    version: board.version,
    settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
    ways: ways.map(({ id, rail, position, device, circuit }) => ({ id, rail, position, device, circuit })),
  };
}

/** Every board's stored sizing against the committed tree sized afresh. */
async function staleBoards(siteId: string, origin: SiteOrigin): Promise<string[]> {
  const boards = await readTreeBoards(siteId);
  const fresh = sizeTree(siteId, origin, boards);
  const [site] = await db().query<{ tree_version: number }>('SELECT tree_version FROM sites WHERE id = $1', {
    bind: [siteId],
    type: QueryTypes.SELECT,
  });
  const stale: string[] = [];
  for (const b of boards) {
    const want = fresh.boards.get(b.id)!;
    const got = b.stored;
    const same =
      got &&
      got.version === b.version &&
      // A sizing left pending by a change upstream (migration 0013): by its outcome, and its hash
      // when it has one (the whole sizing is made and stored by its first read)
      (got.pending
        ? isDeepStrictEqual(got.outcome, sizingOutcome(want.sizing!)) &&
          (!got.sha || got.sha === createHash('sha256').update(JSON.stringify(want.sizing)).digest('hex'))
        : JSON.stringify(got.sizing) === JSON.stringify(want.sizing)) &&
      isDeepStrictEqual(got.carried?.supply, want.carried?.supply) &&
      got.carried?.treeVersion === site.tree_version;
    if (!same) stale.push(b.name);
  }
  return stale;
}

describe('concurrent changes to one site tree', () => {
  it('saves of a parent, its child and the origin at once leave no board sized against a stale parent', async () => {
    signInAs(team.users.designer);
    const fx = threeLevel();
    const t = await storeTree(team.org.id, fx);
    await ok(originRoute.PUT(jsonRequest('PUT', fx.origin), ctx({ siteId: t.site.id })));
    await ok(
      feedRoute.PUT(
        jsonRequest('PUT', { feed: { from: 'way', boardId: t.id('db1'), wayId: t.id('w-ms') } }),
        ctx({ boardId: t.id('ms') }),
      ),
    );
    await ok(
      feedRoute.PUT(
        jsonRequest('PUT', { feed: { from: 'way', boardId: t.id('ms'), wayId: t.id('m-fin') } }),
        ctx({ boardId: t.id('fin') }),
      ),
    );
    let origin = fx.origin;
    for (let round = 1; round <= 6; round++) {
      const [db1, ms, fin] = await Promise.all([load(t.id('db1')), load(t.id('ms')), load(t.id('fin'))]);
      origin = { ...fx.origin, zeOhm: 0.2 + round / 100 };
      // At the same time: the top sub-main longer, the middle sub-main longer, the bottom load larger,
      // and the origin's Ze changed; each changes what the others carry or carry to
      await Promise.all([
        ok(
          boardRoute.PUT(
            jsonRequest(
              'PUT',
              saveBody(db1, (ways) => {
                const w = ways.find((x) => x.id === t.id('w-ms'))!;
                w.circuit = { ...w.circuit!, lengthM: 30 + round * 5 };
              }),
            ),
            ctx({ boardId: t.id('db1') }),
          ),
        ),
        ok(
          boardRoute.PUT(
            jsonRequest(
              'PUT',
              saveBody(ms, (ways) => {
                const w = ways.find((x) => x.id === t.id('m-fin'))!;
                w.circuit = { ...w.circuit!, lengthM: 15 + round * 3 };
              }),
            ),
            ctx({ boardId: t.id('ms') }),
          ),
        ),
        ok(
          boardRoute.PUT(
            jsonRequest(
              'PUT',
              saveBody(fin, (ways) => {
                const w = ways.find((x) => x.id === t.id('f-spray'))!;
                w.circuit = { ...w.circuit!, load: { kind: 'known', watts: 2300 + round * 200, powerFactor: 1 } };
              }),
            ),
            ctx({ boardId: t.id('fin') }),
          ),
        ),
        ok(originRoute.PUT(jsonRequest('PUT', origin), ctx({ siteId: t.site.id }))),
      ]);
      expect(await staleBoards(t.site.id, origin), `round ${round}`).toEqual([]);
    }
  });
});
