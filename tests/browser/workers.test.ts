/**
 * The production server runs one worker per core (scripts/serve.mjs). Over HTTP on loopback,
 * each request on a new connection: a role change made through one worker is seen at once by
 * every worker (not after the member cache's few seconds), and a worker that dies is replaced
 * while the others keep answering.
 */
import { execFileSync } from 'node:child_process';
import crypto from 'node:crypto';
import http from 'node:http';

import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { db } from '@/lib/db';
import { Organisation, User } from '@/models';
import { signInCookie } from '@/scripts/bench/http-session';
import { DEMO_ORG, demoUser } from '@/scripts/demo-data';

import { APP_URL } from './helpers';

const PRIMARY = Number(process.env.APP_PID);

/** A GET on a connection of its own, so the primary hands it to the next worker in turn. */
function freshGet(path: string, cookie: string): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = http.get(`${APP_URL}${path}`, { agent: false, headers: { cookie } }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (chunk) => (body += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on('error', reject);
    req.setTimeout(5_000, () => req.destroy(new Error(`no answer to GET ${path} in 5 s`)));
  });
}

function workers(): number[] {
  const out = execFileSync('ps', ['--ppid', String(PRIMARY), '-o', 'pid='], { encoding: 'utf8' });
  return out.split('\n').map((l) => Number(l.trim())).filter(Boolean);
}

let member: User;
let password: string;

beforeAll(async () => {
  db();
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  password = `workers-${crypto.randomBytes(6).toString('hex')}-1`;
  member = await User.create({
    organisationId: org!.id,
    email: `workers-${crypto.randomUUID().slice(0, 8)}@example.test`,
    name: 'Worker test member',
    role: 'designer',
    passwordHash: await bcrypt.hash(password, 4),
  });
});

afterAll(async () => {
  await member?.update({ active: false });
  await db().close();
  (globalThis as { boardwrightSequelize?: unknown }).boardwrightSequelize = undefined;
});

describe('the server with a worker per core', () => {
  it('runs more than one worker on this machine', () => {
    expect(PRIMARY, 'scripts/test.sh exports APP_PID').toBeGreaterThan(0);
    expect(workers().length).toBeGreaterThanOrEqual(2);
  });

  it('a role change reaches every worker at once', async () => {
    const cookie = await signInCookie(APP_URL, member.email, password);
    const admin = await signInCookie(APP_URL, demoUser('admin').email, demoUser('admin').password);
    const roleSeen = async () => {
      const answers = await Promise.all(Array.from({ length: 8 }, () => freshGet('/api/me', cookie)));
      return answers.map((a) => (JSON.parse(a.body) as { user: { role: string } }).user.role);
    };
    // Every worker has the member cached as a designer
    expect(new Set(await roleSeen())).toEqual(new Set(['designer']));
    const res = await fetch(`${APP_URL}/api/members/${member.id}`, {
      method: 'PATCH',
      headers: { cookie: admin, 'content-type': 'application/json' },
      body: JSON.stringify({ role: 'inspector' }),
    });
    expect(res.status).toBe(200);
    // Well inside the cache's 5 s: every worker answers with the new role
    expect(new Set(await roleSeen())).toEqual(new Set(['inspector']));
  });

  it('a worker that dies is replaced, and requests keep being answered', async () => {
    const cookie = await signInCookie(APP_URL, demoUser('designer').email, demoUser('designer').password);
    const before = workers();
    process.kill(before[0], 'SIGKILL');
    // Once the primary has seen it go (a connection handed over in that instant is lost)
    for (let i = 0; i < 50 && workers().includes(before[0]); i++) await new Promise((r) => setTimeout(r, 20));
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await freshGet('/api/me', cookie)).status);
    expect(statuses.every((s) => s === 200), statuses.join(',')).toBe(true);
    // A new worker has started
    let now = workers();
    for (let i = 0; i < 100 && now.length < before.length; i++) {
      await new Promise((r) => setTimeout(r, 100));
      now = workers();
    }
    expect(now).toHaveLength(before.length);
    expect(now).not.toContain(before[0]);
  });
});
