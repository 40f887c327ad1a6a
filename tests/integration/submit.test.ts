import { beforeAll, describe, expect, it } from 'vitest';

import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as submitRoute from '@/app/api/boards/[boardId]/submit/route';
import type { BoardDto } from '@/lib/boards/types';
import { dispatchDueMail } from '@/lib/mail/outbox';
import { AuditEvent, Board, OutgoingMail } from '@/models';

import { caughtMail, ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Submit');
});

async function load(boardId: string): Promise<BoardDto> {
  const res = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }));
  return (await res.json()).board;
}

async function waitForMail(to: string) {
  for (let i = 0; i < 50; i++) {
    const mail = (await caughtMail()).find((m) => m.to.includes(to));
    if (mail) return mail;
    await dispatchDueMail();
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} arrived at the catcher`);
}

const submit = (boardId: string, body?: unknown) => submitRoute.POST(jsonRequest('POST', body), ctx({ boardId }));

describe('sending a board for review', () => {
  it('a board with a failing way is refused with 422 listing it, and stays a draft', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'flat');
    const opened = await load(board.id);
    // Fix one lighting circuit at 1.5 mm² and make it 300 m long: Ib = 420 / (230 · 0.9) = 2.03 A,
    // VD = 29 mV/A/m · 2.03 A · 300 m = 17.7 V = 7.7 % > 3 % (Table 4D5; Appendix 4 limit)
    const target = opened.ways.find((w) => w.circuit?.use === 'lighting')!;
    const ways = opened.ways.map(({ id, rail, position, device, circuit }) => ({
      id,
      rail,
      position,
      device,
      circuit: id === target.id ? { ...circuit!, lengthM: 300, csaMm2: 1.5 } : circuit,
    }));
    const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = opened;
    const saved = await boardRoute.PUT(
      jsonRequest('PUT', {
        version: opened.version,
        settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
        ways,
      }),
      ctx({ boardId: board.id }),
    );
    expect(saved.status).toBe(200);
    const mailBefore = await OutgoingMail.count({ where: { organisationId: team.org.id } });

    const res = await submit(board.id);
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error).toMatch(/1 way fails/);
    expect(body.failing).toHaveLength(1);
    expect(body.failing[0]).toMatchObject({ wayId: target.id, label: '3', serves: target.circuit!.serves });
    expect(body.failing[0].problems.length).toBeGreaterThan(0);

    const after = await load(board.id);
    expect(after.status).toBe('draft');
    expect(await AuditEvent.count({ where: { boardId: board.id, action: 'board.status' } })).toBe(0);
    expect(await OutgoingMail.count({ where: { organisationId: team.org.id } })).toBe(mailBefore);
  });

  it('a sound board goes to in review, is audited, and every inspector gets an e-mail', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'workshop');
    const opened = await load(board.id);
    const res = await submit(board.id, { version: opened.version });
    expect(res.status).toBe(200);
    const { board: sent } = await res.json();
    expect(sent.status).toBe('in-review');
    expect(sent.version).toBe(opened.version + 1);
    expect((await Board.findByPk(board.id))?.status).toBe('in-review');

    const events = await AuditEvent.findAll({ where: { boardId: board.id, action: 'board.status' } });
    expect(events).toHaveLength(1);
    expect(events[0].details).toMatchObject({ from: 'draft', to: 'in-review' });

    const mail = await waitForMail(team.users.inspector.email);
    expect(mail.subject).toContain('Workshop DB1');
    expect(mail.text).toContain(`/boards/${board.id}`);
    expect(mail.text).toContain(team.users.designer.name);
    // The ways counted by way number, in the words of the boards list and the schedule
    expect(mail.text).toContain('8 ways (24 single-pole positions): 15 circuits, 3 positions spare');
    // No code or id outside the links
    const words = mail.text
      .split('\n')
      .filter((line: string) => !/https?:\/\//.test(line))
      .join('\n');
    expect(words).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i);
    expect(words).not.toMatch(/main-switch|fuse-bs|ring-32|radial-|te-70|swa-xlpe|verified/);
    // Nobody but the inspectors is written to
    const queued = await OutgoingMail.findAll({ where: { organisationId: team.org.id } });
    const forThisBoard = queued.filter((m) => m.textBody.includes(board.id));
    expect(forThisBoard.map((m) => m.toAddress)).toEqual([team.users.inspector.email]);

    // Sent twice: refused, it is no longer a draft
    const again = await submit(board.id);
    expect(again.status).toBe(409);
  });

  it('a stale version is refused with 409', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'workshop');
    const opened = await load(board.id);
    const res = await submit(board.id, { version: opened.version - 1 + 5 });
    expect(res.status).toBe(409);
    expect((await res.json()).currentVersion).toBe(opened.version);
    expect((await load(board.id)).status).toBe('draft');
  });

  it('only admins and designers may send a board for review', async () => {
    const { board } = await makeBoard(team.org.id, 'workshop');
    for (const role of ['inspector', 'installer'] as const) {
      signInAs(team.users[role]);
      expect((await submit(board.id)).status).toBe(403);
    }
    signInAs(null);
    expect((await submit(board.id)).status).toBe(401);
  });

  it('another organisation’s board is 404', async () => {
    const other = await makeOrganisation('Elsewhere');
    const { board } = await makeBoard(other.org.id, 'workshop');
    signInAs(team.users.designer);
    expect((await submit(board.id)).status).toBe(404);
    expect((await Board.findByPk(board.id))?.status).toBe('draft');
  });

  it('a junk body is a 400 naming the field', async () => {
    signInAs(team.users.designer);
    const { board } = await makeBoard(team.org.id, 'workshop');
    const res = await submit(board.id, { version: 'two' });
    expect(res.status).toBe(400);
    expect((await res.json()).issues[0].path).toBe('version');
  });
});
