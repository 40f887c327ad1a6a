/**
 * Many clients saving one board at once: 20 parallel saves through the PUT route handler, each
 * with different changes, all at the same version. Exactly one wins each version, the rest get
 * 409, and the stored board is exactly the winner's submission, never a mix. Several rounds.
 */
import crypto from 'node:crypto';
import { isDeepStrictEqual } from 'node:util';

import { beforeAll, describe, expect, it } from 'vitest';

import * as auditRoute from '@/app/api/boards/[boardId]/audit/route';
import * as boardRoute from '@/app/api/boards/[boardId]/route';
import { saveBodyOf } from '@/lib/api/save-body';
import type { BoardDto } from '@/lib/boards/types';
import type { AuditPage } from '@/lib/audit-types';
import { AuditEvent, Way } from '@/models';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

const CLIENTS = 20;
const ROUNDS = 5;

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
type SaveBody = ReturnType<typeof saveBodyOf>;
let team: Org;

async function load(boardId: string): Promise<BoardDto> {
  const res = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }));
  expect(res.status).toBe(200);
  return (await res.json()).board;
}

/**
 * Client `i`'s edit of the board: its own name and location, one circuit lengthened to its own
 * length, and, depending on `i`, two ways swapped, a way removed or a new MCB added at the end.
 */
function clientEdit(board: BoardDto, round: number, i: number): SaveBody {
  const body = saveBodyOf(board);
  body.settings.name = `Round ${round} client ${i}`;
  body.settings.location = `Cupboard ${i}`;
  const circuits = body.ways.filter((w) => w.circuit);
  const target = circuits[i % circuits.length];
  target.circuit = { ...target.circuit!, lengthM: 10 + i + round / 10 };
  if (i % 3 === 0 && circuits.length >= 2) {
    const [a, b] = [circuits[0], circuits[1]];
    [a.position, b.position] = [b.position, a.position];
  } else if (i % 3 === 1 && body.ways.length > 4) {
    const spare = body.ways.find((w) => !w.circuit && w.device.kind !== 'main-switch');
    if (spare) body.ways = body.ways.filter((w) => w.id !== spare.id);
  } else {
    const last = Math.max(...body.ways.map((w) => w.position));
    body.ways.push({
      id: crypto.randomUUID(),
      rail: 0,
      position: last + 1,
      device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: [6, 10, 16, 20][i % 4] },
      circuit: null,
    } as SaveBody['ways'][number]);
  }
  return body;
}

/** The stored board in the shape of a save body, ways in rail order. */
function asSaved(board: BoardDto): Omit<SaveBody, 'version'> {
  const { version: _version, ...rest } = saveBodyOf(board);
  return rest;
}

const railOrder = (ways: SaveBody['ways']) => ways.slice().sort((a, b) => a.rail - b.rail || a.position - b.position);

beforeAll(async () => {
  team = await makeOrganisation('Concurrent');
});

describe(`${CLIENTS} parallel saves of one board`, () => {
  const title = `exactly one wins each version, the rest get 409; the stored board is the winner's (${ROUNDS} rounds)`;
  it(title, async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'workshop');
    let tried = 0;
    for (let round = 1; round <= ROUNDS; round++) {
      const opened = await load(board.id);
      const bodies = Array.from({ length: CLIENTS }, (_, i) => clientEdit(opened, round, i));
      // Every client's edit is different from every other's
      expect(new Set(bodies.map((b) => JSON.stringify(b))).size).toBe(CLIENTS);

      // All at once, at the same version
      const answers = await Promise.all(
        bodies.map((body) => boardRoute.PUT(jsonRequest('PUT', body), ctx({ boardId: board.id }))),
      );
      tried += answers.length;
      const statuses = answers.map((r) => r.status);
      expect(
        statuses.filter((s) => s === 200),
        `round ${round}: ${statuses.join(',')}`,
      ).toHaveLength(1);
      expect(statuses.filter((s) => s === 409)).toHaveLength(CLIENTS - 1);
      const winner = statuses.indexOf(200);
      for (const [i, res] of answers.entries()) {
        if (i === winner) continue;
        expect((await res.json()).currentVersion).toBe(opened.version + 1);
      }

      // The stored board is exactly the winner's submission, and no other's
      const stored = await load(board.id);
      expect(stored.version).toBe(opened.version + 1);
      const saved = asSaved(stored);
      const submitted = { settings: bodies[winner].settings, ways: railOrder(bodies[winner].ways) };
      expect(saved).toEqual(submitted);
      // (key order aside: the database stores devices and circuits as jsonb)
      const matches = bodies.filter((b) => isDeepStrictEqual({ settings: b.settings, ways: railOrder(b.ways) }, saved));
      expect(matches).toHaveLength(1);
      expect(await Way.count({ where: { boardId: board.id } })).toBe(bodies[winner].ways.length);

      // One save recorded for the new version, by the designer, shown first on the audit trail
      expect(
        await AuditEvent.count({
          where: { boardId: board.id, action: 'board.saved', details: { version: opened.version + 1 } },
        }),
      ).toBe(1);
      const trailRes = await auditRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }));
      const trail = (await trailRes.json()) as AuditPage;
      const latest = trail.entries.find((e) => e.action === 'board.saved')!;
      expect(latest.details.version).toBe(opened.version + 1);
      expect(latest.userName).toBe(team.users.designer.name);
    }
    console.log(
      `concurrency: ${tried} saves tried in ${ROUNDS} rounds of ${CLIENTS}; ${ROUNDS} won, ${tried - ROUNDS} got 409`,
    );
  });

  it('saves at different stale versions all lose to the one at the current version', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'flat');
    const first = await load(board.id);
    // Move the board on twice, keeping each opened copy
    const v1 = first;
    const r1 = await boardRoute.PUT(jsonRequest('PUT', clientEdit(v1, 0, 0)), ctx({ boardId: board.id }));
    expect(r1.status).toBe(200);
    const v2 = await load(board.id);
    const r2 = await boardRoute.PUT(jsonRequest('PUT', clientEdit(v2, 0, 1)), ctx({ boardId: board.id }));
    expect(r2.status).toBe(200);
    const v3 = await load(board.id);
    // Ten clients on old copies and one on the current one, all at once
    const bodies = [
      ...Array.from({ length: 10 }, (_, i) => clientEdit(i % 2 ? v1 : v2, 9, i + 2)),
      clientEdit(v3, 9, 19),
    ];
    const answers = await Promise.all(
      bodies.map((body) => boardRoute.PUT(jsonRequest('PUT', body), ctx({ boardId: board.id }))),
    );
    expect(answers.map((r) => r.status)).toEqual([...Array(10).fill(409), 200]);
    const stored = await load(board.id);
    expect(asSaved(stored)).toEqual({ settings: bodies[10].settings, ways: railOrder(bodies[10].ways) });
  });
});
