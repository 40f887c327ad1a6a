import pg from 'pg';
import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it, vi } from 'vitest';

import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as sizingRoute from '@/app/api/boards/[boardId]/sizing/route';
import * as originRoute from '@/app/api/sites/[siteId]/origin/route';
import { REVIEW_CUT, reviewSizingOf } from '@/lib/boards/review-page-data';
import type { BoardDto } from '@/lib/boards/schemas';
import { db } from '@/lib/db';
import { readTreeBoards } from '@/lib/dal/board-repository';
import { presizeSite, writePresizedSite } from '@/lib/dal/site-tree';
import { sizeTree } from '@/lib/supply/size-tree';
import type { SiteRipple } from '@/lib/sites/tree-types';
import { ENGINE_REVISION, type BoardResult, type Verdict } from '@/lib/sizing';
import { worstVerdictOf } from '@/lib/supply';
import { AuditEvent } from '@/models';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';
import { answerOf, sizingRow, storedSizing, linkedTwoLevel as linkedTwoLevelOf } from './site-fixtures';

// A re-size compares each board's new way verdicts with the stored ones. It reads them from the
// stored outcome (board_sizings.outcome, migration 0012: way id → verdict, and the worst
// verdict), written with every stored sizing, not from the whole sizing; a row stored without
// one (before the migration) is compared whole. Here the outcome must always be the stored
// sizing in brief, and the ripple the same whichever way it was read.

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Resize');
});

const call = answerOf;

/** The stored sizing in brief, worked out here from the sizing itself. */
function brief(sizing: BoardResult) {
  return {
    verdicts: Object.fromEntries(sizing.ways.flatMap((w) => (w.result ? [[w.id, w.result.verdict]] : []))),
    worst: worstVerdictOf(sizing, []),
  };
}

/** The two-level tree stored, given its origin and linked through the routes (site-fixtures.ts). */
async function linkedTwoLevel() {
  signInAs(team.users.designer);
  return linkedTwoLevelOf(team.org.id);
}

/** Saves Workshop DB1 with its sub-main (way w-sub) `lengthM` long, through the board route. */
async function subMainLength(t: Awaited<ReturnType<typeof linkedTwoLevel>>['t'], lengthM: number) {
  const db1 = (await call<{ board: BoardDto }>(boardRoute.GET(jsonRequest('GET'), ctx({ boardId: t.id('db1') }))))
    .board;
  const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = db1;
  const ways = db1.ways.map(({ id, rail, position, device, circuit }) => ({ id, rail, position, device, circuit }));
  const sub = ways.find((w) => w.id === t.id('w-sub'))!;
  sub.circuit = { ...sub.circuit!, lengthM };
  await call(
    boardRoute.PUT(
      jsonRequest('PUT', {
        version: db1.version,
        settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
        ways,
      }),
      ctx({ boardId: t.id('db1') }),
    ),
  );
}

describe('re-sizing a site compares the stored outcome', () => {
  it('a change upstream stores every board’s outcome at once and its whole sizing at its first read', async () => {
    signInAs(team.users.designer);
    const { fx, t } = await linkedTwoLevel();
    const next = { ...fx.origin, zeOhm: 1.2 };
    await call(originRoute.PUT(jsonRequest('PUT', next), ctx({ siteId: t.site.id })));
    const fresh = sizeTree(t.site.id, next, await readTreeBoards(t.site.id));
    const outcomes = new Map<string, unknown>();
    for (const id of ['db1', 'fin']) {
      const row = await sizingRow(t.id(id));
      expect(row.pending, id).toBe(true);
      expect(row.sizing, id).toBeNull();
      expect(row.outcome, id).toEqual(brief(fresh.boards.get(t.id(id))!.sizing!));
      outcomes.set(id, row.outcome);
    }
    // The first read (of either board) stores both, with the outcome stored before
    await storedSizing(t.id('fin'));
    for (const id of ['db1', 'fin']) {
      const row = await sizingRow(t.id(id));
      expect(row.pending, id).toBe(false);
      expect(row.sizing, id).toEqual(fresh.boards.get(t.id(id))!.sizing);
      expect(row.outcome, id).toEqual(outcomes.get(id));
      expect(row.outcome, id).toEqual(brief(row.sizing!));
    }
  });

  it('a board sized alone (no tree) is stored with its outcome too', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'workshop');
    await call(sizingRoute.POST(jsonRequest('POST'), ctx({ boardId: board.id })));
    const row = await sizingRow(board.id);
    expect(row.pending).toBe(false);
    expect(row.sizing).not.toBeNull();
    expect(row.outcome).toEqual(brief(row.sizing!));
  });

  it('a sizing stored without an outcome (before migration 0012) is compared whole: the same ripple', async () => {
    signInAs(team.users.designer);
    const { fx, t } = await linkedTwoLevel();
    const was = (await storedSizing(t.id('fin'))).sizing!;
    const wasVerdicts = brief(was).verdicts;
    await db().query('UPDATE board_sizings SET outcome = NULL WHERE board_id = $1', { bind: [t.id('fin')] });
    // Ze 0.35 → 2.6 Ω: the spray booth's Zs = 2.6 + 0.093696 (the sub-main) + 0.23412 (its own
    // R1+R2) = 2.927816 Ω, above the 0.95 × 230 / (5 × 16) = 2.73 Ω a B16 allows (BS 7671 Table
    // 41.3, 0.4 s; Cmin 0.95)
    const { ripple } = await call<{ ripple: SiteRipple }>(
      originRoute.PUT(jsonRequest('PUT', { ...fx.origin, zeOhm: 2.6 }), ctx({ siteId: t.site.id })),
    );
    const fin = ripple.boards.find((b) => b.boardId === t.id('fin'));
    expect(fin?.worstBefore).toBe(worstVerdictOf(was, []));
    const spray = fin?.changedWays.find((w) => w.wayId === t.id('f-spray'));
    expect(spray?.before).toBe(wasVerdicts[t.id('f-spray')]);
    expect(spray?.before).not.toBeNull();
    expect(spray?.after).toBe('fails');
    // The history says the same, and the row has its outcome again
    const events = await AuditEvent.findAll({ where: { boardId: t.id('fin'), action: 'board.supply-changed' } });
    const newest = events.sort((a, b) => Number(b.id) - Number(a.id))[0];
    expect((newest.details as { ways: { wayId: string; before: Verdict }[] }).ways).toContainEqual(
      expect.objectContaining({ wayId: t.id('f-spray'), before: wasVerdicts[t.id('f-spray')] }),
    );
    const row = await storedSizing(t.id('fin'));
    expect(row.outcome).toEqual(brief(row.sizing!));
  });

  it('the ripple read from the outcome is the one read from the whole sizing', async () => {
    signInAs(team.users.designer);
    const a = await linkedTwoLevel();
    const b = await linkedTwoLevel();
    // Both sites' sizings stored whole (a pending row always has its outcome); then site b's
    // rows without outcome (compared whole), site a's with it
    for (const x of [a, b]) await storedSizing(x.t.id('db1'));
    await db().query('UPDATE board_sizings SET outcome = NULL WHERE board_id = ANY($1::uuid[])', {
      bind: [[b.t.id('db1'), b.t.id('fin')]],
    });
    const strip = (r: SiteRipple, t: typeof a.t) =>
      r.boards.map((x) => ({
        board: [...['db1', 'fin']].find((k) => t.id(k) === x.boardId),
        supplyChanged: x.supplyChanged,
        worstBefore: x.worstBefore,
        worstAfter: x.worstAfter,
        ways: x.changedWays.map((w) => [w.wayLabel, w.before, w.after]),
      }));
    for (const zeOhm of [1.2, 0.35, 1.2]) {
      const ra = await call<{ ripple: SiteRipple }>(
        originRoute.PUT(jsonRequest('PUT', { ...a.fx.origin, zeOhm }), ctx({ siteId: a.t.site.id })),
      );
      const rb = await call<{ ripple: SiteRipple }>(
        originRoute.PUT(jsonRequest('PUT', { ...b.fx.origin, zeOhm }), ctx({ siteId: b.t.site.id })),
      );
      expect(strip(ra.ripple, a.t)).toEqual(strip(rb.ripple, b.t));
      expect(ra.ripple.boards.length).toBeGreaterThan(0);
    }
  });

  it('a site sized before the lock writes nothing on the two-trip way when a board changed meanwhile', async () => {
    signInAs(team.users.designer);
    const { fx, t } = await linkedTwoLevel();
    const u = team.users.designer;
    const actor = {
      userId: u.id,
      organisationId: team.org.id,
      role: 'designer' as const,
      name: u.name,
      email: u.email,
    };
    const next = { ...fx.origin, zeOhm: 0.8 };
    const presized = await presizeSite(actor, t.site.id, next);
    // Meanwhile (committed before the lock is taken) the sub-main becomes 400 m long
    await subMainLength(t, 400);
    const siteRow = () =>
      db().query<{ origin: unknown; tree_version: number }>('SELECT origin, tree_version FROM sites WHERE id = $1', {
        bind: [t.site.id],
        type: QueryTypes.SELECT,
      });
    const before = await siteRow();
    const rowsBefore = await Promise.all(['db1', 'fin'].map((id) => sizingRow(t.id(id))));
    const history = () => AuditEvent.count({ where: { organisationId: team.org.id } });
    const historyBefore = await history();
    const events = () => [{ action: 'site.origin-changed' as const, details: {}, boardId: null }];
    const written = await writePresizedSite(actor, t.site.id, presized, { cause: 'test', events });
    // Nothing written: the caller re-sizes under the lock (tests/integration/presize-worker.test.ts)
    expect(written).toBeNull();
    expect(await siteRow()).toEqual(before);
    expect(await Promise.all(['db1', 'fin'].map((id) => sizingRow(t.id(id))))).toEqual(rowsBefore);
    expect(await history()).toBe(historyBefore);
  });
});

describe('a re-size sends a board’s whole sizing only when it must', () => {
  /**
   * The statements that write board_sizings during `f`, and their bind values: as pg's client
   * sends them, through Sequelize or in a few round trips with the values written in
   * (lib/db.ts inFewTrips).
   */
  async function writesDuring(f: () => Promise<unknown>): Promise<{ sql: string; bind: unknown[] }[]> {
    const seen: { sql: string; bind: unknown[] }[] = [];
    const query = pg.Client.prototype.query;
    const spy = vi.spyOn(pg.Client.prototype, 'query').mockImplementation(function (
      this: pg.Client,
      ...args: unknown[]
    ) {
      const [first, second] = args as [string | { text: string; values?: unknown[] }, unknown];
      const sql = typeof first === 'string' ? first : first.text;
      const bind = (Array.isArray(second) ? second : typeof first === 'string' ? [] : first.values) ?? [];
      if (/(INSERT INTO|UPDATE) board_sizings/.test(sql)) seen.push({ sql, bind });
      return (query as (...a: unknown[]) => unknown).apply(this, args);
    } as never);
    try {
      await f();
    } finally {
      spy.mockRestore();
    }
    return seen;
  }
  // Each write of board_sizings, also within a statement that writes other tables too (lib/db.ts asOneStatement)
  const verbs = (writes: { sql: string }[]) =>
    writes
      .flatMap((w) => [...w.sql.matchAll(/(INSERT INTO|UPDATE) board_sizings/g)])
      .map((m) => (m[1] === 'UPDATE' ? 'UPDATE board_sizings' : 'INSERT INTO'))
      .sort();
  // A whole sizing (its summary's diversity rules), not the review page's cut of it
  const sizingsSent = (writes: { sql: string; bind: unknown[] }[]) =>
    writes.flatMap((w) => [w.sql, ...w.bind]).filter((v) => typeof v === 'string' && v.includes('"diversityRules"'));

  /** A two-level site put on one origin and stored whole, with a call that puts the same origin again. */
  async function storedAtOneOrigin() {
    signInAs(team.users.designer);
    const { fx, t } = await linkedTwoLevel();
    const origin = { ...fx.origin, zeOhm: 0.5 };
    const putOrigin = () => call(originRoute.PUT(jsonRequest('PUT', origin), ctx({ siteId: t.site.id })));
    await putOrigin();
    await storedSizing(t.id('fin'));
    return { t, putOrigin };
  }

  it('the same origin again: no sizing is sent, each row moves on to the new tree version', async () => {
    const { t, putOrigin } = await storedAtOneOrigin();
    const before = await Promise.all(['db1', 'fin'].map((id) => sizingRow(t.id(id))));
    const writes = await writesDuring(putOrigin);
    expect(verbs(writes)).toEqual(['UPDATE board_sizings']);
    expect(sizingsSent(writes)).toEqual([]);
    for (const [i, id] of ['db1', 'fin'].entries()) {
      const after = await sizingRow(t.id(id));
      expect(after.pending, id).toBe(false);
      expect(after.text, id).toBe(before[i].text);
      expect(after.treeVersion, id).toBe(before[i].treeVersion! + 1);
      expect(after.carried?.treeVersion, id).toBe(after.treeVersion);
    }
  });

  it('the same origin again writes whole a row stored without the review page’s cut (before migration 0015)', async () => {
    const { t, putOrigin } = await storedAtOneOrigin();
    await db().query('UPDATE board_sizings SET review = NULL WHERE board_id = $1', { bind: [t.id('fin')] });
    const writes = await writesDuring(putOrigin);
    expect(verbs(writes)).toEqual(['INSERT INTO', 'UPDATE board_sizings']);
    expect(sizingsSent(writes)).toHaveLength(1);
    for (const id of ['db1', 'fin']) {
      const row = await sizingRow(t.id(id));
      expect(row.pending, id).toBe(false);
      expect(row.review, id).toEqual(reviewSizingOf(row.sizing!));
    }
  });

  it('the same origin again writes whole a row stored with a cut of an older shape (REVIEW_CUT)', async () => {
    const { t, putOrigin } = await storedAtOneOrigin();
    await db().query(`UPDATE board_sizings SET review = review - 'cut' WHERE board_id = $1`, { bind: [t.id('fin')] });
    const writes = await writesDuring(putOrigin);
    expect(verbs(writes)).toEqual(['INSERT INTO', 'UPDATE board_sizings']);
    expect(sizingsSent(writes)).toHaveLength(1);
    const row = await sizingRow(t.id('fin'));
    expect(row.review).toEqual(reviewSizingOf(row.sizing!));
    expect(row.review!.cut).toBe(REVIEW_CUT);
  });

  it('another origin: no sizing is sent; each changed one is left pending, then stored whole by a read', async () => {
    signInAs(team.users.designer);
    const { fx, t } = await linkedTwoLevel();
    const next = { ...fx.origin, zeOhm: 0.8 };
    const writes = await writesDuring(() =>
      call(originRoute.PUT(jsonRequest('PUT', next), ctx({ siteId: t.site.id }))),
    );
    expect(verbs(writes)).toEqual(['INSERT INTO']);
    expect(sizingsSent(writes)).toEqual([]);
    const fresh = sizeTree(t.site.id, next, await readTreeBoards(t.site.id));
    for (const id of ['db1', 'fin']) expect((await sizingRow(t.id(id))).pending, id).toBe(true);
    const read = await writesDuring(() => storedSizing(t.id('db1')));
    expect(sizingsSent(read)).toHaveLength(2);
    for (const id of ['db1', 'fin']) {
      expect((await sizingRow(t.id(id))).text, id).toBe(JSON.stringify(fresh.boards.get(t.id(id))!.sizing));
    }
  });

  it('readers of a pending site at once store it once', async () => {
    signInAs(team.users.designer);
    const { fx, t } = await linkedTwoLevel();
    await call(originRoute.PUT(jsonRequest('PUT', { ...fx.origin, zeOhm: 0.9 }), ctx({ siteId: t.site.id })));
    const writes = await writesDuring(() =>
      Promise.all(
        ['db1', 'fin', 'db1', 'fin'].map((id) =>
          call(sizingRoute.POST(jsonRequest('POST'), ctx({ boardId: t.id(id) }))),
        ),
      ),
    );
    expect(verbs(writes)).toEqual(['INSERT INTO']);
    expect(sizingsSent(writes)).toHaveLength(2);
    for (const id of ['db1', 'fin']) expect((await sizingRow(t.id(id))).pending, id).toBe(false);
  });

  it('a save stores the board saved whole at once and leaves the boards below it pending', async () => {
    signInAs(team.users.designer);
    const { t } = await linkedTwoLevel();
    await storedSizing(t.id('fin'));
    await subMainLength(t, 400);
    const saved = await sizingRow(t.id('db1'));
    expect(saved.pending).toBe(false);
    expect(saved.version).toBe(saved.boardVersion);
    expect(saved.sizing!.ways.find((w) => w.id === t.id('w-sub'))?.result?.csaMm2).toBeDefined();
    expect((await sizingRow(t.id('fin'))).pending).toBe(true);
    // The spray booth's volt drop now takes in a 400 m sub-main: its first read stores that
    const fin = await storedSizing(t.id('fin'));
    expect(fin.sizing!.ways.find((w) => w.id === t.id('f-spray'))?.result?.verdict).toBe('fails');
  });

  it('a stored sizing whose hash is not the new text’s is left pending and stored again by its read', async () => {
    signInAs(team.users.designer);
    const { fx, t } = await linkedTwoLevel();
    const origin = { ...fx.origin, zeOhm: 0.5 };
    await call(originRoute.PUT(jsonRequest('PUT', origin), ctx({ siteId: t.site.id })));
    const good = (await storedSizing(t.id('fin'))).text!;
    // Written behind the app's back: one verdict changed, with its hash
    const bad = good.replace('"verdict":"passes"', '"verdict":"failed"');
    expect(bad).not.toBe(good);
    await db().query(
      `UPDATE board_sizings SET sizing = $2::json, sizing_sha256 = sha256(convert_to($2::text, 'UTF8')) WHERE board_id = $1`,
      { bind: [t.id('fin'), bad] },
    );
    const writes = await writesDuring(() =>
      call(originRoute.PUT(jsonRequest('PUT', origin), ctx({ siteId: t.site.id }))),
    );
    expect(verbs(writes)).toEqual(['INSERT INTO', 'UPDATE board_sizings']);
    expect(sizingsSent(writes)).toEqual([]);
    expect((await sizingRow(t.id('fin'))).pending).toBe(true);
    expect((await storedSizing(t.id('fin'))).text).toBe(good);
  });

  it('sizings stored by another engine revision are not current: one read re-sizes the site and stamps every board', async () => {
    signInAs(team.users.designer);
    const { t } = await linkedTwoLevel();
    const good = (await storedSizing(t.id('fin'))).text!;
    await storedSizing(t.id('db1'));
    // An older engine's answer for the board below (with its hash, as that engine stored it),
    // and both rows stamped by an older revision
    await db().query(
      `UPDATE board_sizings SET sizing = $2::json, sizing_sha256 = sha256(convert_to($2::text, 'UTF8')) WHERE board_id = $1`,
      { bind: [t.id('fin'), good.replace('"verdict":"passes"', '"verdict":"failed"')] },
    );
    await db().query(`UPDATE board_sizings SET engine = $2 WHERE board_id = ANY($1::uuid[])`, {
      bind: [[t.id('db1'), t.id('fin')], ENGINE_REVISION - 1],
    });
    await call(sizingRoute.POST(jsonRequest('POST'), ctx({ boardId: t.id('db1') })));
    const engines = await db().query<{ engine: number }>(
      'SELECT engine FROM board_sizings WHERE board_id = ANY($1::uuid[])',
      { bind: [[t.id('db1'), t.id('fin')]], type: QueryTypes.SELECT },
    );
    expect(engines.map((r) => r.engine)).toEqual([ENGINE_REVISION, ENGINE_REVISION]);
    expect((await sizingRow(t.id('fin'))).pending).toBe(false);
    expect((await storedSizing(t.id('fin'))).text).toBe(good);
  });
});
