/**
 * GET /api/boards/:boardId/sizing/ways/:wayId: the review page loads a way's checks when the
 * way is opened, from the board's stored sizing, instead of sending every way's with the page.
 */
import { describe, expect, it } from 'vitest';

import * as sizingRoute from '@/app/api/boards/[boardId]/sizing/route';
import * as checksRoute from '@/app/api/boards/[boardId]/sizing/ways/[wayId]/route';
import type { BoardResult } from '@/lib/sizing';
import { Way } from '@/models';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

const checksOf = (boardId: string, wayId: string) => checksRoute.GET(jsonRequest('GET'), ctx({ boardId, wayId }));

describe("a way's checks", () => {
  it("answers the stored sizing's checks of that way, words only; none for a way without a circuit", async () => {
    const team = await makeOrganisation('Way checks');
    const { board } = await makeBoard(team.org.id, 'flat');
    signInAs(team.users.inspector);
    const sized = (await (
      await sizingRoute.POST(new Request('http://127.0.0.1/api', { method: 'POST' }), ctx({ boardId: board.id }))
    ).json()) as BoardResult;
    const circuit = sized.ways.find((w) => w.result)!;
    const res = await checksOf(board.id, circuit.id);
    expect(res.status).toBe(200);
    const { checks } = (await res.json()) as {
      checks: { code: string; ok: boolean; message: string; reference: string }[];
    };
    expect(checks).toEqual(
      circuit.result!.checks.map((c) => ({ code: c.code, ok: c.ok, message: c.message, reference: c.reference })),
    );
    expect(checks.length).toBeGreaterThan(0);

    const spare = sized.ways.find((w) => !w.result)!;
    expect(await (await checksOf(board.id, spare.id)).json()).toEqual({ checks: [] });
    // The installer reads boards too (the review page is open to them)
    signInAs(team.users.installer);
    expect((await checksOf(board.id, circuit.id)).status).toBe(200);
  });

  it('is 404 for a way not on the board and for another organisation’s board', async () => {
    const team = await makeOrganisation('Way checks own');
    const other = await makeOrganisation('Way checks other');
    const { board } = await makeBoard(team.org.id, 'flat');
    const { board: theirs } = await makeBoard(other.org.id, 'flat');
    const theirWay = await Way.findOne({ where: { boardId: theirs.id } });
    signInAs(team.users.inspector);
    expect((await checksOf(board.id, theirWay!.id)).status).toBe(404);
    expect((await checksOf(theirs.id, theirWay!.id)).status).toBe(404);
    expect((await checksOf(board.id, 'not-a-uuid')).status).toBe(404);
  });
});
