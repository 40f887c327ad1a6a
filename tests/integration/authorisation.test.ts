/**
 * Authorisation of every API route, generated from what each route declares (`defineRoute` in
 * lib/api/handler.ts: its action and scope) with the sample calls of ./api-routes.ts: signed
 * out (401), as each role (allowed, or 403 and nothing changed) and against another
 * organisation's objects (404 and none of their data). A route method that declares nothing,
 * or has no sample call, fails.
 */
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';

import { db } from '@/lib/db';
import { ROLES, type Role } from '@/lib/domain';
import { dispatchDueMail, enqueueMail } from '@/lib/mail/outbox';
import { Board, OutgoingMail, Site } from '@/models';

import {
  apiRoutes,
  bodyKind,
  callableRoutes,
  makeFixture,
  rolesAllowed,
  ROUTE_CALLS,
  type CallableRoute,
  type RouteCall,
  type RouteFixture,
} from './api-routes';
import { ctx, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;

let ours: Org;
let theirs: Org;
let photoPng: Uint8Array;

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
async function invoke(route: CallableRoute, call: RouteCall): Promise<Response> {
  const url = new URL(`http://127.0.0.1${route.path}`);
  for (const [k, v] of Object.entries(call.query ?? {})) url.searchParams.set(k, v);
  let req: Request;
  if (call.form) {
    const form = new FormData();
    for (const [k, v] of Object.entries(call.form)) {
      if (typeof v === 'string') form.set(k, v);
      else form.set(k, new File([v.bytes as BlobPart], v.name, { type: v.type }));
    }
    req = new Request(url, { method: route.method, body: form });
  } else {
    req = new Request(url, {
      method: route.method,
      headers: { 'content-type': 'application/json' },
      body: call.body === undefined ? undefined : JSON.stringify(call.body),
    });
  }
  return route.handler(req, ctx(call.params));
}

const routes = await apiRoutes();
const callable = await callableRoutes();

beforeAll(async () => {
  ours = await makeOrganisation('Ours');
  theirs = await makeOrganisation('Theirs');
  photoPng = new Uint8Array(
    await sharp({ create: { width: 24, height: 16, channels: 3, background: '#7a8b99' } })
      .png()
      .toBuffer(),
  );
});

describe('the routes’ declarations', () => {
  it('every route file and exported method under app/api declares itself', () => {
    const undeclared = routes.filter((r) => !r.declaration).map((r) => r.name);
    expect(undeclared, 'route methods not made with defineRoute (lib/api/handler.ts)').toEqual([]);
    expect(routes.length).toBeGreaterThanOrEqual(20);
  });

  it('every route has a sample call in tests/integration/api-routes.ts, and no sample is stale', () => {
    const names = routes.map((r) => r.name);
    const missing = names.filter((n) => !ROUTE_CALLS[n]);
    const stale = Object.keys(ROUTE_CALLS).filter((n) => !names.includes(n));
    expect(missing, 'routes without a sample call').toEqual([]);
    expect(stale, 'sample calls with no route file/method').toEqual([]);
  });

  it('gives every public route a reason and every uncalled route an explanation', () => {
    for (const r of routes) {
      if (r.declaration?.action === 'public') {
        expect(r.declaration.publicBecause?.length ?? 0, r.name).toBeGreaterThan(20);
      }
      if (!ROUTE_CALLS[r.name]?.call) expect(ROUTE_CALLS[r.name]?.notCalled, r.name).toBeTruthy();
    }
    // Only next-auth's own endpoints and the invitation acceptance are public
    expect(
      routes
        .filter((r) => r.declaration?.action === 'public')
        .map((r) => r.name)
        .sort(),
    ).toEqual(['GET /api/auth/[...nextauth]', 'POST /api/auth/[...nextauth]', 'POST /api/invitations/accept']);
  });

  it('params are declared exactly where the path names them, and every sample call fits the declaration', async () => {
    const every = { mutates: false, needs: ['attachment', 'comment'] as const, call: null };
    const fx = await makeFixture(ours, 'shape', photoPng, every);
    for (const r of callable) {
      const call = r.sample.call(fx, 'admin');
      // Params named in the path are declared, and scope the route to the organisation
      const hasParams = /\[\w+\]/.test(r.path);
      expect(r.declaration.params !== undefined, `${r.name}: params`).toBe(hasParams);
      expect(r.declaration.scope === 'path', `${r.name}: scope`).toBe(hasParams);
      // A body is sent exactly when one is declared, in the declared form
      const kind = bodyKind(r.declaration);
      expect(call.form !== undefined, `${r.name}: form`).toBe(kind === 'multipart');
      if (kind === 'none') expect(call.body, `${r.name}: body`).toBeUndefined();
      if (kind === 'required') expect(call.body, `${r.name}: body`).toBeDefined();
      const schema = r.declaration.body;
      if (schema && schema !== 'multipart') {
        const parsed = schema.safeParse(call.body);
        expect(parsed.success, `${r.name}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
      }
    }
  });
});

describe.each(callable.map((r) => [r.name, r] as const))('%s', (_name, route) => {
  const { declaration, sample } = route;
  const call = sample.call;
  let shared: RouteFixture | undefined;
  const fixture = async () =>
    sample.mutates || !shared ? (shared = await makeFixture(ours, 'ours', photoPng, sample)) : shared;

  const signedOutTitle =
    declaration.action === 'public' ? 'answers signed-out callers' : 'is 401 signed out, and changes nothing';
  it(signedOutTitle, async () => {
    const fx = await fixture();
    signInAs(null);
    const before = await snapshot(ours.org.id);
    const res = await invoke(route, call(fx, 'admin'));
    if (declaration.action === 'public') {
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
    const res = await invoke(route, call(fx, role));
    if (rolesAllowed(declaration).includes(role)) {
      expect(res.status, await res.clone().text()).toBeGreaterThanOrEqual(200);
      expect(res.status).toBeLessThan(300);
    } else {
      expect(res.status).toBe(403);
      expect((await res.json()).error).toMatch(/Your role may not/);
      expect(await snapshot(ours.org.id)).toEqual(before);
    }
  });

  if (declaration.scope === 'path' || declaration.scope === 'body') {
    it('against another organisation’s objects: 404, none of their data, nothing changed', async () => {
      const them = await makeFixture(theirs, 'theirs', photoPng, sample);
      const role = rolesAllowed(declaration).includes('admin') ? 'admin' : rolesAllowed(declaration)[0];
      signInAs(ours.users[role]);
      const before = await snapshot(theirs.org.id);
      const res = await invoke(route, call(them, role));
      expect(res.status).toBe(404);
      const text = await res.text();
      for (const secret of await secretsOf(theirs, them)) expect(text).not.toContain(secret);
      expect(await snapshot(theirs.org.id)).toEqual(before);
    });
  } else if (declaration.scope === 'list') {
    it('lists or returns only the caller’s organisation', async () => {
      const them = await makeFixture(theirs, 'theirs', photoPng, sample);
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
      const role = rolesAllowed(declaration).includes('admin') ? 'admin' : rolesAllowed(declaration)[0];
      signInAs(ours.users[role]);
      const res = await invoke(route, call(fx, role));
      expect(res.status).toBeLessThan(300);
      const text = await res.text();
      for (const secret of await secretsOf(theirs, them)) expect(text).not.toContain(secret);
    });
  }
});
