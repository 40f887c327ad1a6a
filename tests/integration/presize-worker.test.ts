/**
 * A production server sizes a site ahead of its write in the presize pool's thread
 * (lib/sites/presize-pool.ts), from the boards' JSON texts; tests and `next dev` size it in this
 * process. The worker is bundled as scripts/build-workers.mjs bundles it, and each check holds the
 * worker's answers to the in-process ones for the same site: the same briefs and tree, the same
 * stored rows and the same answer from the origin's route.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import * as originRoute from '@/app/api/sites/[siteId]/origin/route';
import * as treeRoute from '@/app/api/sites/[siteId]/tree/route';
import { db } from '@/lib/db';
import { readTreeBoards } from '@/lib/dal/board-repository';
import { presizeTree } from '@/lib/sites/presize';
import * as presizePool from '@/lib/sites/presize-pool';
import type { SiteRipple, SiteTreeDto } from '@/lib/sites/tree-types';

import { ctx, jsonRequest, makeOrganisation, signInAs } from './helpers';
import { answerOf, linkedTwoLevel, sizingRow } from './site-fixtures';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
const workerFile = path.join(process.cwd(), '.data', `presize-worker-${crypto.randomUUID().slice(0, 8)}.mjs`);

beforeAll(async () => {
  const { buildPresizeWorker } = (await import(path.join(process.cwd(), 'scripts/build-workers.mjs'))) as {
    buildPresizeWorker: (out: string) => Promise<string>;
  };
  await buildPresizeWorker(workerFile);
  team = await makeOrganisation('Presize worker');
}, 60_000);

afterAll(async () => {
  delete process.env.PRESIZE_WORKER_FILE;
  await presizePool.closePresizePool();
  fs.rmSync(workerFile, { force: true });
});

/** Runs `f` with the presize pool's thread (`on`) or in this process. */
async function withWorker<T>(on: boolean, f: () => Promise<T>): Promise<T> {
  if (on) process.env.PRESIZE_WORKER_FILE = workerFile;
  else delete process.env.PRESIZE_WORKER_FILE;
  try {
    return await f();
  } finally {
    delete process.env.PRESIZE_WORKER_FILE;
  }
}

/** The two-level demo tree stored and linked (site-fixtures.ts), signed in as its designer. */
async function linked() {
  signInAs(team.users.designer);
  return linkedTwoLevel(team.org.id);
}

describe('the presize worker', () => {
  it('answers what sizing the site in this process answers, for the boards as read and after a change', async () => {
    const { fx, t } = await linked();
    const boards = await readTreeBoards(t.site.id, undefined, { stored: false });
    for (const zeOhm of [0.35, 0.8, 0.35]) {
      const task = { siteId: t.site.id, origin: { ...fx.origin, zeOhm }, boards };
      const inWorker = await withWorker(true, () => presizePool.runPresize(task));
      expect(inWorker).toEqual(presizeTree(task));
      // The carried Ze is the origin's (a board fed from the origin), so the worker did size it
      const parts = JSON.parse(inWorker.treeParts) as Pick<SiteTreeDto, 'boards' | 'edges'>;
      const db1 = parts.boards.find((b) => b.boardId === t.id('db1'))!;
      expect(db1.zdb?.value).toBeCloseTo(zeOhm, 9);
    }
  });

  it('gives the origin’s route the answer and the stored rows of a re-size in this process', async () => {
    const a = await linked();
    const b = await linked();
    // One site re-sized through the worker, its twin in this process, with the same new origin
    const origin = { ...a.fx.origin, zeOhm: 0.9 };
    const put = (siteId: string) =>
      answerOf<{ tree: SiteTreeDto; ripple: SiteRipple }>(originRoute.PUT(jsonRequest('PUT', origin), ctx({ siteId })));
    const viaWorker = await withWorker(true, () => put(a.t.site.id));
    const here = await withWorker(false, () => put(b.t.site.id));

    // The same answer but for the ids, names of the site and the tree version
    const anon = (x: unknown, t: typeof a.t) => {
      let text = JSON.stringify(x);
      for (const [id, uuid] of t.ids) text = text.split(uuid).join(`<${id}>`);
      return JSON.parse(text.split(t.site.id).join('<site>')) as Record<string, unknown>;
    };
    const strip = ({ tree, ripple }: { tree: SiteTreeDto; ripple: SiteRipple }) => ({
      tree: { ...tree, siteName: null, treeVersion: null, boards: tree.boards.map((x) => ({ ...x, name: null })) },
      ripple: { ...ripple, treeVersion: null, boards: ripple.boards.map((x) => ({ ...x, name: null })) },
    });
    expect(anon(strip(viaWorker), a.t)).toEqual(anon(strip(here), b.t));
    // The change reached the finishing room: its supply changed in the ripple
    expect(viaWorker.ripple.boards.find((x) => x.boardId === a.t.id('fin'))?.supplyChanged).toBe(true);

    // The tree as the site view reads it (sized in this process) is the route's answer
    const read = await answerOf<{ tree: SiteTreeDto }>(treeRoute.GET(jsonRequest('GET'), ctx({ siteId: a.t.site.id })));
    expect(read.tree).toEqual(viaWorker.tree);

    // The stored rows: the same carried values, outcome and issues, at the new tree version
    for (const id of ['db1', 'fin']) {
      const [x, y] = [await sizingRow(a.t.id(id)), await sizingRow(b.t.id(id))];
      const row = (r: typeof x) => ({
        ...r,
        treeVersion: null,
        carried: r.carried && { ...r.carried, treeVersion: null },
      });
      expect(anon(row(x), a.t)).toEqual(anon(row(y), b.t));
    }
  });

  it('the same origin again through the worker keeps the rows stored, as in this process', async () => {
    const { fx, t } = await linked();
    const put = () =>
      answerOf<{ tree: SiteTreeDto; ripple: SiteRipple }>(
        originRoute.PUT(jsonRequest('PUT', fx.origin), ctx({ siteId: t.site.id })),
      );
    const first = await withWorker(true, put);
    const again = await withWorker(true, put);
    // Nothing changed below: no board in the ripple, the tree the same but its version
    expect(again.ripple.boards).toEqual([]);
    expect({ ...again.tree, treeVersion: 0 }).toEqual({ ...first.tree, treeVersion: 0 });
    expect(again.tree.treeVersion).toBe(first.tree.treeVersion + 1);
  });

  it('sizes from the boards read before; one changed since is caught under the lock and the site sized again', async () => {
    const { fx, t } = await linked();
    // The site view's read: the boards are held for the next presize
    await answerOf(treeRoute.GET(jsonRequest('GET'), ctx({ siteId: t.site.id })));
    // The spray booth's circuit made 120 m long behind the app's back (the database raises
    // the board's version, migration 0008)
    await db().query(`UPDATE ways SET circuit = jsonb_set(circuit, '{lengthM}', '120') WHERE id = $1`, {
      bind: [t.id('f-spray')],
    });
    const origin = { ...fx.origin, zeOhm: 0.4 };
    const answer = await withWorker(true, () =>
      answerOf<{ tree: SiteTreeDto; ripple: SiteRipple }>(
        originRoute.PUT(jsonRequest('PUT', origin), ctx({ siteId: t.site.id })),
      ),
    );
    // The answer and the stored row are the changed board's: as a fresh read sizes it
    const read = await answerOf<{ tree: SiteTreeDto }>(treeRoute.GET(jsonRequest('GET'), ctx({ siteId: t.site.id })));
    expect(answer.tree).toEqual(read.tree);
    const row = await sizingRow(t.id('fin'));
    expect(row.version).toBe(row.boardVersion);
    // 120 m of 2.5 mm² on a 16 A breaker fails its volt drop or Zs (it passed at 10 m)
    expect(row.outcome?.verdicts[t.id('f-spray')]).toBe('fails');
    expect(answer.ripple.boards.find((b) => b.boardId === t.id('fin'))?.changedWays.map((w) => w.wayId)).toContain(
      t.id('f-spray'),
    );
  });
});
