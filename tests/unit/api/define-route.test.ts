/**
 * defineRoute (lib/api/handler.ts): the order in which a declared route checks its input, and
 * the declaration it carries. The session is replaced by a stub; the routes' real checks
 * against the database are in tests/integration (authorisation, fuzz, roles-and-scope).
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';

import { HttpError } from '@/lib/errors';

const session = vi.hoisted(() => ({ signedIn: true, role: 'designer' as string, calls: [] as (string | undefined)[] }));

vi.mock('@/lib/auth/session', () => ({
  requireActor: vi.fn(async (action?: string) => {
    session.calls.push(action);
    if (!session.signedIn) throw new HttpError(401, 'Sign in to continue.');
    if (action === 'members.manage' && session.role !== 'admin') throw new HttpError(403, 'Your role may not do this.');
    return { userId: 'u1', organisationId: 'o1', role: session.role, name: 'D', email: 'd@example.test' };
  }),
}));

const { defineRoute, declareRoute } = await import('@/lib/api/handler');

const ctx = (params: Record<string, string>) => ({ params: Promise.resolve(params) });
const post = (body: string, headers: Record<string, string> = { 'content-type': 'application/json' }) =>
  new Request('http://127.0.0.1/api/things/x?limit=5', { method: 'POST', headers, body });

const seen = vi.fn();
const route = defineRoute({
  action: 'boards.edit',
  params: z.object({ thingId: z.uuid() }),
  query: z.object({ limit: z.coerce.number().int().min(1).max(10) }),
  body: z.object({ name: z.string().min(1) }).strict(),
  handler: async ({ actor, params, query, body }) => {
    seen({ actor: actor.userId, params, query, body });
    return Response.json({ ok: true });
  },
});
const id = '1f0e0c9a-2b7d-4c5e-9a1b-3c4d5e6f7a8b';

beforeEach(() => {
  session.signedIn = true;
  session.role = 'designer';
  session.calls = [];
  seen.mockClear();
});

describe('a declared route checks in order: params, session and role, query, body', () => {
  it('a junk id is 404 before the session is asked', async () => {
    session.signedIn = false;
    const res = await route(post('{}'), ctx({ thingId: 'not-an-id' }));
    expect(res.status).toBe(404);
    expect(session.calls).toEqual([]);
  });

  it('signed out is 401 with the declared action asked, before the body is read', async () => {
    session.signedIn = false;
    const res = await route(post('{"name":'), ctx({ thingId: id }));
    expect(res.status).toBe(401);
    expect(session.calls).toEqual(['boards.edit']);
  });

  it('junk in the body is 400 naming each field, and the handler never runs', async () => {
    const res = await route(post('{"name":"","extra":1}'), ctx({ thingId: id }));
    expect(res.status).toBe(400);
    const { issues } = (await res.json()) as { issues: { path: string }[] };
    expect(issues.map((i) => i.path).sort()).toEqual(['(body)', 'name']);
    expect(seen).not.toHaveBeenCalled();
  });

  it('junk in the query is 400 naming the field', async () => {
    const req = new Request(`http://127.0.0.1/api/things/x?limit=99`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"name":"A"}',
    });
    const res = await route(req, ctx({ thingId: id }));
    expect(res.status).toBe(400);
    expect(((await res.json()) as { issues: { path: string }[] }).issues.map((i) => i.path)).toEqual(['limit']);
  });

  it('a valid call reaches the handler with everything parsed', async () => {
    const res = await route(post('{"name":"Way 3"}'), ctx({ thingId: id }));
    expect(res.status).toBe(200);
    expect(seen).toHaveBeenCalledWith({
      actor: 'u1',
      params: { thingId: id },
      query: { limit: 5 },
      body: { name: 'Way 3' },
    });
  });

  it('a role without the permission is 403', async () => {
    const admins = defineRoute({ action: 'members.manage', scope: 'list', handler: async () => Response.json({}) });
    expect((await admins(new Request('http://127.0.0.1/api/members'), ctx({}))).status).toBe(403);
  });

  it('an error the handler did not expect is a 500 with no detail', async () => {
    const failing = defineRoute({
      action: 'signed-in',
      scope: 'none',
      handler: async () => {
        throw new Error('secret detail');
      },
    });
    vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const res = await failing(new Request('http://127.0.0.1/api/x'), ctx({}));
    expect(res.status).toBe(500);
    expect(await res.text()).not.toContain('secret');
  });

  it('a public route never asks for a session, and a multipart body is left to the handler', async () => {
    session.signedIn = false;
    const upload = defineRoute({
      action: 'public',
      publicBecause: 'a test route that takes an upload without a session',
      scope: 'none',
      body: 'multipart',
      handler: async ({ req, actor, body }) => Response.json({ actor, body: body ?? null, text: await req.text() }),
    });
    const res = await upload(post('raw bytes', { 'content-type': 'application/octet-stream' }), ctx({}));
    expect(await res.json()).toEqual({ actor: null, body: null, text: 'raw bytes' });
    expect(session.calls).toEqual([]);
  });
});

describe('the declaration', () => {
  it('is attached to the handler, frozen, with scope path by default when there are params', () => {
    expect(route.declaration).toMatchObject({ action: 'boards.edit', scope: 'path' });
    expect(Object.isFrozen(route.declaration)).toBe(true);
    expect('handler' in route.declaration).toBe(false);
  });

  it('must state a scope without params, and a reason on a public route', () => {
    const handler = async () => Response.json({});
    expect(() => defineRoute({ action: 'boards.read', handler })).toThrow(/scope/);
    expect(() => declareRoute(handler, { action: 'public', scope: 'none' })).toThrow(/why/);
  });
});
