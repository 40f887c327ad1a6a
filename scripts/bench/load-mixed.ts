/**
 * Mixed load on a running production server: every connection reads its own bench board, sizes
 * it and saves it (a circuit length changed), over and over. Saves need the current version:
 * each connection has a board of its own and saves at the version its read (or last save)
 * returned, so a 409 is never expected and counts as an error. Measures requests per second,
 * exact p50/p95/p99 of every response (scripts/bench/load.ts) and per kind, and the errors.
 * Run through scripts/bench/load.sh (npm run bench:load), which starts the server.
 */
import crypto from 'node:crypto';
import os from 'node:os';

import type autocannon from 'autocannon';
import bcrypt from 'bcryptjs';

import { saveBodyOf } from '@/lib/api/save-body';
import type { BoardDto } from '@/lib/boards/types';
import { db } from '@/lib/db';
import { Board, Organisation, Site, User, Way } from '@/models';
import { demoWays, WORKSHOP_BOARD } from '@/scripts/demo-data';

import { signInCookie } from './http-session';
import { load, quantile } from './load';

const baseUrl = process.env.APP_URL ?? 'http://127.0.0.1:3300';
const connections = Number(process.env.BENCH_CONNECTIONS ?? 50);
const duration = Number(process.env.BENCH_SECONDS ?? 30);
const warmup = Number(process.env.BENCH_WARMUP_SECONDS ?? 10);
const BENCH_ORG = 'Load bench (not a customer)';
const BENCH_EMAIL = 'load-bench-designer@bench.example.test';

/** The bench organisation, a designer with a fresh password, and one fresh board per connection. */
async function setup(): Promise<{ password: string; boardIds: string[]; ways: number }> {
  db();
  const [org] = await Organisation.findOrCreate({ where: { name: BENCH_ORG } });
  const password = `bench-${crypto.randomBytes(9).toString('base64url')}-1`;
  const passwordHash = await bcrypt.hash(password, 10);
  const user = await User.findOne({ where: { email: BENCH_EMAIL } });
  if (user) await user.update({ passwordHash, active: true, role: 'designer' });
  else {
    const bench = { organisationId: org.id, email: BENCH_EMAIL, name: 'Load bench', role: 'designer' as const };
    await User.create({ ...bench, passwordHash });
  }
  const [site] = await Site.findOrCreate({ where: { organisationId: org.id, name: 'Bench site' } });
  // Last run's boards go (their ways with them); each connection gets a new workshop board
  await Board.destroy({ where: { organisationId: org.id } });
  const boardIds: string[] = [];
  // Boards for the warm-up apart: a save still in flight when it ends must not move a board
  // that the measured run has just read
  for (let i = 0; i < connections * (warmup > 0 ? 2 : 1); i++) {
    const board = await Board.create({
      ...WORKSHOP_BOARD.settings,
      name: `Bench board ${String(i + 1).padStart(2, '0')}`,
      organisationId: org.id,
      siteId: site.id,
    });
    await Way.bulkCreate(demoWays(WORKSHOP_BOARD).map((w) => ({ ...w, boardId: board.id })));
    boardIds.push(board.id);
  }
  const ways = await Way.count({ where: { boardId: boardIds[0] } });
  await db().close();
  return { password, boardIds, ways };
}

type Kind = 'read' | 'sizing' | 'save';
const stats: Record<Kind, { times: number[]; statuses: Map<number, number> }> = {
  read: { times: [], statuses: new Map() },
  sizing: { times: [], statuses: new Map() },
  save: { times: [], statuses: new Map() },
};

function record(kind: Kind, status: number, startedAt: number) {
  stats[kind].times.push(performance.now() - startedAt);
  stats[kind].statuses.set(status, (stats[kind].statuses.get(status) ?? 0) + 1);
}

/** The read → size → save cycle of one connection on its own board. */
function cycleFor(boardId: string): autocannon.Request[] {
  let board: BoardDto | null = null;
  let startedAt = 0;
  let saves = 0;
  const stamp = <T>(req: T) => {
    startedAt = performance.now();
    return req;
  };
  return [
    {
      method: 'GET',
      path: `/api/boards/${boardId}`,
      setupRequest: stamp,
      onResponse: (status, body) => {
        record('read', status, startedAt);
        if (status === 200) board = (JSON.parse(body) as { board: BoardDto }).board;
      },
    },
    {
      method: 'POST',
      path: `/api/boards/${boardId}/sizing`,
      body: '',
      setupRequest: stamp,
      onResponse: (status) => record('sizing', status, startedAt),
    },
    {
      method: 'PUT',
      path: `/api/boards/${boardId}`,
      setupRequest: (req) => {
        // No board read yet (the read failed): skip back to the read
        if (!board) return undefined as unknown as autocannon.Request;
        const body = saveBodyOf(board);
        const way = body.ways.find((w) => w.circuit)!;
        saves += 1;
        way.circuit = { ...way.circuit!, lengthM: 20 + (saves % 10) };
        return stamp({ ...req, body: JSON.stringify(body) });
      },
      onResponse: (status, body) => {
        record('save', status, startedAt);
        if (status === 200) board = (JSON.parse(body) as { board: BoardDto }).board;
      },
    },
  ];
}

function line(kind: string, times: number[], statuses: Map<number, number>) {
  const sorted = times.slice().sort((a, b) => a - b);
  const codes = [...statuses].map(([s, n]) => `${s}×${n}`).join(' ');
  const q = (p: number) => `${quantile(sorted, p).toFixed(1)} ms`;
  return `  ${kind.padEnd(22)} ${String(sorted.length).padStart(6)} requests  p50 ${q(0.5)}  p95 ${q(0.95)}  p99 ${q(0.99)}  (${codes})`;
}

async function main() {
  const { password, boardIds, ways } = await setup();
  // Sign in (retried: a server still finishing a previous run can refuse the first try)
  let cookie = '';
  for (let attempt = 1; !cookie; attempt++) {
    try {
      cookie = await signInCookie(baseUrl, BENCH_EMAIL, password);
    } catch (err) {
      if (attempt === 3) throw err;
      console.log(`sign-in attempt ${attempt} failed (${(err as Error).message}); trying again in 2 s`);
      await new Promise((r) => setTimeout(r, 2_000));
    }
  }
  let next = 0;
  const run = (seconds: number, boards: string[]) =>
    load({
      url: baseUrl,
      connections,
      duration: seconds,
      headers: { cookie, 'content-type': 'application/json' },
      // Placeholder; every client gets its own cycle on its own board in setupClient
      requests: [{ method: 'GET', path: '/api/me' }],
      setupClient: (client) => {
        client.setRequests(cycleFor(boards[next++ % boards.length]));
      },
    });
  // Warm-up at the same load, not counted: a fresh server loads each route's code and
  // compiles its hot paths in the first seconds (p99 near 1 s in the first 3 s, measured)
  let warm = { requests: 0, errors: 0 };
  if (warmup > 0) {
    const w = await run(warmup, boardIds.slice(connections));
    warm = { requests: w.requests, errors: w.errors + w.non2xx };
    for (const kind of Object.values(stats)) {
      kind.times.length = 0;
      kind.statuses.clear();
    }
  }
  const loadBefore = os.loadavg()[0];
  next = 0;
  const result = await run(duration, boardIds.slice(0, connections));
  const conflicts = stats.save.statuses.get(409) ?? 0;
  const warmLine = `warm-up: ${warm.requests} requests, errors and non-2xx ${warm.errors}`;
  const errors = result.errors + result.non2xx;
  console.log(
    `load: ${connections} connections for ${duration} s after a ${warmup} s warm-up at the same load (not counted), ` +
      `against ${baseUrl} (production build, one next start process, loopback); ` +
      `one ${ways}-way bench board per connection, cycle read → size → save`,
  );
  console.log(
    `all: ${result.requests} requests, ${result.rps.toFixed(0)} req/s, p50 ${result.p50.toFixed(1)} ms, ` +
      `p95 ${result.p95.toFixed(1)} ms, p99 ${result.p99.toFixed(1)} ms, errors ${result.errors}, non-2xx ${result.non2xx}`,
  );
  console.log(warmLine);
  console.log('per kind (timed from the request being built to its response):');
  console.log(line('GET /api/boards/:id', stats.read.times, stats.read.statuses));
  console.log(line('POST …/:id/sizing', stats.sizing.times, stats.sizing.statuses));
  console.log(line('PUT /api/boards/:id', stats.save.times, stats.save.statuses));
  console.log(`409 on saves: ${conflicts} (none expected: each connection saves its own board at the version it read)`);
  console.log(
    `machine: ${os.cpus().length} cores, load average ${loadBefore.toFixed(2)} before, ${os.loadavg()[0].toFixed(2)} after ` +
      '(other work on the machine makes these figures noisy)',
  );
  const met = errors === 0 && warm.errors === 0 && result.p99 < 250;
  console.log(`target (no errors, p99 < 250 ms): ${met ? 'met' : 'NOT met'}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
