import crypto from 'node:crypto';

import { beforeAll, describe, expect, it } from 'vitest';

import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as sizingRoute from '@/app/api/boards/[boardId]/sizing/route';
import type { BoardDto } from '@/lib/boards/types';
import { AuditEvent, Board, Way } from '@/models';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Save');
});

async function load(boardId: string): Promise<BoardDto> {
  const res = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }));
  expect(res.status).toBe(200);
  return (await res.json()).board;
}

/** The body the editor sends: the settings and ways of a board DTO at a version. */
function saveBody(board: BoardDto, ways = board.ways, version = board.version) {
  const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = board;
  return {
    version,
    settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
    ways: ways.map(({ id, rail, position, device, circuit }) => ({ id, rail, position, device, circuit })),
  };
}

describe('saving a board from the editor', () => {
  it('saves moves, a new way, a removed way and a changed circuit; a reload shows them', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'flat');
    const before = await load(board.id);
    // Swap the first two circuits, lengthen one, drop the spare and add an MCB on the end
    const ways = before.ways.map((w) => ({ ...w }));
    const spare = ways.find((w) => w.device.kind === 'blank')!;
    const [a, b] = ways.filter((w) => w.circuit);
    [a.position, b.position] = [b.position, a.position];
    a.circuit = { ...a.circuit!, lengthM: 41 };
    const added = {
      id: crypto.randomUUID(),
      rail: 0,
      position: 50,
      device: { kind: 'mcb' as const, poles: 1 as const, modules: 1, curve: 'B' as const, ratingA: 16 },
      circuit: null,
      labelStatus: 'unchecked' as const,
      labelNote: '',
    };
    const next = [...ways.filter((w) => w.id !== spare.id), added];
    const res = await boardRoute.PUT(jsonRequest('PUT', saveBody(before, next)), ctx({ boardId: board.id }));
    expect(res.status).toBe(200);
    const saved = (await res.json()).board as BoardDto;
    expect(saved.version).toBe(before.version + 1);

    const after = await load(board.id);
    expect(after.version).toBe(before.version + 1);
    expect(after.ways.map((w) => w.id)).not.toContain(spare.id);
    expect(after.ways.find((w) => w.id === added.id)?.device).toEqual(added.device);
    expect(after.ways.find((w) => w.id === a.id)?.circuit?.lengthM).toBe(41);
    // Rail order: b now comes before a
    const order = after.ways.map((w) => w.id);
    expect(order.indexOf(b.id)).toBeLessThan(order.indexOf(a.id));
    // The stored draft sizes: the new MCB is a spare (no circuit), a's circuit is sized at 41 m
    const sized = await sizingRoute.POST(jsonRequest('POST'), ctx({ boardId: board.id }));
    const result = await sized.json();
    expect(result.summary.counts.spare).toBe(1);
    expect(result.ways.find((w: { id: string }) => w.id === a.id).result.vdV).toBeGreaterThan(0);
  });

  it('a save at a stale version gets 409 with the current version, and nothing is written', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'workshop');
    const opened = await load(board.id);
    // Someone else saves first
    const theirs = opened.ways.map((w) => (w.circuit ? { ...w, circuit: { ...w.circuit, lengthM: 19 } } : w));
    const first = await boardRoute.PUT(jsonRequest('PUT', saveBody(opened, theirs)), ctx({ boardId: board.id }));
    expect(first.status).toBe(200);
    const stored = await load(board.id);
    const auditsBefore = await AuditEvent.count({ where: { boardId: board.id } });

    // Our save still names the version we opened
    const mine = opened.ways.filter((w) => w.device.kind !== 'blank');
    const stale = await boardRoute.PUT(jsonRequest('PUT', saveBody(opened, mine)), ctx({ boardId: board.id }));
    expect(stale.status).toBe(409);
    const body = await stale.json();
    expect(body.currentVersion).toBe(stored.version);
    expect(body.error).toMatch(/saved this board after you opened it/);

    // Nothing written: same version, same ways, no audit events
    const after = await load(board.id);
    expect(after.version).toBe(stored.version);
    expect(after.ways).toEqual(stored.ways);
    expect(await AuditEvent.count({ where: { boardId: board.id } })).toBe(auditsBefore);

    // "Keep mine": the same ways saved on top of the current version go through
    const kept = await boardRoute.PUT(
      jsonRequest('PUT', saveBody(opened, mine, body.currentVersion)),
      ctx({ boardId: board.id }),
    );
    expect(kept.status).toBe(200);
    expect((await load(board.id)).ways.map((w) => w.id)).toEqual(mine.map((w) => w.id));
  });

  it('a board in review is not saved (409) and keeps its ways', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'flat');
    const opened = await load(board.id);
    await Board.update({ status: 'in-review' }, { where: { id: board.id } });
    const res = await boardRoute.PUT(
      jsonRequest('PUT', saveBody(opened, opened.ways.slice(1))),
      ctx({ boardId: board.id }),
    );
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/in review/);
    expect(await Way.count({ where: { boardId: board.id } })).toBe(opened.ways.length);
  });

  it('bad input is a 400 naming each bad field, and nothing is written', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'flat');
    const opened = await load(board.id);
    const ways = opened.ways.map((w, i) =>
      i === 2 ? { ...w, circuit: { ...w.circuit!, lengthM: -3 }, device: { ...w.device, ratingA: 17 } } : w,
    );
    const res = await boardRoute.PUT(jsonRequest('PUT', saveBody(opened, ways)), ctx({ boardId: board.id }));
    expect(res.status).toBe(400);
    const paths = (await res.json()).issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['ways.2.circuit.lengthM', 'ways.2.device.ratingA']));
    expect((await load(board.id)).version).toBe(opened.version);
  });

  it('inspectors and installers may not save', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    signInAs(team.users.designer);
    const opened = await load(board.id);
    for (const role of ['inspector', 'installer'] as const) {
      signInAs(team.users[role]);
      const res = await boardRoute.PUT(jsonRequest('PUT', saveBody(opened)), ctx({ boardId: board.id }));
      expect(res.status).toBe(403);
    }
  });
});

describe('what a save writes and answers', () => {
  it('the read is the board as its rows hold it, and a save answers what a reload shows', async () => {
    signInAs(team.users.designer);
    const { board, site } = await makeBoard(team.org.id, 'workshop');
    // The one-query read against the model rows
    const rows = await Way.findAll({
      where: { boardId: board.id },
      order: [
        ['rail', 'ASC'],
        ['position', 'ASC'],
      ],
    });
    const row = (await Board.findByPk(board.id))!;
    const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling, status, version } = row;
    expect(await load(board.id)).toEqual({
      ...{ id: row.id, siteId: row.siteId, siteName: site.name, name, location, phases, supply, incoming },
      ...{ enclosureModules, rails, dwelling, conditionalRatingKa: row.conditionalRatingKa, status, version },
      revision: row.revision,
      updatedAt: row.updatedAt.toISOString(),
      // The site tree's fields (migration 0009): fed from the origin of a site without one yet
      feed: { from: 'origin' },
      derivedSupply: null,
      ways: rows.map(({ id, rail, position, device, circuit, labelStatus, labelNote }) => ({
        ...{ id, rail, position, device, circuit, labelStatus, labelNote },
      })),
    });

    const opened = await load(board.id);
    const ways = opened.ways.map((w) => ({ ...w }));
    ways[3].circuit = ways[3].circuit ? { ...ways[3].circuit, lengthM: 33 } : ways[3].circuit;
    const res = await boardRoute.PUT(
      jsonRequest('PUT', { ...saveBody(opened, ways), settings: { ...saveBody(opened).settings, name: 'Renamed' } }),
      ctx({ boardId: board.id }),
    );
    expect(res.status).toBe(200);
    const answered = (await res.json()).board as BoardDto;
    expect(answered).toEqual(await load(board.id));
    expect(answered.name).toBe('Renamed');
  });

  it('a way left as it was keeps its label check; a moved or changed way must be checked again', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'flat');
    await Way.update({ labelStatus: 'matches', labelNote: 'checked on site' }, { where: { boardId: board.id } });
    const opened = await load(board.id);
    const ways = opened.ways.map((w) => ({ ...w }));
    const [kept, changed, moved] = ways.filter((w) => w.circuit);
    changed.circuit = { ...changed.circuit!, lengthM: changed.circuit!.lengthM + 5 };
    moved.position = 90;
    // Key order of a device must not count as a change (jsonb keeps its own order)
    kept.device = Object.fromEntries(Object.entries(kept.device).reverse()) as typeof kept.device;
    const res = await boardRoute.PUT(jsonRequest('PUT', saveBody(opened, ways)), ctx({ boardId: board.id }));
    expect(res.status).toBe(200);
    const after = await load(board.id);
    const label = (id: string) => after.ways.find((w) => w.id === id)!;
    expect(label(kept.id)).toMatchObject({ labelStatus: 'matches', labelNote: 'checked on site' });
    expect(label(changed.id)).toMatchObject({ labelStatus: 'unchecked', labelNote: '' });
    expect(label(moved.id)).toMatchObject({ labelStatus: 'unchecked', labelNote: '' });
    // The audit trail names exactly the changed and the moved way
    const events = await AuditEvent.findAll({ where: { boardId: board.id, action: ['way.changed', 'way.moved'] } });
    expect(events.map((e) => `${e.action} ${(e.details as { wayId: string }).wayId}`).sort()).toEqual(
      [`way.changed ${changed.id}`, `way.moved ${moved.id}`].sort(),
    );
  });

  it("a new way that reuses another board's way id is refused, and neither board changes", async () => {
    signInAs(team.users.designer);
    const { board: mine } = await makeBoard(team.org.id, 'flat');
    const other = await makeOrganisation('Other');
    const { board: theirs } = await makeBoard(other.org.id, 'flat');
    const theirWay = (await Way.findOne({ where: { boardId: theirs.id } }))!;
    const theirsBefore = await Way.findByPk(theirWay.id, { raw: true });
    const opened = await load(mine.id);
    const stolen = { ...opened.ways[1], id: theirWay.id, position: 77 };
    const res = await boardRoute.PUT(
      jsonRequest('PUT', saveBody(opened, [...opened.ways, stolen])),
      ctx({ boardId: mine.id }),
    );
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/reuses the id/);
    expect(await Way.findByPk(theirWay.id, { raw: true })).toEqual(theirsBefore);
    const after = await load(mine.id);
    expect(after.version).toBe(opened.version);
    expect(after.ways).toEqual(opened.ways);
    expect(await AuditEvent.count({ where: { boardId: mine.id, action: 'board.saved' } })).toBe(0);
  });
});
