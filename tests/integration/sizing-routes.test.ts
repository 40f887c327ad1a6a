import crypto from 'node:crypto';

import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';

import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as boardSizingRoute from '@/app/api/boards/[boardId]/sizing/route';
import * as sizingRoute from '@/app/api/sizing/route';
import { saveBodyOf } from '@/lib/api/save-body';
import type { BoardDto } from '@/lib/boards/types';
import type { BoardResult, CircuitResult } from '@/lib/sizing';
import { db } from '@/lib/db';
import { Board, Way } from '@/models';
import { demoWays, WORKSHOP_BOARD } from '@/scripts/demo-data';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let ours: Org;
let theirs: Org;
let ourBoardId: string;
let theirBoardId: string;

// A 3 kW immersion heater in 2.5 mm² twin and earth, clipped direct, 12 m, B16.
const circuitBody = {
  supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
  circuit: {
    phases: 1,
    use: 'fixed',
    load: { kind: 'known', watts: 3000, powerFactor: 1 },
    lengthM: 12,
    cable: 'te-70',
    method: 'C',
    ambientC: 30,
    grouping: { circuits: 1, arrangement: 'bunched' },
    insulationMm: 0,
    csaMm2: null,
    concealedInWall: false,
    device: { kind: 'mcb', curve: 'B', ratingA: 16, breakingKa: 6 },
  },
};

beforeAll(async () => {
  ours = await makeOrganisation('Sizing');
  theirs = await makeOrganisation('Elsewhere');
  ourBoardId = (await makeBoard(ours.org.id, 'workshop')).board.id;
  theirBoardId = (await makeBoard(theirs.org.id, 'workshop')).board.id;
});

describe('POST /api/sizing', () => {
  it('is 401 signed out and 403 for installers (lib/auth/permissions.ts: installers do not size)', async () => {
    signInAs(null);
    expect((await sizingRoute.POST(jsonRequest('POST', circuitBody), ctx({}))).status).toBe(401);
    signInAs(ours.users.installer);
    expect((await sizingRoute.POST(jsonRequest('POST', circuitBody), ctx({}))).status).toBe(403);
  });

  it('sizes one circuit for a designer', async () => {
    signInAs(ours.users.designer);
    const res = await sizingRoute.POST(jsonRequest('POST', circuitBody), ctx({}));
    expect(res.status).toBe(200);
    const { result } = (await res.json()) as { result: CircuitResult };
    // Ib = 3000 W / 230 V = 13.04 A; In 16 A as given.
    expect(result.ibA).toBeCloseTo(3000 / 230, 6);
    expect(result.inA).toBe(16);
    expect(result.checks.length).toBeGreaterThan(3);
    expect(['passes', 'near-limit', 'fails']).toContain(result.verdict);
  });

  it('answers junk with 400 and one entry per bad field', async () => {
    signInAs(ours.users.designer);
    const junk = structuredClone(circuitBody) as { supply: Record<string, unknown>; circuit: Record<string, unknown> };
    junk.supply.zeOhm = 'lots';
    junk.circuit.lengthM = -4;
    junk.circuit.method = 'Z';
    junk.circuit.surprise = true;
    const res = await sizingRoute.POST(jsonRequest('POST', junk), ctx({}));
    expect(res.status).toBe(400);
    const paths = (await res.json()).issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['supply.zeOhm', 'circuit.lengthM', 'circuit.method']));
  });
});

describe('POST /api/boards/:boardId/sizing', () => {
  it('is 401 signed out, 403 for installers, 404 for another organisation’s board', async () => {
    signInAs(null);
    const empty = () => jsonRequest('POST');
    expect((await boardSizingRoute.POST(empty(), ctx({ boardId: ourBoardId }))).status).toBe(401);
    signInAs(ours.users.installer);
    expect((await boardSizingRoute.POST(empty(), ctx({ boardId: ourBoardId }))).status).toBe(403);
    signInAs(ours.users.designer);
    expect((await boardSizingRoute.POST(empty(), ctx({ boardId: theirBoardId }))).status).toBe(404);
    expect((await boardSizingRoute.POST(empty(), ctx({ boardId: crypto.randomUUID() }))).status).toBe(404);
    // A draft sent against their board, or a board that does not exist, is refused the same way
    const draft = () =>
      jsonRequest('POST', { draft: { settings: WORKSHOP_BOARD.settings, ways: demoWays(WORKSHOP_BOARD).slice(0, 2) } });
    expect((await boardSizingRoute.POST(draft(), ctx({ boardId: theirBoardId }))).status).toBe(404);
    expect((await boardSizingRoute.POST(draft(), ctx({ boardId: crypto.randomUUID() }))).status).toBe(404);
    expect((await boardSizingRoute.POST(draft(), ctx({ boardId: ourBoardId }))).status).toBe(200);
  });

  it('sizes the stored board for designers and inspectors', async () => {
    for (const role of ['designer', 'inspector', 'admin'] as const) {
      signInAs(ours.users[role]);
      const res = await boardSizingRoute.POST(jsonRequest('POST'), ctx({ boardId: ourBoardId }));
      expect(res.status).toBe(200);
      const body = (await res.json()) as BoardResult;
      // Every way of the stored workshop board comes back, in rail order.
      expect(body.ways).toHaveLength(WORKSHOP_BOARD.ways.length);
      expect(body.summary.phaseCurrentsA).not.toBeNull();
    }
  });

  it('sizes an unsaved draft sent in the body', async () => {
    signInAs(ours.users.designer);
    const ways = demoWays(WORKSHOP_BOARD).slice(0, 3);
    const res = await boardSizingRoute.POST(
      jsonRequest('POST', { draft: { settings: WORKSHOP_BOARD.settings, ways } }),
      ctx({ boardId: ourBoardId }),
    );
    expect(res.status).toBe(200);
    const body = (await res.json()) as BoardResult;
    expect(body.ways.map((w) => w.id)).toEqual(ways.map((w) => w.id));
  });

  it('answers a junk draft with 400 and field paths', async () => {
    signInAs(ours.users.designer);
    const ways = demoWays(WORKSHOP_BOARD).slice(0, 2);
    (ways[1] as unknown as { device: { modules: number } }).device.modules = 9;
    const res = await boardSizingRoute.POST(
      jsonRequest('POST', { draft: { settings: { ...WORKSHOP_BOARD.settings, phases: 2 }, ways } }),
      ctx({ boardId: ourBoardId }),
    );
    expect(res.status).toBe(400);
    const paths = (await res.json()).issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['draft.settings.phases', 'draft.ways.1.device.modules']));
  });

  describe('the stored board, its sizing stored with it', () => {
    const sizeStored = async (boardId: string) => {
      const res = await boardSizingRoute.POST(jsonRequest('POST'), ctx({ boardId }));
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toMatch(/^application\/json/);
      return (await res.json()) as BoardResult;
    };
    const sizeDraft = async (board: BoardDto) => {
      const { settings, ways } = saveBodyOf(board);
      const res = await boardSizingRoute.POST(
        jsonRequest('POST', { draft: { settings, ways } }),
        ctx({ boardId: board.id }),
      );
      expect(res.status).toBe(200);
      return (await res.json()) as BoardResult;
    };
    const load = async (boardId: string) =>
      (await (await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }))).json()).board as BoardDto;
    const dropOf = (result: BoardResult, wayId: string) => result.ways.find((w) => w.id === wayId)?.result?.vdV;
    /** A new workshop board as a designer sees it, a way with a circuit, and its first stored sizing. */
    const sizedWorkshop = async () => {
      signInAs(ours.users.designer);
      const { board } = await makeBoard(ours.org.id, 'workshop');
      const before = await load(board.id);
      const target = before.ways.find((w) => w.circuit)!;
      return { board, before, target, first: await sizeStored(board.id) };
    };

    it('answers the same as sizing the same ways as a draft, asked once or again', async () => {
      signInAs(ours.users.designer);
      const { board } = await makeBoard(ours.org.id, 'workshop');
      const fresh = await sizeDraft(await load(board.id));
      expect(await sizeStored(board.id)).toEqual(fresh);
      expect(await sizeStored(board.id)).toEqual(fresh);
    });

    it('follows every save', async () => {
      const { board, before, target, first } = await sizedWorkshop();
      // Save the board with that circuit 7 m longer
      const ways = before.ways.map((w) =>
        w.id === target.id ? { ...w, circuit: { ...w.circuit!, lengthM: w.circuit!.lengthM + 7 } } : w,
      );
      const saved = await boardRoute.PUT(
        jsonRequest('PUT', saveBodyOf({ ...before, ways })),
        ctx({ boardId: board.id }),
      );
      expect(saved.status).toBe(200);
      const after = await sizeStored(board.id);
      // A longer run drops more volts (mV/A/m × Ib × L), and the answer is the saved board's
      expect(dropOf(after, target.id)).toBeGreaterThan(dropOf(first, target.id)!);
      expect(after).toEqual(await sizeDraft(await load(board.id)));
    });

    it('follows a way written behind the app’s back: the database raises the board’s version', async () => {
      const { board, before, target, first } = await sizedWorkshop();
      await Way.update({ circuit: { ...target.circuit!, lengthM: 33 } }, { where: { id: target.id } });
      const now = await load(board.id);
      expect(now.version).toBe(before.version + 1);
      const after = await sizeStored(board.id);
      expect(dropOf(after, target.id)).not.toBe(dropOf(first, target.id));
      expect(after).toEqual(await sizeDraft(now));
    });

    it('is read back as stored, not sized again, until the design changes', async () => {
      const { board, target } = await sizedWorkshop();
      const stored = () =>
        db().query('SELECT version, sizing::text AS sizing FROM board_sizings WHERE board_id = $1', {
          bind: [board.id],
          type: QueryTypes.SELECT,
        }) as Promise<{ version: number; sizing: string }[]>;
      // What the route answers is the stored text itself: a marker put in its place comes back
      await db().query(`UPDATE board_sizings SET sizing = '{"marker":"stored"}' WHERE board_id = $1`, {
        bind: [board.id],
      });
      expect(await sizeStored(board.id)).toEqual({ marker: 'stored' });
      // A label check is not a change of the design: the board keeps its version and its sizing
      await Way.update({ labelStatus: 'matches' }, { where: { id: target.id } });
      expect(await sizeStored(board.id)).toEqual({ marker: 'stored' });
      // A change of a way's circuit raises the version: the marker is no longer current
      await Way.update({ circuit: { ...target.circuit!, lengthM: 44 } }, { where: { id: target.id } });
      const resized = await sizeStored(board.id);
      expect(resized).not.toEqual({ marker: 'stored' });
      expect(dropOf(resized, target.id)).toBeGreaterThan(0);
      // A save stores the new sizing in its own transaction, before anyone asks for it
      const opened = await load(board.id);
      const ways = opened.ways.map((w) => (w.id === target.id ? { ...w, circuit: { ...w.circuit!, lengthM: 12 } } : w));
      const saved = await boardRoute.PUT(
        jsonRequest('PUT', saveBodyOf({ ...opened, ways })),
        ctx({ boardId: board.id }),
      );
      expect(saved.status).toBe(200);
      const [row] = await stored();
      expect(row.version).toBe(opened.version + 1);
      expect(JSON.parse(row.sizing)).toEqual(await sizeDraft(await load(board.id)));
      expect(dropOf(JSON.parse(row.sizing), target.id)).toBeLessThan(dropOf(resized, target.id)!);
    });

    it('refuses a stored board the engine cannot size with 400 and field paths', async () => {
      signInAs(ours.users.designer);
      const { board } = await makeBoard(ours.org.id, 'workshop');
      const before = await load(board.id);
      const target = before.ways.find((w) => w.circuit)!;
      // A circuit length no save accepts, written behind the app's back
      await Way.update({ circuit: { ...target.circuit!, lengthM: -5 } }, { where: { id: target.id } });
      await Board.update({ name: `${before.name} ` }, { where: { id: board.id } });
      const res = await boardSizingRoute.POST(jsonRequest('POST'), ctx({ boardId: board.id }));
      expect(res.status).toBe(400);
      const paths = (await res.json()).issues.map((i: { path: string }) => i.path);
      expect(paths.some((p: string) => p.endsWith('circuit.lengthM'))).toBe(true);
    });
  });
});
