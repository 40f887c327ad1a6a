import { beforeAll, describe, expect, it } from 'vitest';

import * as feedRoute from '@/app/api/boards/[boardId]/feed/route';
import * as approveRoute from '@/app/api/boards/[boardId]/review/approve/route';
import * as submitRoute from '@/app/api/boards/[boardId]/submit/route';
import * as originRoute from '@/app/api/sites/[siteId]/origin/route';
import type { BoardSnapshot } from '@/lib/boards/revision-diff';
import type { BoardResult } from '@/lib/sizing';
import { db } from '@/lib/db';
import { BoardRevision } from '@/models';

import { twoLevel } from '../unit/supply/fixtures';
import { ctx, jsonRequest, makeOrganisation, signInAs } from './helpers';
import { storeTree } from './site-fixtures';

// Issuing a board of a supply tree freezes it as the tree sizes it: a board fed from a way with
// the supply carried down to it (not its typed one, which the tree does not use), and a board
// with a sub-main with the design current of the board it feeds. The carried values are worked
// by hand in tests/unit/supply/carried-values.test.ts (the same two-level fixture) and checked
// through the routes in tests/integration/site-tree.test.ts.

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Issue tree');
});

async function ok(res: Promise<Response>) {
  const r = await res;
  expect(r.status, await r.clone().text()).toBe(200);
  return r.json();
}

async function issue(boardId: string) {
  signInAs(team.users.designer);
  await ok(submitRoute.POST(jsonRequest('POST', {}), ctx({ boardId })));
  signInAs(team.users.inspector);
  await ok(
    approveRoute.POST(
      jsonRequest('POST', { acknowledgeFailures: true, declaration: team.users.inspector.name }),
      ctx({ boardId }),
    ),
  );
  const revision = await BoardRevision.findOne({ where: { boardId }, order: [['revision', 'DESC']] });
  return revision as unknown as { snapshot: BoardSnapshot & { fedFrom?: string | null }; sizing: BoardResult };
}

describe('issuing a board of a supply tree', () => {
  it('freezes the fed board with the carried supply and the feeding board with its sub-main’s load', async () => {
    signInAs(team.users.designer);
    const fx = twoLevel();
    const t = await storeTree(team.org.id, fx);
    await ok(originRoute.PUT(jsonRequest('PUT', fx.origin), ctx({ siteId: t.site.id })));
    await ok(
      feedRoute.PUT(
        jsonRequest('PUT', { feed: { from: 'way', boardId: t.id('db1'), wayId: t.id('w-sub') } }),
        ctx({ boardId: t.id('fin') }),
      ),
    );

    const fin = await issue(t.id('fin'));
    // Zdb = 0.35 + 0.093696 = 0.443696 Ω; the spray booth's Zs = 0.443696 + 0.23412 = 0.677816 Ω
    // and its volt drop limit 5 − 0.561957 = 4.438043 % (the same values as the tree's own sizing)
    expect(fin.snapshot.settings.supply.zeOhm).toBeCloseTo(0.443696, 6);
    expect(fin.snapshot.settings.supply.earthing).toBe('TN-C-S');
    expect(fin.snapshot.fedFrom).toBe('Workshop DB1, way 1');
    const spray = fin.sizing.ways.find((w) => w.id === t.id('f-spray'))?.result;
    expect(spray?.zsOhm).toBeCloseTo(0.677816, 6);
    expect(spray?.vdLimitPct).toBeCloseTo(4.438043, 5);

    const db1 = await issue(t.id('db1'));
    // Fed from the origin: its supply is the origin's, and it names no feeding way
    expect(db1.snapshot.settings.supply.zeOhm).toBe(0.35);
    expect(db1.snapshot.fedFrom ?? null).toBeNull();
    // The sub-main carries the finishing room's maximum demand, 13.75 A
    const sub = db1.sizing.ways.find((w) => w.id === t.id('w-sub'))?.result;
    expect(sub?.ibA).toBeCloseTo(13.75, 9);
  });

  it('waits for a change upstream that holds the site, so the supply it freezes is the one committed', async () => {
    signInAs(team.users.designer);
    const fx = twoLevel();
    const t = await storeTree(team.org.id, fx);
    await ok(originRoute.PUT(jsonRequest('PUT', fx.origin), ctx({ siteId: t.site.id })));
    await ok(submitRoute.POST(jsonRequest('POST', {}), ctx({ boardId: t.id('db1') })));
    // A tree write in progress elsewhere: the site's row locked, as every upstream change locks it
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    let locked!: () => void;
    const isLocked = new Promise<void>((resolve) => (locked = resolve));
    const writer = db().transaction(async (transaction) => {
      await db().query('SELECT id FROM sites WHERE id = $1 FOR UPDATE', { bind: [t.site.id], transaction });
      locked();
      await held;
    });
    await isLocked;
    signInAs(team.users.inspector);
    let done = false;
    const approving = approveRoute
      .POST(
        jsonRequest('POST', { acknowledgeFailures: true, declaration: team.users.inspector.name }),
        ctx({ boardId: t.id('db1') }),
      )
      .finally(() => (done = true));
    await new Promise((r) => setTimeout(r, 400));
    expect(done).toBe(false);
    release();
    await writer;
    expect((await approving).status).toBe(200);
  });
});
