/**
 * The board sizing route under load against a trivial authenticated route on the same
 * production server: autocannon, 16 connections, 10 s each after a warm-up, on a 36-way board:
 * the stored board's sizing (≥ 0.5 × the trivial route's req/s, p95 ≤ 1.5 × its p95) and the
 * editor's draft path, the board sent in the body (≥ 0.4 ×), as ratios measured in one run.
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
  // The editor's live path: the same board sent as an unsaved draft
  const res = await fetch(`${baseUrl}/api/boards/${boardId}`, { headers: { cookie } });
  const { settings, ways: draftWays } = saveBodyOf(((await res.json()) as { board: BoardDto }).board);
  const draftBody = JSON.stringify({ draft: { settings, ways: draftWays } });
  const draftRun = (d: number) =>
    load({ ...common, duration: d, url: `${baseUrl}/api/boards/${boardId}/sizing`, method: 'POST', body: draftBody });
  // Warm-up of each route, not counted: a fresh server loads a route's code and compiles
  // its hot paths in the first seconds
  await trivialRun(warmup);
  await sizingRun(warmup);
  await draftRun(warmup);
  // The trivial route before, between and after the two: each route's ratios are against the
  // mean of the trivial runs just around it, so a machine whose load drifts during the run
  // moves each base with it
  const trivialBefore = await trivialRun(duration);
  const sizing = await sizingRun(duration);
  const trivialBetween = await trivialRun(duration);
  const draft = await draftRun(duration);
  const trivialAfter = await trivialRun(duration);
  const around = (a: typeof trivialBefore, b: typeof trivialBefore) => ({
    rps: (a.rps + b.rps) / 2,
    p95: (a.p95 + b.p95) / 2,
  });
  const sizingBase = around(trivialBefore, trivialBetween);
  const draftBase = around(trivialBetween, trivialAfter);
  console.log(
    `board: ${ways} ways (${draftBody.length} bytes as a draft); 16 connections, ${duration} s each after ` +
      `${warmup} s of warm-up (not counted), ${baseUrl} (one process)`,
  );
  console.log(describe('GET /api/me (trivial, signed in)', trivialBefore));
  console.log(describe('POST /api/boards/:id/sizing (stored)', sizing));
  console.log(describe('GET /api/me again', trivialBetween));
  console.log(describe('… the same, draft in the body (editor)', draft));
  console.log(describe('GET /api/me again', trivialAfter));
  const ratio = sizing.rps / sizingBase.rps;
  const p95Ratio = sizing.p95 / sizingBase.p95;
  const draftRatio = draft.rps / draftBase.rps;
  const storedMet = ratio >= 0.5 && p95Ratio <= 1.5 && sizing.errors + sizing.non2xx === 0;
  const draftMet = draftRatio >= 0.4 && draft.errors + draft.non2xx === 0;
  console.log('\nratios against the trivial route (the mean of its runs just before and after each):');
  console.log(
    `  stored sizing  req/s ${ratio.toFixed(2)} × (target ≥ 0.5), p95 ${p95Ratio.toFixed(2)} × (target ≤ 1.5): ` +
      `${storedMet ? 'met' : 'NOT met'}`,
  );
  console.log(`  draft sizing   req/s ${draftRatio.toFixed(2)} × (target ≥ 0.4): ${draftMet ? 'met' : 'NOT met'}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
