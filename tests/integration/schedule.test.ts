import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import { PDFParse } from 'pdf-parse';
import { beforeAll, describe, expect, it } from 'vitest';

import * as approveRoute from '@/app/api/boards/[boardId]/review/approve/route';
import * as labelsRoute from '@/app/api/boards/[boardId]/labels/route';
import * as scheduleRoute from '@/app/api/boards/[boardId]/schedule/route';
import * as emailRoute from '@/app/api/boards/[boardId]/schedule/email/route';
import { DESIGN_VALUES_NOTE, NOTICES_NOTE, SCHEDULE_COLUMNS } from '@/features/schedule/utils/build-schedule';
import { layoutWays } from '@/lib/boards/layout';
import type { WayInput } from '@/lib/boards/schemas';
import { SIZING_CAUTION } from '@/lib/sizing';
import { Board, Site, Way } from '@/models';

import { caughtMail, ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;

/** Set SCHEDULE_PDF_DIR to keep the PDFs this file renders (to look at them as images). */
const KEEP = process.env.SCHEDULE_PDF_DIR;

/** The text of a PDF, page by page, with runs of white space made single spaces. */
async function pdfText(bytes: Uint8Array, keepAs?: string) {
  if (KEEP && keepAs) fs.writeFileSync(path.join(KEEP, keepAs), bytes);
  const parser = new PDFParse({ data: bytes.slice() });
  try {
    const result = await parser.getText();
    const squash = (t: string) => t.replace(/\s+/g, ' ');
    return { total: result.total, pages: result.pages.map((p) => squash(p.text)), text: squash(result.text) };
  } finally {
    await parser.destroy();
  }
}

function get(route: typeof scheduleRoute | typeof labelsRoute, boardId: string, query = '') {
  return route.GET(jsonRequest('GET', undefined, `http://127.0.0.1/api/boards/${boardId}/x${query}`), ctx({ boardId }));
}

/** Puts a board in review (the editor's step, done on the row here) and approves it as the inspector. */
async function issue(org: Org, boardId: string) {
  await Board.update({ status: 'in-review' }, { where: { id: boardId } });
  signInAs(org.users.inspector);
  const res = await approveRoute.POST(
    jsonRequest('POST', { acknowledgeFailures: true, declaration: org.users.inspector.name }),
    ctx({ boardId }),
  );
  expect(res.status).toBe(200);
  return (await res.json()) as { revision: number };
}

/** A single-phase board of 144 numbered ways on 8 rails, an RCD before every twelve. */
async function makeBigBoard(organisationId: string) {
  const site = await Site.create({ organisationId, name: 'Big site' });
  const board = await Board.create({
    organisationId,
    siteId: site.id,
    name: 'Test hall main board',
    location: 'Plant room',
    phases: 1,
    supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.2, pfcKa: 6, source: 'public' },
    incoming: { kind: 'main-switch', ratingA: 400 },
    enclosureModules: 200,
    rails: 8,
    dwelling: false,
  });
  const ways: (WayInput & { boardId: string })[] = [];
  const push = (w: Omit<WayInput, 'id' | 'rail' | 'position'>) => {
    const index = ways.length;
    ways.push({ ...w, id: crypto.randomUUID(), rail: Math.floor(index / 21), position: index % 21, boardId: board.id });
  };
  for (let n = 1; n <= 144; n += 1) {
    if (n % 12 === 1)
      push({ device: { kind: 'rcd', poles: 2, modules: 2, ratingA: 63, rcdMa: 30, rcdType: 'A' }, circuit: null });
    if (n % 20 === 0) {
      push({ device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null });
      continue;
    }
    push({
      device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 10, breakingKa: 6 },
      circuit: {
        serves: `Hall lighting bay ${n}`,
        phases: 1,
        use: 'lighting',
        load: { kind: 'known', watts: 400 + n, powerFactor: 0.95 },
        lengthM: 10 + (n % 30),
        cable: 'te-70',
        method: 'C',
        ambientC: 30,
        grouping: { circuits: 1, arrangement: 'bunched' },
        insulationMm: 0,
        csaMm2: null,
        concealedInWall: false,
      },
    });
  }
  await Way.bulkCreate(ways);
  return board;
}

let ours: Org;
let theirs: Org;
let flat: { board: Board };
let workshop: { board: Board };

beforeAll(async () => {
  ours = await makeOrganisation('Schedule');
  theirs = await makeOrganisation('Elsewhere');
  flat = await makeBoard(ours.org.id, 'flat');
  workshop = await makeBoard(ours.org.id, 'workshop');
});

describe('the schedule PDF', () => {
  it('holds every way by reference and what it serves, our column headings, the caution and the revision', async () => {
    signInAs(ours.users.designer);
    const res = await get(scheduleRoute, flat.board.id);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect(Buffer.from(bytes.slice(0, 5)).toString()).toBe('%PDF-');
    const { text, total } = await pdfText(bytes, 'flat-draft.pdf');
    expect(total).toBe(1);
    const ways = await Way.findAll({ where: { boardId: flat.board.id } });
    const places = layoutWays(1, ways as unknown as WayInput[]);
    const numbered = places.filter((p) => p.label);
    // Every numbered way of the demo flat: its circuits and the spare
    expect(numbered.length).toBeGreaterThanOrEqual(9);
    for (const place of numbered) {
      const way = ways.find((w) => w.id === place.id)!;
      const serves = (way.circuit?.serves as string | undefined) ?? 'Spare (blank)';
      // The way reference and what it serves sit on one row of the table
      expect(text).toMatch(new RegExp(`${place.label} ${serves.replace(/[()]/g, '\\$&')}`));
    }
    for (const col of SCHEDULE_COLUMNS.filter((c) => c.key !== 'label'))
      expect(text).toContain(col.heading.replace(/\s+/g, ' '));
    expect(text).toContain(SIZING_CAUTION);
    expect(text).toContain('Revision 1');
    expect(text).toContain('Not issued');
    expect(text).toContain('Test the RCDs');
  });

  it('groups ways under the RCD that protects them', async () => {
    signInAs(ours.users.designer);
    const { text } = await pdfText(new Uint8Array(await (await get(scheduleRoute, flat.board.id)).arrayBuffer()));
    const heading = 'RCD 63 A 30 mA, type A: RCD protection for the ways below';
    const first = text.indexOf(heading);
    const second = text.indexOf(heading, first + 1);
    expect(first).toBeGreaterThan(-1);
    expect(second).toBeGreaterThan(first);
    // Each way sits under the RCD before it on the rail
    const ways = (await Way.findAll({ where: { boardId: flat.board.id }, order: [['position', 'ASC']] })).map((w) => ({
      kind: w.device.kind as string,
      serves: (w.circuit?.serves as string | undefined) ?? null,
    }));
    let rcds = 0;
    for (const way of ways) {
      if (way.kind === 'rcd') rcds += 1;
      if (!way.serves) continue;
      const at = text.indexOf(way.serves);
      expect(at).toBeGreaterThan(rcds === 1 ? first : second);
      if (rcds === 1) expect(at).toBeLessThan(second);
    }
    expect(rcds).toBe(2);
  });

  it('speaks the trade: no internal code or id, design values marked on every page, and counts equal to the way numbers printed', async () => {
    signInAs(ours.users.designer);
    for (const [name, board, phases] of [
      ['flat', flat.board, 1],
      ['workshop', workshop.board, 3],
    ] as const) {
      const { text, pages } = await pdfText(
        new Uint8Array(await (await get(scheduleRoute, board.id)).arrayBuffer()),
        `${name}-trade.pdf`,
      );
      // No id, no code of the app's vocabularies (lower-case codes; "RCBO" and "MCB" are trade words)
      expect(text).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i);
      expect(text).not.toMatch(
        /main-switch|fuse-bs|ring-32|radial-(20|32)|te-70|single-pvc|multi-pvc|swa-xlpe|in-review|labels-matched|near-limit|socket-arrangement|unchecked|mcb|rcbo|rcd|verified/,
      );
      // Temperatures carry their unit
      expect(text).not.toMatch(/\d°(?! ?C)/);
      // R1+R2 and Zs are headed as design values, and every page says they are not test results
      expect(text).toContain('Design R1+R2 Ω');
      expect(text).toContain('Design Zs Ω');
      for (const page of pages) expect(page).toContain(DESIGN_VALUES_NOTE);
      expect(text).toContain(NOTICES_NOTE);
      // The counts: way numbers printed as rows, against the totals
      const ways = await Way.findAll({ where: { boardId: board.id } });
      const places = layoutWays(phases, ways as unknown as WayInput[]).filter((p) => p.label);
      for (const place of places) {
        const serves = (ways.find((w) => w.id === place.id)!.circuit?.serves as string | undefined) ?? 'Spare (blank)';
        expect(text).toMatch(new RegExp(`${place.label} ${serves.replace(/[()]/g, '\\$&')}`));
      }
      const highest = Math.max(...places.map((p) => p.wayNumber!));
      const circuits = ways.filter((w) => w.circuit && places.some((p) => p.id === w.id)).length;
      const total =
        /Ways (\d+) ways(?: \((\d+) single-pole positions\))?: (\d+) circuits?, (\d+) (?:positions )?spare/.exec(text);
      expect(total, `the totals of the ${name}`).not.toBeNull();
      const [, waysN, positionsN, circuitsN, spareN] = total!;
      expect(Number(waysN)).toBe(highest);
      expect(Number(circuitsN)).toBe(circuits);
      if (phases === 3) {
        expect(Number(positionsN)).toBe(highest * 3);
        const taken = places
          .filter((p) => ways.find((w) => w.id === p.id)!.circuit)
          .reduce((n, p) => n + p.phases.length, 0);
        expect(Number(spareN)).toBe(highest * 3 - taken);
      } else {
        expect(positionsN).toBeUndefined();
        expect(Number(spareN)).toBe(highest - circuits);
      }
      // No phase position beyond the highest way is printed
      if (phases === 3) expect(text).not.toMatch(new RegExp(`\\b${highest + 1}L[123]`));
    }
  });

  it('names three-phase ways per phase and carries the 400 V notice', async () => {
    signInAs(ours.users.admin);
    const { text } = await pdfText(
      new Uint8Array(await (await get(scheduleRoute, workshop.board.id)).arrayBuffer()),
      'workshop-draft.pdf',
    );
    expect(text).toMatch(/1L1–L3 Panel saw/);
    expect(text).toMatch(/4L1 Lighting: machine shop/);
    expect(text).toContain('400 V inside');
    expect(text).toContain('Three-phase');
  });

  it('a 144-way board runs over several pages, each with the column headings and the caution', async () => {
    const big = await makeBigBoard(ours.org.id);
    signInAs(ours.users.inspector);
    const started = performance.now();
    const res = await get(scheduleRoute, big.id);
    const ms = performance.now() - started;
    expect(res.status).toBe(200);
    const { pages, text, total } = await pdfText(new Uint8Array(await res.arrayBuffer()), 'big-draft.pdf');
    expect(total).toBeGreaterThanOrEqual(4);
    for (const page of pages) {
      for (const heading of ['Way', 'Serves', 'Protection', 'Line / cpc mm²', 'Design check']) {
        expect(page).toContain(heading);
      }
      expect(page).toContain('Test hall main board');
      expect(page).toContain(SIZING_CAUTION);
    }
    expect(pages[total - 1]).toContain(`page ${total} of ${total}`);
    for (let n = 1; n <= 144; n += 1) {
      expect(text).toContain(n % 20 === 0 ? `${n} Spare (blank)` : `${n} Hall lighting bay ${n} `);
    }
    // The issue's target is under 4 s on this machine (the benchmark measures it properly)
    expect(ms).toBeLessThan(6000);
  });

  it('shows the issuer once issued, and frozen revisions stay printable', async () => {
    const { board } = await makeBoard(ours.org.id, 'flat');
    const { revision } = await issue(ours, board.id);
    expect(revision).toBe(1);
    signInAs(ours.users.designer);
    // A change starts revision 2 as a draft; revision 1 still prints as issued
    await Board.update({ status: 'draft', revision: 2 }, { where: { id: board.id } });
    await Way.update(
      {
        circuit: {
          ...((await Way.findOne({ where: { boardId: board.id, position: 2 } }))!.circuit as object),
          serves: 'Sockets: kitchen (rewired)',
        },
      },
      { where: { boardId: board.id, position: 2 } },
    );
    const old = await pdfText(new Uint8Array(await (await get(scheduleRoute, board.id, '?revision=1')).arrayBuffer()));
    expect(old.text).toContain('Revision 1');
    expect(old.text).toContain(`by ${ours.users.inspector.name}`);
    expect(old.text).toContain('Sockets: kitchen and utility');
    expect(old.text).not.toContain('rewired');
    const draft = await pdfText(new Uint8Array(await (await get(scheduleRoute, board.id)).arrayBuffer()));
    expect(draft.text).toContain('Revision 2');
    expect(draft.text).toContain('Sockets: kitchen (rewired)');
  });

  it('refuses a bad or unknown revision, and another organisation’s board', async () => {
    signInAs(ours.users.designer);
    const junk = await get(scheduleRoute, flat.board.id, '?revision=two');
    expect(junk.status).toBe(400);
    expect((await junk.json()).issues[0].path).toBe('revision');
    expect((await get(scheduleRoute, flat.board.id, '?revision=9')).status).toBe(404);
    signInAs(theirs.users.admin);
    expect((await get(scheduleRoute, flat.board.id)).status).toBe(404);
    signInAs(null);
    expect((await get(scheduleRoute, flat.board.id)).status).toBe(401);
  });
});

describe('installers print issued boards only', () => {
  it('cannot print a draft, can print it once issued', async () => {
    const { board } = await makeBoard(ours.org.id, 'flat');
    signInAs(ours.users.installer);
    const refused = await get(scheduleRoute, board.id);
    expect(refused.status).toBe(403);
    expect((await refused.json()).error).toMatch(/not been issued/);
    expect((await get(scheduleRoute, board.id, '?revision=1')).status).toBe(403);
    expect((await get(labelsRoute, board.id)).status).toBe(403);
    await issue(ours, board.id);
    signInAs(ours.users.installer);
    const res = await get(scheduleRoute, board.id);
    expect(res.status).toBe(200);
    const { text } = await pdfText(new Uint8Array(await res.arrayBuffer()), 'flat-issued.pdf');
    expect(text).toContain('Issued');
    expect(text).not.toContain('Not issued');
  });
});

describe('label strips', () => {
  it('print every device of the rail in order, with the module pitch stated', async () => {
    signInAs(ours.users.designer);
    const res = await get(labelsRoute, workshop.board.id);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const { text } = await pdfText(new Uint8Array(await res.arrayBuffer()), 'workshop-labels.pdf');
    expect(text).toContain('17.5 mm per module');
    // The workshop's rail (28 modules of devices) is one strip in two pieces that meet at a marked join
    expect(text).toMatch(/Rail 1 \(28 modules: one strip in 2 pieces, joined at J1\)/);
    const order = [
      'Main switch',
      'Panel saw',
      'Dust extractor',
      'Spindle moulder',
      'Lighting: machine shop',
      'Fire alarm panel',
    ];
    const at = order.map((t) => text.indexOf(t));
    expect(at.every((i) => i > -1)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
  });
});

describe('e-mailing the schedule', () => {
  async function waitForMail(to: string) {
    for (let i = 0; i < 50; i += 1) {
      const mail = (await caughtMail()).find((m) => m.to.includes(to));
      if (mail) return mail;
      await new Promise((r) => setTimeout(r, 200));
    }
    throw new Error(`no mail to ${to}`);
  }

  it('anyone who may print may send it: the PDF arrives at the catcher and the outbox shows it sent', async () => {
    const { board } = await makeBoard(ours.org.id, 'flat');
    await issue(ours, board.id);
    signInAs(ours.users.installer);
    const to = `client-${crypto.randomUUID().slice(0, 8)}@example.test`;
    const res = await emailRoute.POST(
      jsonRequest('POST', { to, message: 'As fitted today.' }),
      ctx({ boardId: board.id }),
    );
    expect(res.status).toBe(202);
    expect((await res.json()).mail.status).toBe('queued');
    const mail = await waitForMail(to);
    expect(mail.subject).toContain('Flat 1 consumer unit, revision 1');
    expect(mail.text).toContain('As fitted today.');
    expect(mail.attachments.map((a) => a.filename)).toEqual(['schedule-flat-1-consumer-unit-rev1.pdf']);
    let status = '';
    for (let i = 0; i < 25 && status !== 'sent'; i += 1) {
      const list = await (await emailRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }))).json();
      status = list.mails.find((m: { to: string }) => m.to === to)?.status ?? '';
      if (status !== 'sent') await new Promise((r) => setTimeout(r, 200));
    }
    expect(status).toBe('sent');
  });

  it('refuses a bad address by field, and an installer sending a draft', async () => {
    signInAs(ours.users.designer);
    const bad = await emailRoute.POST(jsonRequest('POST', { to: 'not-an-address' }), ctx({ boardId: flat.board.id }));
    expect(bad.status).toBe(400);
    expect((await bad.json()).issues[0].path).toBe('to');
    signInAs(ours.users.installer);
    const draft = await emailRoute.POST(jsonRequest('POST', { to: 'x@example.test' }), ctx({ boardId: flat.board.id }));
    expect(draft.status).toBe(403);
  });
});
