/**
 * The production server as `npm test` starts it (`next start` after `npm run build`), over HTTP:
 * a member's role change or deactivation counts from their next request (the member is read
 * once per request, nothing kept between requests), and the print pool's worker, bundled beside
 * the build, renders drafts and issued revisions, the latter stored and then served from storage.
 */
import crypto from 'node:crypto';

import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { db } from '@/lib/db';
import { Board, Organisation, Site, User, Way } from '@/models';
import { signInCookie } from '@/scripts/bench/http-session';
import { DEMO_ORG, demoUser, demoWays, FLAT_BOARD } from '@/scripts/demo-data';

import { APP_URL } from './helpers';

let member: User;
let password: string;
let orgId: string;

beforeAll(async () => {
  db();
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  orgId = org!.id;
  password = `serving-${crypto.randomBytes(6).toString('hex')}-1`;
  member = await User.create({
    organisationId: orgId,
    email: `serving-${crypto.randomUUID().slice(0, 8)}@example.test`,
    name: 'Serving test member',
    role: 'designer',
    passwordHash: await bcrypt.hash(password, 4),
  });
});

afterAll(async () => {
  await member?.update({ active: false });
  await db().close();
  (globalThis as { boardwrightSequelize?: unknown }).boardwrightSequelize = undefined;
});

const signIn = (role: 'admin' | 'designer' | 'inspector' | 'installer') =>
  signInCookie(APP_URL, demoUser(role).email, demoUser(role).password);

describe('the member behind a request', () => {
  it('is read on every request: a role change and a deactivation count from the next one', async () => {
    const cookie = await signInCookie(APP_URL, member.email, password);
    const admin = await signIn('admin');
    const me = async () => {
      const res = await fetch(`${APP_URL}/api/me`, { headers: { cookie } });
      return { status: res.status, role: res.ok ? ((await res.json()) as { user: { role: string } }).user.role : null };
    };
    const patch = async (body: object) => {
      const res = await fetch(`${APP_URL}/api/members/${member.id}`, {
        method: 'PATCH',
        headers: { cookie: admin, 'content-type': 'application/json' },
        body: JSON.stringify(body),
      });
      expect(res.status).toBe(200);
    };
    expect(await me()).toEqual({ status: 200, role: 'designer' });
    await patch({ role: 'inspector' });
    expect(await me()).toEqual({ status: 200, role: 'inspector' });
    await patch({ active: false });
    expect((await me()).status).toBe(401);
  });
});

describe('printing on the built app', () => {
  it('renders a draft schedule in the print pool on every request', async () => {
    const board = await Board.findOne({ where: { organisationId: orgId, name: 'Flat 1 consumer unit' } });
    const cookie = await signIn('designer');
    for (let i = 0; i < 2; i++) {
      const res = await fetch(`${APP_URL}/api/boards/${board!.id}/schedule`, { headers: { cookie } });
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toBe('application/pdf');
      expect(res.headers.get('server-timing')).toMatch(/^render;/);
      expect(
        Buffer.from(await res.arrayBuffer())
          .subarray(0, 5)
          .toString(),
      ).toBe('%PDF-');
    }
  });

  it('renders an issued revision once and then serves the stored file', async () => {
    // A board of the demo's flat ways, put in review on the row and issued through the API
    const site = await Site.findOne({ where: { organisationId: orgId } });
    const created = await Board.create({
      ...FLAT_BOARD.settings,
      name: `Served board ${crypto.randomUUID().slice(0, 6)}`,
      organisationId: orgId,
      siteId: site!.id,
      status: 'in-review',
    });
    await Way.bulkCreate(demoWays(FLAT_BOARD).map((w) => ({ ...w, boardId: created.id })));
    const inspector = await signIn('inspector');
    const approve = await fetch(`${APP_URL}/api/boards/${created.id}/review/approve`, {
      method: 'POST',
      headers: { cookie: inspector, 'content-type': 'application/json' },
      body: JSON.stringify({ acknowledgeFailures: true, declaration: demoUser('inspector').name }),
    });
    expect(approve.status, await approve.clone().text()).toBe(200);
    const installer = await signIn('installer');
    const get = () =>
      fetch(`${APP_URL}/api/boards/${created.id}/schedule?download=1`, { headers: { cookie: installer } });
    const first = await get();
    expect(first.status).toBe(200);
    expect(first.headers.get('server-timing')).toMatch(/^render;/);
    const firstBytes = Buffer.from(await first.arrayBuffer());
    const second = await get();
    expect(second.status).toBe(200);
    expect(second.headers.get('server-timing')).toMatch(/^stored;/);
    expect(Buffer.from(await second.arrayBuffer()).equals(firstBytes)).toBe(true);
  });
});
