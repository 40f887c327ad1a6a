/**
 * The production server runs one worker per core, or WEB_CONCURRENCY workers when that is set
 * (scripts/serve.mjs). Over HTTP on loopback,
 * each request on a new connection: a role change made through one worker is seen at once by
 * every worker (not after the member cache's few seconds), and a worker that dies is replaced
 * while the others keep answering.
 */
import { spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import os from 'node:os';

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

/** The server's own environment (Linux: /proc/<pid>/environ), not this test process's. */
function serverEnv(pid: number): Record<string, string> {
  const raw = readFileSync(`/proc/${pid}/environ`, 'utf8');
  return Object.fromEntries(
    raw.split('\0').filter(Boolean).map((entry) => {
      const at = entry.indexOf('=');
      return [entry.slice(0, at), entry.slice(at + 1)];
    }),
  );
}

/**
 * What the server promises (scripts/serve.mjs): WEB_CONCURRENCY workers when it is set to a
 * number, else one per core the machine makes available (os.availableParallelism), and never
 * fewer than one. Computed here from the server's environment, so no machine's core count is
 * written into the test.
 */
function promisedWorkers(env: Record<string, string | undefined>): number {
  return Math.max(1, Number(env.WEB_CONCURRENCY) || os.availableParallelism());
}

const PROMISED = PRIMARY > 0 ? promisedWorkers(serverEnv(PRIMARY)) : 0;
// With one worker the server runs `next start` in its own process (no cluster, no children)
const ONE_PROCESS = PROMISED === 1;

function workers(): number[] {
  // ps ends with status 1 when the process has no children (the server runs in one process)
  const ps = spawnSync('ps', ['--ppid', String(PRIMARY), '-o', 'pid='], { encoding: 'utf8' });
  if (ps.status !== 0 && ps.status !== 1) throw new Error(`ps failed: ${ps.stderr}`);
  return ps.stdout.split('\n').map((l) => Number(l.trim())).filter(Boolean);
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
  it('runs as many workers as WEB_CONCURRENCY asks, else one per available core', () => {
    expect(PRIMARY, 'scripts/test.sh exports APP_PID').toBeGreaterThan(0);
    expect(PROMISED).toBeGreaterThanOrEqual(1);
    expect(workers()).toHaveLength(ONE_PROCESS ? 0 : PROMISED);
  });

  // Between workers only: with one worker there is nothing to relay and nothing to replace
  it.skipIf(ONE_PROCESS)('a role change reaches every worker at once', async () => {
    const cookie = await signInCookie(APP_URL, member.email, password);
    const admin = await signInCookie(APP_URL, demoUser('admin').email, demoUser('admin').password);
    const roleSeen = async () => {
      // Connections go to the workers in turn: twice round them all, whatever their number
      const rounds = Array.from({ length: Math.max(8, 2 * PROMISED) }, () => freshGet('/api/me', cookie));
      const answers = await Promise.all(rounds);
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

  it.skipIf(ONE_PROCESS)('a worker that dies is replaced, and requests keep being answered', async () => {
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
