/**
 * Nothing issued can be lost (lib/boards/record-rules.ts and migration 0006): sites and issued
 * boards are archived, never deleted, and an admin restores them; a draft board's delete is
 * undone; the database itself refuses to remove an issued revision; a board is issued by
 * someone other than its last designer, with a typed declaration; the designer reads a
 * returned review; photos are stored without their metadata; archive and save of one board
 * at once leave one consistent state.
 */
import crypto from 'node:crypto';

import pg from 'pg';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';

import * as photoRoute from '@/app/api/attachments/[attachmentId]/route';
import * as thumbRoute from '@/app/api/attachments/[attachmentId]/thumb/route';
import * as archiveRoute from '@/app/api/boards/[boardId]/archive/route';
import * as attachmentsRoute from '@/app/api/boards/[boardId]/attachments/route';
import * as auditRoute from '@/app/api/boards/[boardId]/audit/route';
import * as answeredRoute from '@/app/api/boards/[boardId]/comments/answered/route';
import * as commentsRoute from '@/app/api/boards/[boardId]/comments/route';
import * as restoreRoute from '@/app/api/boards/[boardId]/restore/route';
import * as approveRoute from '@/app/api/boards/[boardId]/review/approve/route';
import * as returnRoute from '@/app/api/boards/[boardId]/review/return/route';
import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as scheduleRoute from '@/app/api/boards/[boardId]/schedule/route';
import * as submitRoute from '@/app/api/boards/[boardId]/submit/route';
import * as undoRoute from '@/app/api/boards/[boardId]/undo-delete/route';
import * as boardsRoute from '@/app/api/boards/route';
import * as organisationRoute from '@/app/api/organisation/route';
import * as siteRestoreRoute from '@/app/api/sites/[siteId]/restore/route';
import * as siteRoute from '@/app/api/sites/[siteId]/route';
import * as sitesRoute from '@/app/api/sites/route';
import { saveBodyOf } from '@/lib/api/save-body';
import type { BoardDto } from '@/lib/boards/types';
import { getReturnNotes } from '@/lib/dal/comments';
import { dispatchDueMail } from '@/lib/mail/outbox';
import { getObjectBytes } from '@/lib/storage/s3';
import { Attachment, AuditEvent, Board, BoardRevision, Comment, Site } from '@/models';

import { caughtMail, ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
type User = Org['users']['admin'];
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Records');
});

const actorOf = (u: User) => ({
  userId: u.id,
  organisationId: team.org.id,
  role: u.role,
  name: u.name,
  email: u.email,
});
const byBoard = (boardId: string) => ctx({ boardId });
const bySite = (siteId: string) => ctx({ siteId });
const get = (r: { GET: typeof boardRoute.GET }, boardId: string, url = 'http://127.0.0.1/api/x') =>
  r.GET(jsonRequest('GET', undefined, url), byBoard(boardId));
const load = async (boardId: string): Promise<BoardDto> => (await (await get(boardRoute, boardId)).json()).board;
const save = (board: BoardDto, change: (b: ReturnType<typeof saveBodyOf>) => void = () => undefined) => {
  const body = saveBodyOf(board);
  change(body);
  return boardRoute.PUT(jsonRequest('PUT', body), byBoard(board.id));
};
const listBoards = async (query = '') =>
  (await (await boardsRoute.GET(jsonRequest('GET', undefined, `http://127.0.0.1/api/boards${query}`), ctx({}))).json())
    .boards as { id: string; archivedAt: string | null }[];
const listSites = async (query = '') =>
  (await (await sitesRoute.GET(jsonRequest('GET', undefined, `http://127.0.0.1/api/sites${query}`), ctx({}))).json())
    .sites as { id: string; archived: { byName: string } | null }[];

/** Submits as `designer` and issues as `issuer` (declaring with their own name). */
async function issue(boardId: string, designer: User = team.users.designer, issuer: User = team.users.inspector) {
  signInAs(designer);
  const submitted = await submitRoute.POST(jsonRequest('POST', {}), byBoard(boardId));
  expect(submitted.status, await submitted.clone().text()).toBe(200);
  signInAs(issuer);
  const res = await approveRoute.POST(
    jsonRequest('POST', { acknowledgeFailures: true, declaration: issuer.name }),
    byBoard(boardId),
  );
  expect(res.status, await res.clone().text()).toBe(200);
  return (await res.json()) as { revision: number };
}

/** A demo flat board on a site of its own, saved once by `by` (so its last designer is known). */
async function draftBoard(by: User = team.users.designer) {
  const { site, board } = await makeBoard(team.org.id, 'flat');
  await site.update({ name: `Site ${crypto.randomUUID().slice(0, 6)}` });
  signInAs(by);
  const res = await save(await load(board.id));
  expect(res.status).toBe(200);
  return { siteId: site.id, boardId: board.id };
}

async function scheduleStatus(boardId: string, revision?: number) {
  const url = `http://127.0.0.1/api/boards/${boardId}/schedule${revision ? `?revision=${revision}` : ''}`;
  const res = await get(scheduleRoute, boardId, url);
  return { status: res.status, type: res.headers.get('content-type'), bytes: (await res.arrayBuffer()).byteLength };
}

async function actionsOf(
  boardId: string,
): Promise<{ action: string; details: Record<string, unknown>; userName: string }[]> {
  signInAs(team.users.admin);
  return (await (await get(auditRoute, boardId)).json()).entries;
}

describe('sites are archived, not deleted', () => {
  it('a designer’s DELETE of a site holding an issued board is refused, and the issued schedule still downloads', async () => {
    const { siteId, boardId } = await draftBoard();
    const { revision } = await issue(boardId);
    signInAs(team.users.designer);
    const refused = await siteRoute.DELETE(jsonRequest('DELETE'), bySite(siteId));
    expect(refused.status).toBe(403);
    expect((await refused.json()).error).toMatch(/issued.*only an admin may archive it/);
    expect((await Site.findByPk(siteId))!.archivedAt).toBeNull();
    expect(await Board.count({ where: { id: boardId } })).toBe(1);
    expect(await BoardRevision.count({ where: { boardId } })).toBe(1);
    expect(await scheduleStatus(boardId, revision)).toMatchObject({ status: 200, type: 'application/pdf' });
  });

  it('an admin archives it: it leaves the lists, stays readable and printable, read-only; a restore brings everything back', async () => {
    const { siteId, boardId } = await draftBoard();
    const { revision } = await issue(boardId);
    signInAs(team.users.designer);
    const { boardId: draftId } = await draftBoard();
    await Board.update({ siteId }, { where: { id: draftId } });
    const before = { issued: await load(boardId), draft: await load(draftId) };
    const pdfBefore = await scheduleStatus(boardId, revision);

    signInAs(team.users.admin);
    const archived = await siteRoute.DELETE(jsonRequest('DELETE'), bySite(siteId));
    expect(archived.status).toBe(200);
    expect((await archived.json()).site.archived).toMatchObject({ byName: team.users.admin.name });

    // Out of the lists, in the archived lists
    for (const user of [team.users.admin, team.users.designer, team.users.installer]) {
      signInAs(user);
      expect((await listSites()).map((s) => s.id)).not.toContain(siteId);
      expect((await listBoards()).map((b) => b.id)).not.toContain(boardId);
      expect((await listSites('?archived=1')).map((s) => s.id)).toContain(siteId);
      const archivedBoards = await listBoards('?archived=1');
      expect(archivedBoards.find((b) => b.id === boardId)?.archivedAt).toBeTruthy();
    }
    // Readable, printable, not writable
    signInAs(team.users.designer);
    expect((await load(boardId)).ways).toEqual(before.issued.ways);
    expect(await scheduleStatus(boardId, revision)).toEqual(pdfBefore);
    const refusedSave = await save(await load(draftId), (b) => (b.settings.name = 'Changed while archived'));
    expect(refusedSave.status).toBe(409);
    expect((await refusedSave.json()).error).toMatch(/site is archived/);
    expect((await Board.findByPk(draftId))!.name).toBe(before.draft.name);
    const comment = await commentsRoute.POST(jsonRequest('POST', { body: 'Late note' }), byBoard(boardId));
    expect(comment.status).toBe(409);
    // Only an admin restores
    expect((await siteRestoreRoute.POST(jsonRequest('POST'), bySite(siteId))).status).toBe(403);
    signInAs(team.users.admin);
    const restored = await siteRestoreRoute.POST(jsonRequest('POST'), bySite(siteId));
    expect(restored.status).toBe(200);
    expect((await restored.json()).site).toMatchObject({ archived: null, boardCount: 2 });
    expect((await listSites()).map((s) => s.id)).toContain(siteId);
    expect((await listBoards()).map((b) => b.id)).toEqual(expect.arrayContaining([boardId, draftId]));
    const after = await load(draftId);
    expect(after.ways).toEqual(before.draft.ways);
    signInAs(team.users.designer);
    expect((await save(after, (b) => (b.settings.name = 'Changed after restore'))).status).toBe(200);
    // The audit trail names the archive and the restore, and who did them
    const trail = await actionsOf(boardId);
    expect(trail.find((e) => e.action === 'board.archived')).toMatchObject({ userName: team.users.admin.name });
    expect(trail.find((e) => e.action === 'board.restored')).toMatchObject({ userName: team.users.admin.name });
    const siteEvents = await AuditEvent.findAll({
      where: { organisationId: team.org.id, action: ['site.archived', 'site.restored'] },
    });
    expect(siteEvents.filter((e) => e.details.siteId === siteId).map((e) => e.action)).toEqual([
      'site.archived',
      'site.restored',
    ]);
  });

  it('a designer may archive a site of draft boards only, and an installer not at all', async () => {
    const { siteId } = await draftBoard();
    signInAs(team.users.installer);
    expect((await siteRoute.DELETE(jsonRequest('DELETE'), bySite(siteId))).status).toBe(403);
    signInAs(team.users.designer);
    expect((await siteRoute.DELETE(jsonRequest('DELETE'), bySite(siteId))).status).toBe(200);
    expect((await siteRoute.DELETE(jsonRequest('DELETE'), bySite(siteId))).status).toBe(409);
    expect(await Site.count({ where: { id: siteId } })).toBe(1);
  });

  it('a site with no boards archives too (its count of issued revisions is over no boards)', async () => {
    const site = await Site.create({ organisationId: team.org.id, name: `Empty yard ${crypto.randomUUID()}` });
    signInAs(team.users.designer);
    const res = await siteRoute.DELETE(jsonRequest('DELETE'), bySite(site.id));
    expect(res.status).toBe(200);
    expect((await Site.findByPk(site.id))!.archivedAt).not.toBeNull();
  });
});

describe('boards', () => {
  it('a designer deletes a never-issued board, and undo brings it back exactly', async () => {
    const { boardId } = await draftBoard();
    signInAs(team.users.designer);
    const before = await load(boardId);
    const removed = await boardRoute.DELETE(jsonRequest('DELETE'), byBoard(boardId));
    expect(await removed.json()).toEqual({ effect: 'deleted' });
    expect((await get(boardRoute, boardId)).status).toBe(404);
    expect((await listBoards()).map((b) => b.id)).not.toContain(boardId);
    expect((await listBoards('?archived=1')).map((b) => b.id)).not.toContain(boardId);
    // An inspector cannot undo it; the designer can
    signInAs(team.users.inspector);
    expect((await undoRoute.POST(jsonRequest('POST'), byBoard(boardId))).status).toBe(403);
    signInAs(team.users.designer);
    const undone = await undoRoute.POST(jsonRequest('POST'), byBoard(boardId));
    expect(undone.status).toBe(200);
    const back = await load(boardId);
    expect(back.ways).toEqual(before.ways);
    expect({ ...back, version: 0, updatedAt: '' }).toEqual({ ...before, version: 0, updatedAt: '' });
    expect((await listBoards()).map((b) => b.id)).toContain(boardId);
    expect((await undoRoute.POST(jsonRequest('POST'), byBoard(boardId))).status).toBe(409);
    const trail = (await actionsOf(boardId)).map((e) => e.action);
    expect(trail.slice(0, 2)).toEqual(['board.undeleted', 'board.deleted']);
  });

  it('an issued board is never deleted: a designer is refused, an admin archives it and restores it', async () => {
    const { boardId } = await draftBoard();
    const { revision } = await issue(boardId);
    signInAs(team.users.designer);
    const refused = await boardRoute.DELETE(jsonRequest('DELETE'), byBoard(boardId));
    expect(refused.status).toBe(403);
    expect((await refused.json()).error).toMatch(/issued, so it is kept/);
    expect((await archiveRoute.POST(jsonRequest('POST'), byBoard(boardId))).status).toBe(403);
    signInAs(team.users.admin);
    expect(await (await boardRoute.DELETE(jsonRequest('DELETE'), byBoard(boardId))).json()).toEqual({
      effect: 'archived',
    });
    expect((await Board.findByPk(boardId))!.deletedAt).toBeNull();
    expect((await listBoards()).map((b) => b.id)).not.toContain(boardId);
    expect((await scheduleStatus(boardId, revision)).status).toBe(200);
    expect((await archiveRoute.POST(jsonRequest('POST'), byBoard(boardId))).status).toBe(409);
    signInAs(team.users.designer);
    expect((await restoreRoute.POST(jsonRequest('POST'), byBoard(boardId))).status).toBe(403);
    signInAs(team.users.admin);
    expect((await restoreRoute.POST(jsonRequest('POST'), byBoard(boardId))).status).toBe(200);
    expect((await listBoards()).map((b) => b.id)).toContain(boardId);
  });

  it('the database itself refuses to remove an issued revision or its board, even to the app’s own role', async () => {
    const { boardId } = await draftBoard();
    await issue(boardId);
    const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await client.connect();
    try {
      await expect(client.query('delete from board_revisions where board_id = $1', [boardId])).rejects.toThrow(/kept/);
      await expect(
        client.query("update board_revisions set declaration = 'x' where board_id = $1", [boardId]),
      ).rejects.toThrow(/kept/);
      await expect(client.query('delete from boards where id = $1', [boardId])).rejects.toThrow(/issued revision/);
      await expect(client.query('delete from comments where board_id = $1', [boardId])).resolves.toBeTruthy();
    } finally {
      await client.end();
    }
    expect(await BoardRevision.count({ where: { boardId } })).toBe(1);
  });
});

describe('the history of a board', () => {
  it('is read for chosen kinds of event, so a long history since cannot hide them; a malformed list is 400', async () => {
    const { boardId } = await draftBoard();
    const org = (await Board.findByPk(boardId))!.organisationId;
    await AuditEvent.create({ organisationId: org, boardId, action: 'board.supply-changed', details: { cause: 'x' } });
    // A walk since: one event per label, more than a page
    await AuditEvent.bulkCreate(
      Array.from({ length: 120 }, (_, i) => ({
        organisationId: org,
        boardId,
        action: 'label.checked',
        details: { wayId: `w${i}` },
      })),
    );
    signInAs(team.users.admin);
    const page = (url: string) => get(auditRoute, boardId, url);
    const all = await (await page('http://127.0.0.1/api/x')).json();
    expect(all.entries.some((e: { action: string }) => e.action === 'board.supply-changed')).toBe(false);
    const chosen = await (await page('http://127.0.0.1/api/x?actions=board.supply-changed,review.approved')).json();
    expect(chosen.entries.map((e: { action: string }) => e.action)).toEqual(['board.supply-changed']);
    const bad = await page('http://127.0.0.1/api/x?actions=DROP%20TABLE');
    expect(bad.status).toBe(400);
    expect(JSON.stringify(await bad.json())).toContain('actions');
  });
});

describe('separation of duties at issue', () => {
  it('the last person to change the design may not issue it, unless the organisation allows self-issue', async () => {
    // The admin saves the design, so the admin may not issue it; the inspector may
    const { boardId } = await draftBoard(team.users.admin);
    signInAs(team.users.admin);
    expect((await submitRoute.POST(jsonRequest('POST', {}), byBoard(boardId))).status).toBe(200);
    const self = await approveRoute.POST(
      jsonRequest('POST', { acknowledgeFailures: true, declaration: team.users.admin.name }),
      byBoard(boardId),
    );
    expect(self.status).toBe(403);
    expect((await self.json()).error).toMatch(/someone else must issue it/);
    expect((await Board.findByPk(boardId))!.status).toBe('in-review');
    // Self-issue is off by default; an admin turns it on, and then it is allowed
    expect((await (await organisationRoute.GET(jsonRequest('GET'), ctx({}))).json()).organisation.allowSelfIssue).toBe(
      false,
    );
    const turned = await organisationRoute.PATCH(jsonRequest('PATCH', { allowSelfIssue: true }), ctx({}));
    expect((await turned.json()).organisation.allowSelfIssue).toBe(true);
    try {
      const allowed = await approveRoute.POST(
        jsonRequest('POST', { acknowledgeFailures: true, declaration: team.users.admin.name }),
        byBoard(boardId),
      );
      expect(allowed.status).toBe(200);
    } finally {
      await organisationRoute.PATCH(jsonRequest('PATCH', { allowSelfIssue: false }), ctx({}));
    }
    signInAs(team.users.designer);
    expect((await organisationRoute.PATCH(jsonRequest('PATCH', { allowSelfIssue: true }), ctx({}))).status).toBe(403);
  });

  it('issuing records the typed declaration, and refuses another name or a revision that moved', async () => {
    const { boardId } = await draftBoard();
    signInAs(team.users.designer);
    await submitRoute.POST(jsonRequest('POST', {}), byBoard(boardId));
    signInAs(team.users.inspector);
    const missing = await approveRoute.POST(jsonRequest('POST', { acknowledgeFailures: true }), byBoard(boardId));
    expect(missing.status).toBe(400);
    expect((await missing.json()).issues[0].path).toBe('declaration');
    const wrong = await approveRoute.POST(
      jsonRequest('POST', { acknowledgeFailures: true, declaration: team.users.designer.name }),
      byBoard(boardId),
    );
    expect(wrong.status).toBe(400);
    expect((await wrong.json()).issues[0]).toMatchObject({
      path: 'declaration',
      message: expect.stringContaining(team.users.inspector.name),
    });
    const moved = await approveRoute.POST(
      jsonRequest('POST', { acknowledgeFailures: true, declaration: team.users.inspector.name, revision: 7 }),
      byBoard(boardId),
    );
    expect(moved.status).toBe(409);
    expect(await BoardRevision.count({ where: { boardId } })).toBe(0);
    // Typed in another case and spacing: the same name
    const typed = `  ${team.users.inspector.name.toUpperCase()} `;
    const ok = await approveRoute.POST(
      jsonRequest('POST', { acknowledgeFailures: true, declaration: typed, revision: 1 }),
      byBoard(boardId),
    );
    expect(ok.status).toBe(200);
    const row = await BoardRevision.findOne({ where: { boardId } });
    expect(row!.declaration).toBe(typed.trim());
    const approved = (await actionsOf(boardId)).find((e) => e.action === 'review.approved')!;
    expect(approved.userName).toBe(team.users.inspector.name);
    expect(approved.details).toMatchObject({
      revision: 1,
      declaration: typed.trim(),
      devices: expect.any(Number),
      circuits: expect.any(Number),
      verdicts: { passes: expect.any(Number), nearLimit: expect.any(Number), fails: expect.any(Number) },
    });
  });

  it('submitting a board that is already issued says so, whatever version the caller held', async () => {
    const { boardId } = await draftBoard();
    const { revision } = await issue(boardId);
    signInAs(team.users.designer);
    const res = await submitRoute.POST(jsonRequest('POST', { version: 1 }), byBoard(boardId));
    expect(res.status).toBe(409);
    const { error } = await res.json();
    expect(error).toMatch(new RegExp(`already issued \\(revision ${revision}\\)`));
    expect(error).not.toMatch(/Someone else/);
  });
});

describe('the designer reads a returned review', () => {
  it('shows the reason and the way comments until they are marked answered; the e-mail links to that view', async () => {
    const { boardId } = await draftBoard();
    signInAs(team.users.designer);
    await submitRoute.POST(jsonRequest('POST', {}), byBoard(boardId));
    const board = await load(boardId);
    const wayId = board.ways.find((w) => w.circuit)!.id;
    signInAs(team.users.inspector);
    await commentsRoute.POST(
      jsonRequest('POST', { wayId, body: 'Show the cable route to the garage.' }),
      byBoard(boardId),
    );
    const returned = await returnRoute.POST(
      jsonRequest('POST', { comment: 'Two ways need their routes.' }),
      byBoard(boardId),
    );
    expect(returned.status).toBe(200);

    const designer = actorOf(team.users.designer);
    const notes = await getReturnNotes(designer, boardId);
    expect(notes).toMatchObject({
      returnedByName: team.users.inspector.name,
      reasons: [{ body: 'Two ways need their routes.', wayId: null }],
      wayComments: [{ body: 'Show the cable route to the garage.', wayId }],
    });
    // The e-mail opens the editor at the review notes
    let mail;
    for (let i = 0; i < 50 && !mail; i++) {
      await dispatchDueMail();
      mail = (await caughtMail()).find(
        (m) =>
          m.to.includes(team.users.designer.email) &&
          /Returned for changes/.test(m.subject) &&
          m.text.includes(boardId),
      );
      if (!mail) await new Promise((r) => setTimeout(r, 100));
    }
    expect(mail?.text).toContain(`/boards/${boardId}#review-notes`);
    // Marking them answered: an inspector may not, the designer may
    const ids = [...notes!.reasons, ...notes!.wayComments].map((c) => c.id);
    expect((await answeredRoute.POST(jsonRequest('POST', { commentIds: ids }), byBoard(boardId))).status).toBe(403);
    signInAs(team.users.designer);
    const stray = await answeredRoute.POST(
      jsonRequest('POST', { commentIds: [crypto.randomUUID()] }),
      byBoard(boardId),
    );
    expect(stray.status).toBe(400);
    const answered = await answeredRoute.POST(jsonRequest('POST', { commentIds: ids }), byBoard(boardId));
    expect(await answered.json()).toEqual({ answered: 2 });
    expect(await getReturnNotes(designer, boardId)).toBeNull();
    expect(await Comment.count({ where: { boardId, answeredAt: null } })).toBe(0);
    expect((await actionsOf(boardId))[0]).toMatchObject({
      action: 'comments.answered',
      userName: team.users.designer.name,
    });
  });
});

/** The tag ids of a TIFF/EXIF block's first directory (IFD0). */
function ifd0Tags(exif: Buffer): number[] {
  const start = exif.indexOf('II*\0') >= 0 ? exif.indexOf('II*\0') : exif.indexOf('MM\0*');
  const le = exif[start] === 0x49;
  const u16 = (at: number) => (le ? exif.readUInt16LE(start + at) : exif.readUInt16BE(start + at));
  const u32 = (at: number) => (le ? exif.readUInt32LE(start + at) : exif.readUInt32BE(start + at));
  const dir = u32(4);
  return Array.from({ length: u16(dir) }, (_, i) => u16(dir + 2 + i * 12));
}

const GPS_IFD_TAG = 0x8825; // TIFF/EXIF 2.3: the pointer to the GPS directory

describe('photos', () => {
  it('are stored without EXIF (GPS position, device serial), originals and thumbnails alike', async () => {
    const { boardId } = await draftBoard();
    await issue(boardId);
    const camera = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#6b7f3a' } })
      .jpeg()
      .withExif({
        IFD0: { Make: 'Hollin Lane Camera', Model: 'HL-7' },
        IFD2: { BodySerialNumber: 'SERIAL-HOLLIN-0042' },
        IFD3: {
          GPSLatitudeRef: 'N',
          GPSLatitude: '53/1 47/1 12/1',
          GPSLongitudeRef: 'W',
          GPSLongitude: '1/1 33/1 4/1',
        },
      })
      .toBuffer();
    // The photo as taken does carry a GPS position and the serial
    const taken = await sharp(camera).metadata();
    expect(ifd0Tags(taken.exif!)).toContain(GPS_IFD_TAG);
    expect(camera.includes('SERIAL-HOLLIN-0042')).toBe(true);

    signInAs(team.users.installer);
    const form = new FormData();
    form.append('file', new File([new Uint8Array(camera)], 'board.jpg', { type: 'image/jpeg' }));
    const res = await attachmentsRoute.POST(
      new Request(`http://127.0.0.1/api/boards/${boardId}/attachments`, { method: 'POST', body: form }),
      byBoard(boardId),
    );
    expect(res.status).toBe(201);
    const { attachment } = await res.json();
    const row = (await Attachment.findByPk(attachment.id))!;
    // What object storage holds, read directly, and what the routes serve
    const stored = {
      original: Buffer.from((await getObjectBytes(row.storageKey))!),
      thumb: Buffer.from((await getObjectBytes(row.thumbKey!))!),
      served: Buffer.from(
        await (await photoRoute.GET(jsonRequest('GET'), ctx({ attachmentId: row.id }))).arrayBuffer(),
      ),
      servedThumb: Buffer.from(
        await (await thumbRoute.GET(jsonRequest('GET'), ctx({ attachmentId: row.id }))).arrayBuffer(),
      ),
    };
    for (const [name, bytes] of Object.entries(stored)) {
      const meta = await sharp(bytes).metadata();
      expect(meta.format, name).toBe('jpeg');
      expect(meta.exif, name).toBeUndefined();
      expect(bytes.includes('SERIAL-HOLLIN-0042'), name).toBe(false);
      expect(bytes.includes('Hollin Lane Camera'), name).toBe(false);
    }
    expect(await sharp(stored.original).metadata()).toMatchObject({ width: 640, height: 480 });
    expect(row.sizeBytes).toBe(stored.original.byteLength);

    // Removing the photo of an issued board withdraws it: no longer listed, kept in storage
    const removed = await photoRoute.DELETE(jsonRequest('DELETE'), ctx({ attachmentId: row.id }));
    expect(await removed.json()).toEqual({ effect: 'withdrawn' });
    const { attachments } = await (await get(attachmentsRoute, boardId)).json();
    expect(attachments.map((a: { id: string }) => a.id)).not.toContain(row.id);
    expect(await Attachment.count({ where: { id: row.id } })).toBe(1);
    expect(await getObjectBytes(row.storageKey)).not.toBeNull();
    expect(await getObjectBytes(row.thumbKey!)).not.toBeNull();
  });
});

describe('archive and save of one board at once', () => {
  it('leave one consistent state, round after round', async () => {
    const outcomes = { saveFirst: 0, archiveFirst: 0 };
    for (let round = 0; round < 6; round++) {
      const { boardId } = await draftBoard();
      signInAs(team.users.designer);
      const board = await load(boardId);
      const newName = `Saved in round ${round}`;
      const { archiveBoard } = await import('@/lib/dal/boards');
      const [saved, archived] = await Promise.allSettled([
        save(board, (b) => (b.settings.name = newName)),
        archiveBoard(actorOf(team.users.admin), boardId),
      ]);
      expect(archived.status).toBe('fulfilled');
      const row = (await Board.findByPk(boardId))!;
      expect(row.archivedAt).not.toBeNull();
      const res = (saved as PromiseFulfilledResult<Response>).value;
      outcomes[res.status === 200 ? 'saveFirst' : 'archiveFirst'] += 1;
      if (res.status === 200) {
        // The save came first: the archived board is the saved one, one version on
        expect(row.name).toBe(newName);
        expect(row.version).toBe(board.version + 2);
      } else {
        // The archive came first: the save wrote nothing and says why
        expect(res.status).toBe(409);
        expect((await res.json()).error).toMatch(/archived/);
        expect(row.name).toBe(board.name);
        expect(row.version).toBe(board.version + 1);
      }
      const saves = await AuditEvent.count({ where: { boardId, action: 'board.saved' } });
      expect(saves).toBe(res.status === 200 ? 2 : 1);
    }
    console.log(`archive and save at once: ${JSON.stringify(outcomes)}`);
  });
});
