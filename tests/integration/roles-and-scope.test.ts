/**
 * Roles and the organisation boundary through the route handlers: every declared route (read
 * from app/api by ./api-routes.ts) refuses signed-out and deactivated callers; then the roles
 * of the permissions table and another organisation's objects on the main routes, by hand.
 */
import crypto from 'node:crypto';

import { beforeAll, describe, expect, it } from 'vitest';

import * as boardRoute from '@/app/api/boards/[boardId]/route';
import * as boardsRoute from '@/app/api/boards/route';
import * as memberRoute from '@/app/api/members/[userId]/route';
import * as membersRoute from '@/app/api/members/route';
import * as siteRoute from '@/app/api/sites/[siteId]/route';
import * as sitesRoute from '@/app/api/sites/route';

import { declaredRoutes } from './api-routes';
import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let ours: Org;
let theirs: Org;
let ourBoard: { site: { id: string }; board: { id: string } };
let theirBoard: { site: { id: string }; board: { id: string } };

beforeAll(async () => {
  ours = await makeOrganisation('Ours');
  theirs = await makeOrganisation('Theirs');
  ourBoard = await makeBoard(ours.org.id);
  theirBoard = await makeBoard(theirs.org.id);
});

/** The routes that need a session, each with ids that pass its params schema but name nothing. */
const guarded = (await declaredRoutes())
  .filter((r) => r.declaration.action !== 'public')
  .map((r) => {
    const keys = [...r.path.matchAll(/\[(\w+)\]/g)].map((m) => m[1]);
    const params = Object.fromEntries(keys.map((k) => [k, k === 'revision' ? '1' : crypto.randomUUID()]));
    return { ...r, params };
  });

/** Calls every guarded route as whoever is signed in, with no body; their status codes by route. */
async function callEveryRoute(): Promise<Record<string, number>> {
  const answers: Record<string, number> = {};
  for (const r of guarded) {
    const res = await r.handler(jsonRequest(r.method, undefined, `http://127.0.0.1${r.path}`), ctx(r.params));
    answers[r.name] = res.status;
  }
  return answers;
}

describe('signed out', () => {
  it('every API route but the public ones answers 401, before looking up its ids or reading its body', async () => {
    expect(guarded.length).toBeGreaterThanOrEqual(40);
    for (const r of guarded) {
      if (r.declaration.params) expect(r.declaration.params.safeParse(r.params).success, r.name).toBe(true);
    }
    signInAs(null);
    const answers = await callEveryRoute();
    expect(answers).toEqual(Object.fromEntries(guarded.map((r) => [r.name, 401])));
  });

  it('a deactivated member is treated as signed out by every API route', async () => {
    const { users } = await makeOrganisation('Gone');
    await users.admin.update({ active: false });
    signInAs(users.admin);
    const answers = await callEveryRoute();
    expect(answers).toEqual(Object.fromEntries(guarded.map((r) => [r.name, 401])));
  });
});

describe('roles (the permissions table, lib/auth/permissions.ts)', () => {
  it('inspectors and installers may not create sites or boards', async () => {
    for (const role of ['inspector', 'installer'] as const) {
      signInAs(ours.users[role]);
      const site = await sitesRoute.POST(jsonRequest('POST', { name: 'New' }), ctx({}));
      expect(site.status).toBe(403);
      const del = await boardRoute.DELETE(jsonRequest('DELETE'), ctx({ boardId: ourBoard.board.id }));
      expect(del.status).toBe(403);
    }
  });

  it('only admins manage members', async () => {
    for (const role of ['designer', 'inspector', 'installer'] as const) {
      signInAs(ours.users[role]);
      expect((await membersRoute.GET(jsonRequest('GET'), ctx({}))).status).toBe(403);
      const invite = await membersRoute.POST(
        jsonRequest('POST', { email: 'x@example.test', name: 'X', role: 'designer' }),
        ctx({}),
      );
      expect(invite.status).toBe(403);
    }
    signInAs(ours.users.admin);
    const list = await membersRoute.GET(jsonRequest('GET'), ctx({}));
    expect(list.status).toBe(200);
    const { members } = await list.json();
    expect(members).toHaveLength(4);
  });

  it('every role may read the organisation’s boards', async () => {
    for (const role of ['admin', 'designer', 'inspector', 'installer'] as const) {
      signInAs(ours.users[role]);
      const res = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId: ourBoard.board.id }));
      expect(res.status).toBe(200);
    }
  });

  it('designers create, rename and archive sites', async () => {
    signInAs(ours.users.designer);
    const created = await sitesRoute.POST(jsonRequest('POST', { name: 'Barn conversion' }), ctx({}));
    expect(created.status).toBe(201);
    const { site } = await created.json();
    const renamed = await siteRoute.PATCH(
      jsonRequest('PATCH', { name: 'Barn conversion, phase 2' }),
      ctx({ siteId: site.id }),
    );
    expect((await renamed.json()).site.name).toBe('Barn conversion, phase 2');
    const removed = await siteRoute.DELETE(jsonRequest('DELETE'), ctx({ siteId: site.id }));
    expect(removed.status).toBe(200);
    expect((await removed.json()).site.archived).toMatchObject({ byName: ours.users.designer.name });
  });
});

describe('organisation scope', () => {
  it('another organisation’s board is 404 for every verb, and is left unchanged', async () => {
    signInAs(ours.users.admin);
    const boardId = theirBoard.board.id;
    const get = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }));
    expect(get.status).toBe(404);
    expect(JSON.stringify(await get.json())).not.toContain(theirs.org.name);
    const patch = await boardRoute.PATCH(jsonRequest('PATCH', { name: 'Mine now' }), ctx({ boardId }));
    expect(patch.status).toBe(404);
    const del = await boardRoute.DELETE(jsonRequest('DELETE'), ctx({ boardId }));
    expect(del.status).toBe(404);
    signInAs(theirs.users.admin);
    const still = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId }));
    expect((await still.json()).board.name).not.toBe('Mine now');
  });

  it('lists hold only the caller’s organisation', async () => {
    signInAs(ours.users.designer);
    const { boards } = await (await boardsRoute.GET(jsonRequest('GET'), ctx({}))).json();
    expect(boards.map((b: { id: string }) => b.id)).toContain(ourBoard.board.id);
    expect(boards.map((b: { id: string }) => b.id)).not.toContain(theirBoard.board.id);
    const other = await siteRoute.GET(jsonRequest('GET'), ctx({ siteId: theirBoard.site.id }));
    expect(other.status).toBe(404);
  });

  it('an admin cannot change a member of another organisation', async () => {
    signInAs(ours.users.admin);
    const res = await memberRoute.PATCH(
      jsonRequest('PATCH', { role: 'admin' }),
      ctx({ userId: theirs.users.installer.id }),
    );
    expect(res.status).toBe(404);
  });

  it('a junk id is a 404, not a crash', async () => {
    signInAs(ours.users.admin);
    const res = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId: 'not-a-uuid' }));
    expect(res.status).toBe(404);
    const random = await boardRoute.GET(jsonRequest('GET'), ctx({ boardId: crypto.randomUUID() }));
    expect(random.status).toBe(404);
  });
});

describe('bad input', () => {
  it('a junk site body gets 400 with one entry per bad field', async () => {
    signInAs(ours.users.designer);
    const res = await sitesRoute.POST(jsonRequest('POST', { name: '', client: 42, extra: 1 }), ctx({}));
    expect(res.status).toBe(400);
    const body = await res.json();
    const paths = body.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['name', 'client']));
  });

  it('malformed JSON gets 400 naming the body', async () => {
    signInAs(ours.users.designer);
    const res = await sitesRoute.POST(jsonRequest('POST', '{"name":'), ctx({}));
    expect(res.status).toBe(400);
    expect((await res.json()).issues[0].path).toBe('(body)');
  });
});
