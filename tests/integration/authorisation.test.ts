/**
 * Authorisation of every API route, generated from app/api/route-table.ts: signed out (401),
 * as each role (allowed, or 403 and nothing changed) and against another organisation's
 * objects (404 and none of their data). A route file or method missing from the table fails.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';

import {
  HTTP_METHODS,
  ROUTES,
  rolesAllowed,
  routeName,
  type RouteCall,
  type RouteFixture,
  type RouteSpec,
} from '@/app/api/route-table';
import type { Actor } from '@/lib/auth/session';
import { addAttachment } from '@/lib/dal/attachments';
import { submitBoard } from '@/lib/dal/board-status';
import { archiveBoard, getBoard, removeBoard } from '@/lib/dal/boards';
import { archiveSite } from '@/lib/dal/sites';
import { addComment } from '@/lib/dal/comments';
import { approveBoard } from '@/lib/dal/issue-and-return';
import { db } from '@/lib/db';
import { dispatchDueMail, enqueueMail } from '@/lib/mail/outbox';
import { ROLES, type Role } from '@/lib/domain';
import { Board, Invitation, OutgoingMail, Site, User } from '@/models';

import { ctx, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
type Handler = (req: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

const ROOT = path.resolve(import.meta.dirname, '../..');
const API_DIR = path.join(ROOT, 'app/api');

/** Every `route.ts` under app/api with the HTTP methods it exports. */
async function scanRouteFiles(): Promise<{ path: string; method: string; handler: Handler }[]> {
  const files = (fs.readdirSync(API_DIR, { recursive: true }) as string[])
    .filter((f) => path.basename(f) === 'route.ts' || path.basename(f) === 'route.tsx')
    .sort();
  const found = [];
  for (const file of files) {
    const mod = (await import(/* @vite-ignore */ path.join(API_DIR, file))) as Record<string, unknown>;
    const routePath = `/api/${path.dirname(file).split(path.sep).join('/')}`.replace(/\/\.$/, '');
    for (const method of Object.keys(mod).filter((k) => (HTTP_METHODS as string[]).includes(k))) {
      found.push({ path: routePath, method, handler: mod[method] as Handler });
    }
  }
  return found;
}

const handlers = new Map<string, Handler>();
let ours: Org;
let theirs: Org;
let photoPng: Uint8Array;

const actorOf = (org: Org, role: Role): Actor => {
  const u = org.users[role];
  return { userId: u.id, organisationId: org.org.id, role, name: u.name, email: u.email };
};

/** The members' names by role, for calls where the caller types their own name. */
const namesOf = (o: Org) => Object.fromEntries(ROLES.map((r) => [r, o.users[r].name])) as Record<Role, string>;

/**
 * A fresh site and board (the demo flat) at the stage the route needs, a spare member, an
 * open invitation and, when asked, a photo, in an organisation.
 */
async function makeFixture(org: Org, label: string, spec?: RouteSpec): Promise<RouteFixture> {
  const tag = `${label}-${crypto.randomUUID().slice(0, 8)}`;
  const { site, board } = await makeBoard(org.org.id, 'flat');
  await site.update({ name: `${tag} site` });
  await board.update({ name: `${tag} board` });
  const member = await User.create({
    organisationId: org.org.id,
    email: `spare-${tag}@example.test`.toLowerCase(),
    name: `${tag} spare member`,
    role: 'installer',
  });
  const token = crypto.randomBytes(32).toString('base64url');
  await Invitation.create({
    organisationId: org.org.id,
    email: `invitee-${tag}@example.test`.toLowerCase(),
    name: `${tag} invitee`,
    role: 'designer',
    tokenHash: crypto.createHash('sha256').update(token).digest('hex'),
    expiresAt: new Date(Date.now() + 86_400_000),
    invitedById: org.users.admin.id,
  });
  // The board's stage, through the same steps as the app: submit, then approve
  const stage = spec?.stage ?? 'draft';
  const at = stage;
  if (at === 'in-review' || at === 'issued') await submitBoard(actorOf(org, 'designer'), board.id);
  if (at === 'issued') {
    const inspector = actorOf(org, 'inspector');
    await approveBoard(inspector, board.id, { acknowledgeFailures: true, declaration: inspector.name });
  }
  // The board as GET /api/boards/:id shows it, before an archive or delete hides or changes it
  const dto = await getBoard(actorOf(org, 'admin'), board.id);
  if (at === 'archived') await archiveBoard(actorOf(org, 'admin'), board.id);
  if (at === 'deleted') await removeBoard(actorOf(org, 'designer'), board.id);
  if (at === 'site-archived') await archiveSite(actorOf(org, 'admin'), site.id);
  const comment = spec?.needs?.includes('comment')
    ? await addComment(actorOf(org, 'inspector'), board.id, { wayId: null, body: 'Label the spare ways.' })
    : null;
  const attachment = spec?.needs?.includes('attachment')
    ? await addAttachment(actorOf(org, 'installer'), board.id, { bytes: photoPng, fileName: `${tag}.png` })
    : null;
  return {
    organisationId: org.org.id,
    siteId: site.id,
    board: dto,
    memberId: member.id,
    invitationToken: token,
    attachmentId: attachment?.id ?? '',
    photoPng,
    names: namesOf(org),
    commentId: comment?.id ?? '',
  };
}

/** Every row of an organisation a route could change, in a stable order. */
async function snapshot(organisationId: string): Promise<unknown> {
  const q = (sql: string) => db().query(sql, { type: QueryTypes.SELECT, replacements: { org: organisationId } });
  // Rows of the organisation's boards, in a child table
  const onBoards = (table: string, columns = 't.*') =>
    q(`select ${columns} from ${table} t join boards b on b.id = t.board_id
       where b.organisation_id = :org order by t.id`);
  return {
    sites: await q('select * from sites where organisation_id = :org order by id'),
    boards: await q('select * from boards where organisation_id = :org order by id'),
    ways: await onBoards('ways'),
    users: await q('select id, role, active, password_hash from users where organisation_id = :org order by id'),
    invitations: await q('select id, accepted_at from invitations where organisation_id = :org order by id'),
    comments: await onBoards('comments'),
    revisions: await onBoards('board_revisions', 't.id, t.board_id, t.revision'),
    attachments: await q('select * from attachments where organisation_id = :org order by id'),
  };
}

/** Strings that would show another organisation's data in an answer. */
async function secretsOf(org: Org, fx: RouteFixture): Promise<string[]> {
  const sites = await Site.findAll({ where: { organisationId: org.org.id } });
  const boards = await Board.findAll({ where: { organisationId: org.org.id } });
  return [
    org.org.id,
    org.org.name,
    ...Object.values(org.users).map((u) => u.email),
    ...sites.map((s) => s.name),
    ...boards.map((b) => b.name),
    ...fx.board.ways.map((w) => w.id),
  ];
}

/** Calls a route handler in-process the way Next would. */
async function invoke(spec: RouteSpec, call: RouteCall): Promise<Response> {
  const handler = handlers.get(routeName(spec));
  if (!handler) throw new Error(`no handler for ${routeName(spec)}`);
  const url = new URL(`http://127.0.0.1${spec.path}`);
  for (const [k, v] of Object.entries(call.query ?? {})) url.searchParams.set(k, v);
  let req: Request;
  if (call.form) {
    const form = new FormData();
    for (const [k, v] of Object.entries(call.form)) {
      if (typeof v === 'string') form.set(k, v);
      else form.set(k, new File([v.bytes as BlobPart], v.name, { type: v.type }));
    }
    req = new Request(url, { method: spec.method, body: form });
  } else {
    req = new Request(url, {
      method: spec.method,
      headers: { 'content-type': 'application/json' },
      body: call.body === undefined ? undefined : JSON.stringify(call.body),
    });
  }
  return handler(req, ctx(call.params));
}

const callable = ROUTES.filter((r) => r.call);

beforeAll(async () => {
  for (const r of await scanRouteFiles()) handlers.set(`${r.method} ${r.path}`, r.handler);
  ours = await makeOrganisation('Ours');
  theirs = await makeOrganisation('Theirs');
  photoPng = new Uint8Array(
    await sharp({ create: { width: 24, height: 16, channels: 3, background: '#7a8b99' } }).png().toBuffer(),
  );
});

describe('the route table', () => {
  it('lists every route file and exported method under app/api, and nothing else', async () => {
    const files = (await scanRouteFiles()).map((r) => `${r.method} ${r.path}`).sort();
    const listed = ROUTES.map(routeName).sort();
    const missing = files.filter((f) => !listed.includes(f));
    const stale = listed.filter((l) => !files.includes(l));
    expect(missing, `route files/methods not in app/api/route-table.ts`).toEqual([]);
    expect(stale, `route-table entries with no route file/method`).toEqual([]);
    expect(new Set(listed).size).toBe(listed.length);
    expect(files.length).toBeGreaterThanOrEqual(20);
  });

  it('gives every public route a reason and every uncalled route an explanation', () => {
    for (const r of ROUTES) {
      if (r.access.kind === 'public') expect(r.access.reason.length, routeName(r)).toBeGreaterThan(20);
      if (!r.call) expect(r.notCalled, routeName(r)).toBeTruthy();
    }
    // Only next-auth's own endpoints and the invitation acceptance are public
    expect(ROUTES.filter((r) => r.access.kind === 'public').map(routeName).sort()).toEqual([
      'GET /api/auth/[...nextauth]',
      'POST /api/auth/[...nextauth]',
      'POST /api/invitations/accept',
    ]);
  });
});

describe.each(callable.map((r) => [routeName(r), r] as const))('%s', (_name, spec) => {
  const call = spec.call!;
  let shared: RouteFixture | undefined;
  const fixture = async () =>
    spec.mutates || !shared ? (shared = await makeFixture(ours, 'ours', spec)) : shared;

  const signedOutTitle =
    spec.access.kind === 'public' ? 'answers signed-out callers' : 'is 401 signed out, and changes nothing';
  it(signedOutTitle, async () => {
    const fx = await fixture();
    signInAs(null);
    const before = await snapshot(ours.org.id);
    const res = await invoke(spec, call(fx, 'admin'));
    if (spec.access.kind === 'public') {
      expect(res.status).toBeGreaterThanOrEqual(200);
      expect(res.status).toBeLessThan(300);
      return;
    }
    expect(res.status).toBe(401);
    expect((await res.json()).error).toMatch(/sign in/i);
    expect(await snapshot(ours.org.id)).toEqual(before);
  });

  it.each(ROLES.map((role) => [role] as const))('as %s: allowed or 403', async (role: Role) => {
    const fx = await fixture();
    signInAs(ours.users[role]);
    const before = await snapshot(ours.org.id);
    const res = await invoke(spec, call(fx, role));
    if (rolesAllowed(spec).includes(role)) {
      expect(res.status, await res.clone().text()).toBeGreaterThanOrEqual(200);
      expect(res.status).toBeLessThan(300);
    } else {
      expect(res.status).toBe(403);
      expect((await res.json()).error).toMatch(/Your role may not/);
      expect(await snapshot(ours.org.id)).toEqual(before);
    }
  });

  if (spec.scope === 'path' || spec.scope === 'body') {
    it('against another organisation’s objects: 404, none of their data, nothing changed', async () => {
      const them = await makeFixture(theirs, 'theirs', spec);
      const role = rolesAllowed(spec).includes('admin') ? 'admin' : rolesAllowed(spec)[0];
      signInAs(ours.users[role]);
      const before = await snapshot(theirs.org.id);
      const res = await invoke(spec, call(them, role));
      expect(res.status).toBe(404);
      const text = await res.text();
      for (const secret of await secretsOf(theirs, them)) expect(text).not.toContain(secret);
      expect(await snapshot(theirs.org.id)).toEqual(before);
    });
  } else if (spec.scope === 'list') {
    it('lists or returns only the caller’s organisation', async () => {
      const them = await makeFixture(theirs, 'theirs', spec);
      // Their organisation has mail too: queued, and delivered to the local mail catcher
      const mailId = await enqueueMail({
        organisationId: theirs.org.id,
        to: theirs.users.designer.email,
        subject: `For ${theirs.org.name} only`,
        text: 'Private to the other organisation.',
      });
      for (let i = 0; i < 50 && (await OutgoingMail.findByPk(mailId))?.status === 'queued'; i++) {
        await dispatchDueMail();
      }
      const fx = await fixture();
      const role = rolesAllowed(spec).includes('admin') ? 'admin' : rolesAllowed(spec)[0];
      signInAs(ours.users[role]);
      const res = await invoke(spec, call(fx, role));
      expect(res.status).toBeLessThan(300);
      const text = await res.text();
      for (const secret of await secretsOf(theirs, them)) expect(text).not.toContain(secret);
    });
  }
});
