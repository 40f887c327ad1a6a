import crypto from 'node:crypto';

import { beforeAll, describe, expect, it } from 'vitest';

import * as commentsRoute from '@/app/api/boards/[boardId]/comments/route';
import * as approveRoute from '@/app/api/boards/[boardId]/review/approve/route';
import * as returnRoute from '@/app/api/boards/[boardId]/review/return/route';
import * as reviewRoute from '@/app/api/boards/[boardId]/review/route';
import * as revisionRoute from '@/app/api/boards/[boardId]/revisions/[revision]/route';
import * as revisionsRoute from '@/app/api/boards/[boardId]/revisions/route';
import * as boardRoute from '@/app/api/boards/[boardId]/route';
import type { RevisionDiff } from '@/lib/boards/revision-diff';
import type { BoardDto } from '@/lib/boards/types';
import { dispatchDueMail } from '@/lib/mail/outbox';
import { AuditEvent, Board, BoardRevision, User } from '@/models';

import { caughtMail, ctx, jsonRequest, makeBoard, makeOrganisation, signedInName, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
let other: Org;

beforeAll(async () => {
  team = await makeOrganisation('Review');
  other = await makeOrganisation('Outsiders');
});

async function waitForMail(to: string, subject: RegExp) {
  for (let i = 0; i < 50; i += 1) {
    const mail = (await caughtMail()).find((m) => m.to.includes(to) && subject.test(m.subject));
    if (mail) return mail;
    await dispatchDueMail();
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} matching ${subject} arrived at the catcher`);
}

/** A demo flat board made by this team's designer (with an address of its own), in review. */
async function boardInReview() {
  const designer = await User.create({
    organisationId: team.org.id,
    email: `designer-${crypto.randomUUID().slice(0, 8)}@example.test`,
    name: 'Rowan Designer',
    role: 'designer',
  });
  const { board } = await makeBoard(team.org.id, 'flat');
  // Submitting is the editor's step; here the row is put in review directly
  await board.update({ status: 'in-review', createdById: designer.id });
  return { board, designer };
}

/** A review step; an approval carries the signed-in member's typed name unless the body says otherwise. */
const post = (route: typeof approveRoute | typeof returnRoute, boardId: string, body?: object) =>
  route.POST(
    jsonRequest('POST', route === approveRoute ? { declaration: signedInName(), ...body } : body),
    ctx({ boardId }),
  );

const comment = (boardId: string, body: unknown) => commentsRoute.POST(jsonRequest('POST', body), ctx({ boardId }));

async function load(boardId: string): Promise<BoardDto> {
  return (await (await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }))).json()).board;
}

describe('approving', () => {
  it('issues the board as the next revision with a frozen snapshot, and e-mails the designer', async () => {
    const { board, designer } = await boardInReview();
    signInAs(team.users.inspector);
    const review = await (await reviewRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }))).json();
    const wayId = review.board.ways.find((w: { circuit: unknown }) => w.circuit).id;
    expect(review.sizing.ways).toHaveLength(review.board.ways.length);
    expect((await comment(board.id, { wayId, body: 'Label the ring ends at the board.' })).status).toBe(201);

    const res = await post(approveRoute, board.id);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ revision: 1, status: 'issued' });
    await board.reload();
    expect(board.status).toBe('issued');
    const frozen = await BoardRevision.findOne({ where: { boardId: board.id, revision: 1 } });
    expect(frozen?.issuedById).toBe(team.users.inspector.id);
    const snapshot = frozen!.snapshot as { ways: unknown[]; settings: { name: string } };
    expect(snapshot.ways).toHaveLength(review.board.ways.length);
    expect(snapshot.settings.name).toBe(board.name);
    expect((frozen!.sizing as { ways: unknown[] }).ways).toHaveLength(review.board.ways.length);

    const mail = await waitForMail(designer.email, /^Issued: /);
    expect(mail.subject).toBe(`Issued: ${board.name}, revision 1`);
    expect(mail.text).toContain('Label the ring ends at the board.');
    expect(mail.text).toContain(`/boards/${board.id}`);
  });

  it('is for reviewers only, for boards in review only, and within the organisation', async () => {
    const { board } = await boardInReview();
    signInAs(team.users.designer);
    expect((await post(approveRoute, board.id)).status).toBe(403);
    signInAs(team.users.installer);
    expect((await post(approveRoute, board.id)).status).toBe(403);
    signInAs(other.users.admin);
    expect((await post(approveRoute, board.id)).status).toBe(404);
    await board.update({ status: 'draft' });
    signInAs(team.users.inspector);
    const draft = await post(approveRoute, board.id);
    expect(draft.status).toBe(409);
    expect((await draft.json()).error).toMatch(/a draft/);
  });

  it('asks the reviewer to confirm before issuing a board with a failing way', async () => {
    const { board } = await boardInReview();
    signInAs(team.users.designer);
    const opened = await load(board.id);
    // 1.5 mm² lighting run of 300 m: VD ≈ 7.7 % > 3 % (Table 4D5 mV/A/m; Appendix 4 limit)
    const target = opened.ways.find((w) => w.circuit?.use === 'lighting')!;
    await board.update({ status: 'draft' });
    const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = opened;
    const saved = await boardRoute.PUT(
      jsonRequest('PUT', {
        version: (await load(board.id)).version,
        settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
        ways: opened.ways.map(({ id, rail, position, device, circuit }) => ({
          id,
          rail,
          position,
          device,
          circuit: id === target.id ? { ...circuit!, lengthM: 300, csaMm2: 1.5 } : circuit,
        })),
      }),
      ctx({ boardId: board.id }),
    );
    expect(saved.status).toBe(200);
    await Board.update({ status: 'in-review' }, { where: { id: board.id } });
    signInAs(team.users.inspector);
    const refused = await post(approveRoute, board.id);
    expect(refused.status).toBe(422);
    expect((await refused.json()).issues[0].path).toBe('acknowledgeFailures');
    expect((await post(approveRoute, board.id, { acknowledgeFailures: true })).status).toBe(200);
  });
});

describe('returning', () => {
  it('needs a comment, then goes back to draft and e-mails the designer every comment', async () => {
    const { board, designer } = await boardInReview();
    signInAs(team.users.inspector);
    const none = await post(returnRoute, board.id, {});
    expect(none.status).toBe(400);
    expect((await none.json()).issues[0].path).toBe('comment');
    const opened = await load(board.id);
    const ring = opened.ways.find((w) => w.circuit?.use === 'sockets')!;
    expect((await comment(board.id, { wayId: ring.id, body: 'Check the ring length.' })).status).toBe(201);
    const res = await post(returnRoute, board.id, { comment: 'Two points before this can be issued.' });
    expect(res.status).toBe(200);
    expect((await res.json()).status).toBe('draft');
    await board.reload();
    expect(board.status).toBe('draft');
    const mail = await waitForMail(designer.email, /^Returned for changes/);
    expect(mail.text).toContain('Check the ring length.');
    expect(mail.text).toContain('Two points before this can be issued.');
    // The way comment names the way by its printed reference
    expect(mail.text).toMatch(/- Way \d+ \(/);
    expect(mail.text).toContain('- Board (');
  });
});

describe('comments', () => {
  it('name a way of the board, are refused for installers, and are listed with their authors', async () => {
    const { board } = await boardInReview();
    const elsewhere = await makeBoard(team.org.id, 'flat');
    const foreignWay = (await load(elsewhere.board.id)).ways[2].id;
    signInAs(team.users.inspector);
    const wrongWay = await comment(board.id, { wayId: foreignWay, body: 'Hello' });
    expect(wrongWay.status).toBe(400);
    expect((await wrongWay.json()).issues[0].path).toBe('wayId');
    const empty = await comment(board.id, { body: '   ' });
    expect((await empty.json()).issues[0].path).toBe('body');
    signInAs(team.users.installer);
    expect((await comment(board.id, { body: 'Looks fine' })).status).toBe(403);
    signInAs(team.users.designer);
    expect((await comment(board.id, { body: 'Changed as asked.' })).status).toBe(201);
    const { comments } = await (await commentsRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }))).json();
    expect(comments.map((c: { authorName: string; body: string }) => [c.authorName, c.body])).toEqual([
      [team.users.designer.name, 'Changed as asked.'],
    ]);
  });
});

describe('revisions', () => {
  it('keeps every issued revision and says what changed between them', async () => {
    const { board } = await boardInReview();
    signInAs(team.users.inspector);
    expect((await post(approveRoute, board.id)).status).toBe(200);

    // The designer changes the issued board: that starts revision 2
    signInAs(team.users.designer);
    const opened = await load(board.id);
    const numbered = opened.ways.filter((w) => w.device.kind === 'mcb');
    const [first, second, , fourth] = numbered;
    const spare = opened.ways.find((w) => w.device.kind === 'blank')!;
    const { name, location, phases, supply, incoming, enclosureModules, rails, dwelling } = opened;
    const added = crypto.randomUUID();
    // Swap the first two circuits' places, rename the fourth, drop the spare, add a new way at the end
    const ways = opened.ways
      .filter((w) => w.id !== spare.id)
      .map(({ id, rail, position, device, circuit }) => ({
        id,
        rail,
        position: id === first.id ? second.position : id === second.id ? first.position : position,
        device,
        circuit: id === fourth.id ? { ...circuit!, serves: 'Immersion heater (new cylinder)' } : circuit,
      }));
    ways.push({
      id: added,
      rail: 0,
      position: spare.position,
      device: { ...first.device },
      circuit: { ...first.circuit!, serves: 'Garden office' },
    });
    const saved = await boardRoute.PUT(
      jsonRequest('PUT', {
        version: opened.version,
        settings: { name, location, phases, supply, incoming, enclosureModules, rails, dwelling },
        ways,
      }),
      ctx({ boardId: board.id }),
    );
    expect(saved.status).toBe(200);
    expect((await saved.json()).board).toMatchObject({ status: 'draft', revision: 2 });
    // The change history says which revision the save started
    const started = await AuditEvent.findOne({ where: { boardId: board.id, action: 'board.saved' } });
    expect(started?.details).toEqual({ version: opened.version + 1, newRevision: 2 });

    // What changed since revision 1, in the live draft
    const live = await revisionRoute.GET(
      jsonRequest('GET', undefined, `http://127.0.0.1/api/boards/${board.id}/revisions/current?from=1`),
      ctx({ boardId: board.id, revision: 'current' }),
    );
    expect(live.status).toBe(200);
    const diff = (await live.json()).diff.diff as RevisionDiff;
    expect(diff.added.map((w) => w.serves)).toEqual(['Garden office']);
    expect(diff.removed.map((w) => w.serves)).toEqual(['Spare']);
    expect(diff.moved).toHaveLength(1);
    expect([first.id, second.id]).toContain(diff.moved[0].id);
    expect(diff.changed.find((c) => c.id === fourth.id)?.fields).toEqual([
      {
        field: 'circuit.serves',
        label: 'Serves',
        before: fourth.circuit!.serves,
        after: 'Immersion heater (new cylinder)',
      },
    ]);

    // Issued again: both revisions are listed, and the diff between them is the same
    await Board.update({ status: 'in-review' }, { where: { id: board.id } });
    signInAs(team.users.inspector);
    const second2 = await post(approveRoute, board.id);
    expect((await second2.json()).revision).toBe(2);
    signInAs(team.users.installer);
    const list = await (await revisionsRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id }))).json();
    expect(list.revisions.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    expect(list.current).toEqual({ revision: 2, status: 'issued' });
    const between = await revisionRoute.GET(
      jsonRequest('GET', undefined, `http://127.0.0.1/api/boards/${board.id}/revisions/2?from=1`),
      ctx({ boardId: board.id, revision: '2' }),
    );
    const body = await between.json();
    expect(body.revision.issued.byName).toBe(team.users.inspector.name);
    expect(body.diff.diff).toEqual(diff);

    // Junk and missing revisions
    const junk = await revisionRoute.GET(
      jsonRequest('GET', undefined, `http://127.0.0.1/api/boards/${board.id}/revisions/2?from=zero`),
      ctx({ boardId: board.id, revision: '2' }),
    );
    expect((await junk.json()).issues[0].path).toBe('from');
    const missing = await revisionRoute.GET(jsonRequest('GET'), ctx({ boardId: board.id, revision: '7' }));
    expect(missing.status).toBe(404);
  });
});
