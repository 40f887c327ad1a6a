/**
 * The board sizing route under load against a trivial authenticated route on the same
 * production server: autocannon, 16 connections, 10 s each after a warm-up, on a 36-way board.
 * Needs a running server at APP_URL with the demo seeded (scripts/bench/sizing.sh does that).
 */
import { saveBodyOf } from '@/lib/api/save-body';
import type { BoardDto } from '@/lib/boards/types';
import { db } from '@/lib/db';
import { Way } from '@/models';
import { demoUser } from '@/scripts/demo-data';

import { benchBoard } from './bench-board';
import { signInCookie } from './http-session';
import { describe, load } from './load';

const baseUrl = process.env.APP_URL ?? 'http://127.0.0.1:3200';
const duration = Number(process.env.BENCH_SECONDS ?? 10);
const warmup = Number(process.env.BENCH_WARMUP_SECONDS ?? 5);

async function main() {
  const boardId = await benchBoard('Bench board, 36 ways');
  const cookie = await signInCookie(baseUrl, demoUser('designer').email, demoUser('designer').password);
  const common = { connections: 16, duration, headers: { cookie, 'content-type': 'application/json' } };
  const ways = await Way.count({ where: { boardId } });
  await db().close();

  const trivialRun = (d: number) => load({ ...common, duration: d, url: `${baseUrl}/api/me` });
  const sizingRun = (d: number) =>
    load({ ...common, duration: d, url: `${baseUrl}/api/boards/${boardId}/sizing`, method: 'POST', body: '' });
  // Warm-up of each route, not counted: a fresh server loads a route's code and compiles
  // its hot paths in the first seconds
  await trivialRun(warmup);
  await sizingRun(warmup);
  const trivial = await trivialRun(duration);
  const sizing = await sizingRun(duration);
  console.log(
    `board: ${ways} ways; 16 connections, ${duration} s each after ${warmup} s of warm-up (not counted), ` +
      `${baseUrl} (one process)`,
  );
  console.log(describe('GET /api/me (trivial, signed in)', trivial));
  console.log(describe('POST /api/boards/:id/sizing', sizing));
  console.log(
    '  (the stored board: its sizing is kept per stored state, lib/dal/board-sizing.ts, so this is one ' +
      'small statement and the kept answer; the draft line below is sized afresh on every request)',
  );
  const ratio = sizing.rps / trivial.rps;
  console.log(`ratio sizing / trivial: ${ratio.toFixed(2)}`);
  const met = ratio >= 0.5 && sizing.p95 < 30 && sizing.errors + sizing.non2xx === 0;
  console.log(`target (ratio ≥ 0.5, sizing p95 < 30 ms, no errors): ${met ? 'met' : 'NOT met'}`);

  // For information: the editor's live path, the same board sent as an unsaved draft
  const res = await fetch(`${baseUrl}/api/boards/${boardId}`, { headers: { cookie } });
  const { settings, ways: draftWays } = saveBodyOf(((await res.json()) as { board: BoardDto }).board);
  const draftRun = (d: number) =>
    load({
      ...common,
      duration: d,
      url: `${baseUrl}/api/boards/${boardId}/sizing`,
      method: 'POST',
      body: JSON.stringify({ draft: { settings, ways: draftWays } }),
    });
  await draftRun(warmup);
  console.log(describe('… the same, draft in the body (editor)', await draftRun(duration)));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
