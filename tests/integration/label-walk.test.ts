import { PDFParse } from 'pdf-parse';
import { beforeAll, describe, expect, it } from 'vitest';

import * as approveRoute from '@/app/api/boards/[boardId]/review/approve/route';
import * as scheduleRoute from '@/app/api/boards/[boardId]/schedule/route';
import * as labelRoute from '@/app/api/boards/[boardId]/ways/[wayId]/label/route';
import * as walkRoute from '@/app/api/boards/[boardId]/ways/walk/route';
import type { WalkData } from '@/lib/boards/walk-types';
import { buildLabelSheet, fitLabelTexts } from '@/features/schedule/utils/build-labels';
import { printFontMeasure } from '@/features/schedule/utils/fonts';
import { getScheduleSource } from '@/lib/dal/schedule-source';
import { Board, Way } from '@/models';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
let other: Org;

beforeAll(async () => {
  team = await makeOrganisation('Walk');
  other = await makeOrganisation('Strangers');
});

async function issuedBoard(before?: (boardId: string) => Promise<unknown>) {
  const { board } = await makeBoard(team.org.id, 'flat');
  await before?.(board.id);
  await board.update({ status: 'in-review' });
  signInAs(team.users.inspector);
  expect(
    (
      await approveRoute.POST(
        jsonRequest('POST', { declaration: team.users.inspector.name }),
        ctx({ boardId: board.id }),
      )
    ).status,
  ).toBe(200);
  return board;
}

const mark = (boardId: string, wayId: string, body: unknown) =>
  labelRoute.POST(jsonRequest('POST', body), ctx({ boardId, wayId }));

async function walk(boardId: string) {
  const res = await walkRoute.GET(jsonRequest('GET'), ctx({ boardId }));
  return (await res.json()) as { walk: WalkData; problems: { ref: string | null; status: string; note: string }[] };
}

async function scheduleText(boardId: string) {
  const res = await scheduleRoute.GET(jsonRequest('GET', undefined, 'http://127.0.0.1/x'), ctx({ boardId }));
  const parser = new PDFParse({ data: new Uint8Array(await res.arrayBuffer()) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, ' ');
  } finally {
    await parser.destroy();
  }
}

describe('the label walk', () => {
  it('says what the printed strip reads where it shortens a label to fit, as the strips PDF prints it', async () => {
    const long = 'Sockets: kitchen worktop left of the sink, utility room, boiler cupboard and the garage freezer spur';
    let wayId = '';
    const board = await issuedBoard(async (boardId) => {
      const way = (await Way.findAll({ where: { boardId } })).find((w) => w.circuit?.serves && w.device.modules === 1)!;
      wayId = way.id;
      await way.update({ circuit: { ...way.circuit!, serves: long } });
    });
    signInAs(team.users.installer);
    const { walk: data } = await walk(board.id);
    const way = data.ways.find((w) => w.id === wayId)!;
    expect(way.labelText).toContain(long);
    // What the label strips PDF prints for that way (features/schedule/render-schedule.ts)
    const actor = { ...team.users.installer, userId: team.users.installer.id, organisationId: team.org.id };
    const sheet = fitLabelTexts(buildLabelSheet(await getScheduleSource(actor, board.id)), await printFontMeasure());
    const cell = sheet.rails.flatMap((r) => r.strips.flatMap((s) => s.cells)).find((c) => c.wayId === wayId)!;
    expect(cell.whole).toBe(way.labelText);
    expect(way.stripText).toBe(cell.text);
    expect(way.stripText).toMatch(/…$/);
    // A label printed whole says nothing more
    const short = data.ways.find((w) => w.labelText === 'Main switch')!;
    expect(short.stripText).toBeUndefined();
  });

  it('is for issued boards only', async () => {
    const { board } = await makeBoard(team.org.id, 'flat');
    signInAs(team.users.installer);
    const { walk: data } = await walk(board.id);
    const res = await mark(board.id, data.ways[0].id, { status: 'matches' });
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/issued boards/);
  });

  it('saves each way, verifies the board when every label matches, and un-verifies it on a wrong label', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    const { walk: start } = await walk(board.id);
    expect(start.progress).toMatchObject({ total: start.ways.length, checked: 0 });
    // Every device on the rail is walked, in rail order, with the words of its label
    expect(start.ways[0].labelText).toBe('Main switch');
    expect(start.ways.some((w) => w.ref === '1')).toBe(true);

    const [last, ...rest] = [...start.ways].reverse();
    for (const way of rest) {
      const res = await mark(board.id, way.id, { status: 'matches' });
      expect(res.status).toBe(200);
      expect((await res.json()).boardStatus).toBe('issued');
    }
    // Resume from "another device": the saved progress is there
    signInAs(team.users.inspector);
    const { walk: resumed } = await walk(board.id);
    expect(resumed.progress).toMatchObject({ checked: rest.length, matches: rest.length });
    expect(resumed.ways.find((w) => w.status === 'unchecked')?.id).toBe(last.id);
    expect(resumed.ways.find((w) => w.id === rest[0].id)?.checkedByName).toBe(team.users.installer.name);

    const done = await mark(board.id, last.id, { status: 'matches' });
    expect((await done.json()).boardStatus).toBe('labels-matched');
    expect((await Board.findByPk(board.id))!.status).toBe('labels-matched');

    // A label found wrong later takes the board back to issued, once the walker confirms
    // that the board's state will change; and it is shown to the designer
    const wrongWay = start.ways.find((w) => w.ref === '2')!;
    const asked = await mark(board.id, wrongWay.id, { status: 'wrong', note: 'Reads "Kitchen" on the label' });
    expect(asked.status).toBe(409);
    expect(await asked.json()).toMatchObject({
      needsConfirmation: true,
      error: expect.stringMatching(/back to issued/),
    });
    expect((await Board.findByPk(board.id))!.status).toBe('labels-matched');
    const wrong = await mark(board.id, wrongWay.id, {
      status: 'wrong',
      note: 'Reads "Kitchen" on the label',
      confirmStateChange: true,
    });
    expect(await wrong.json()).toMatchObject({ boardStatus: 'issued', progress: { wrong: 1 } });
    signInAs(team.users.designer);
    const { problems } = await walk(board.id);
    expect(problems).toEqual([{ wayId: wrongWay.id, ref: '2', status: 'wrong', note: 'Reads "Kitchen" on the label' }]);
    // …and on the schedule
    const text = await scheduleText(board.id);
    expect(text).toContain('Label on site');
    expect(text).toContain('✗ Label is wrong: Reads "Kitchen" on the label');
    expect(text).toContain('✓ Label matches');
    expect(text).toMatch(/Label walk \d+ match, 1 wrong, 0 missing, 0 not checked/);
  });

  it('checks roles, fields, the way and the organisation', async () => {
    const board = await issuedBoard();
    signInAs(team.users.installer);
    const { walk: data } = await walk(board.id);
    const wayId = data.ways[1].id;
    const bad = await mark(board.id, wayId, { status: 'fine' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).issues[0].path).toBe('status');
    const long = await mark(board.id, wayId, { status: 'wrong', note: 'x'.repeat(501) });
    expect((await long.json()).issues[0].path).toBe('note');
    const elsewhere = await makeBoard(team.org.id, 'flat');
    const strayWay = (await walk(elsewhere.board.id)).walk.ways[1].id;
    expect((await mark(board.id, strayWay, { status: 'matches' })).status).toBe(404);
    signInAs(team.users.designer);
    expect((await mark(board.id, wayId, { status: 'matches' })).status).toBe(403);
    signInAs(other.users.admin);
    expect((await mark(board.id, wayId, { status: 'matches' })).status).toBe(404);
    expect((await walkRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }))).status).toBe(404);
  });
});
