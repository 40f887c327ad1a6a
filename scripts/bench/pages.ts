/**
 * The pages each role opens and the schedule PDF, as ratios against the trivial signed-in route
 * (`GET /api/me`) measured in the same run on the same server: autocannon, 16 connections,
 * BENCH_SECONDS (10) each after BENCH_WARMUP_SECONDS (3) of warm-up per route; each route's ratio
 * is against the mean of the trivial route measured just before and just after it. Then printing
 * under load: 8 connections print draft schedules while 16 call the trivial route, whose req/s
 * is compared with its own figure alone. Needs a running server at APP_URL with the demo seeded
 * (scripts/bench/pages.sh does that). Targets: review page ≥ 0.2 ×, issued schedule download
 * ≥ 0.5 ×, trivial route under printing ≥ 0.7 × its req/s.
 */
import { db } from '@/lib/db';
import { Board, User, Way } from '@/models';
import { demoUser } from '@/scripts/demo-data';

import { benchBoard } from './bench-board';
import { signInCookie } from './http-session';
import { describe, load, type LoadResult } from './load';

const baseUrl = process.env.APP_URL ?? 'http://127.0.0.1:3400';
const duration = Number(process.env.BENCH_SECONDS ?? 10);
const warmup = Number(process.env.BENCH_WARMUP_SECONDS ?? 3);
const CONNECTIONS = 16;
const PRINTERS = 8;

/** The issued bench board: put in review on the row and approved through the API as the inspector. */
async function issuedBoard(inspectorCookie: string): Promise<string> {
  const id = await benchBoard('Bench board, 36 ways, issued');
  const board = await Board.findByPk(id);
  if (board!.status === 'issued' || board!.status === 'labels-matched') return id;
  const designer = await User.findOne({ where: { email: demoUser('designer').email } });
  await Board.update({ status: 'in-review', designChangedById: designer!.id }, { where: { id } });
  const res = await fetch(`${baseUrl}/api/boards/${id}/review/approve`, {
    method: 'POST',
    headers: { cookie: inspectorCookie, 'content-type': 'application/json' },
    body: JSON.stringify({ acknowledgeFailures: true, declaration: demoUser('inspector').name }),
  });
  if (!res.ok) throw new Error(`approving the bench board failed: ${res.status} ${await res.text()}`);
  return id;
}

type Run = { name: string; url: string; cookie: string; connections?: number };

/** Waits until the server has worked off what the last run left queued (a quick answer to /login). */
async function settle(): Promise<void> {
  for (let i = 0; i < 120; i++) {
    const started = performance.now();
    const ok = await fetch(`${baseUrl}/login`).then(
      (r) => r.arrayBuffer().then(() => true),
      () => false,
    );
    if (!ok) continue;
    if (performance.now() - started < 500) return;
  }
}

// Pages on a loaded machine can take seconds: a request counts as an error after 60 s only
const TIMEOUT_S = 60;

async function measure(run: Run): Promise<LoadResult> {
  const opts = {
    connections: run.connections ?? CONNECTIONS,
    headers: { cookie: run.cookie },
    url: `${baseUrl}${run.url}`,
    timeout: TIMEOUT_S,
  };
  await settle();
  await load({ ...opts, duration: warmup });
  await settle();
  return load({ ...opts, duration });
}

async function main() {
  db();
  const cookies = {
    designer: await signInCookie(baseUrl, demoUser('designer').email, demoUser('designer').password),
    inspector: await signInCookie(baseUrl, demoUser('inspector').email, demoUser('inspector').password),
    installer: await signInCookie(baseUrl, demoUser('installer').email, demoUser('installer').password),
  };
  const draft = await benchBoard('Bench board, 36 ways');
  const issued = await issuedBoard(cookies.inspector);
  const ways = await Way.count({ where: { boardId: issued } });
  await db().close();

  console.log(
    `boards: ${ways} ways; ${CONNECTIONS} connections, ${duration} s each after ${warmup} s of warm-up (not counted), ${baseUrl}`,
  );
  const trivial = await measure({ name: 'trivial', url: '/api/me', cookie: cookies.designer });
  console.log(describe('GET /api/me (trivial, signed in)', trivial));
  const runs: (Run & { target?: number })[] = [
    { name: 'editor page (designer)', url: `/boards/${draft}`, cookie: cookies.designer },
    { name: 'review page (inspector)', url: `/boards/${issued}/review`, cookie: cookies.inspector, target: 0.2 },
    { name: 'schedule page (inspector)', url: `/boards/${issued}/schedule`, cookie: cookies.inspector },
    { name: 'walk page (installer)', url: `/boards/${issued}/walk`, cookie: cookies.installer },
    {
      name: 'schedule PDF, issued',
      url: `/api/boards/${issued}/schedule?download=1`,
      cookie: cookies.installer,
      target: 0.5,
    },
    { name: 'schedule PDF, draft', url: `/api/boards/${draft}/schedule`, cookie: cookies.designer },
  ];
  // The server renders in its print pool after the client has stopped waiting: one more print
  // answered (not refused with 503 because the queue is still full) means the queue left by the
  // draft run has been worked off
  const drain = async () => {
    for (let i = 0; i < 120; i++) {
      const res = await fetch(`${baseUrl}/api/boards/${draft}/schedule`, { headers: { cookie: cookies.designer } });
      await res.arrayBuffer();
      if (res.status !== 503) return;
      await new Promise((r) => setTimeout(r, 1000));
    }
  };
  // The machine is shared and its speed drifts over a run of minutes: each route is compared
  // with the trivial route measured just before it and just after it (the mean of the two),
  // not with one figure taken at the start
  const lines: string[] = [];
  let allMet = true;
  let before = trivial;
  for (const [i, run] of runs.entries()) {
    const r = await measure(run);
    // A print run leaves renders queued on the server: let them finish before the next run
    if (run.url.includes('/schedule') && run.url.startsWith('/api/')) await drain();
    console.log(describe(run.name, r));
    const after = await measure({ name: 'trivial', url: '/api/me', cookie: cookies.designer });
    console.log(describe(`GET /api/me (trivial, after run ${i + 1})`, after));
    // Answers that were refused (a draft print when the print queue is full: 503) are not counted
    const answered = r.requests ? (r.rps * (r.requests - r.non2xx)) / r.requests : 0;
    const ratio = answered / ((before.rps + after.rps) / 2);
    before = after;
    const met = run.target === undefined || (ratio >= run.target && r.errors + r.non2xx === 0);
    if (!met) allMet = false;
    lines.push(
      `${run.name.padEnd(36)} ${ratio.toFixed(3)} × trivial${run.target === undefined ? '' : `  (target ≥ ${run.target}: ${met ? 'met' : 'NOT met'})`}` +
        `  (${(answered / trivial.rps).toFixed(3)} × the first trivial run)` +
        (r.non2xx ? `  (${r.non2xx} of ${r.requests} refused, not counted)` : ''),
    );
  }

  // Printing under load: the trivial route at 16 connections while 8 print draft schedules,
  // against the trivial route alone just before (after the last run, whose prints were drained)
  // and just after (once these prints are drained too)
  const printOpts = {
    connections: PRINTERS,
    headers: { cookie: cookies.designer },
    url: `${baseUrl}/api/boards/${draft}/schedule`,
    timeout: TIMEOUT_S,
  };
  const trivialOpts = {
    connections: CONNECTIONS,
    headers: { cookie: cookies.designer },
    url: `${baseUrl}/api/me`,
    timeout: TIMEOUT_S,
  };
  await settle();
  const printing = load({ ...printOpts, duration: duration + 2 * warmup });
  await new Promise((r) => setTimeout(r, warmup * 1000));
  const underPrint = await load({ ...trivialOpts, duration });
  const printed = await printing;
  await drain();
  const alone = await measure({ name: 'trivial again', url: '/api/me', cookie: cookies.designer });
  console.log(describe('GET /api/me, while 8 print drafts', underPrint));
  console.log(describe('  the 8 printing connections', printed));
  console.log(describe('GET /api/me, alone (after the prints)', alone));
  const base = (before.rps + alone.rps) / 2;
  const kept = underPrint.rps / base;
  const keptMet = kept >= 0.7 && underPrint.errors + underPrint.non2xx === 0;
  if (!keptMet) allMet = false;
  lines.push(
    `${'trivial while 8 print drafts'.padEnd(36)} ${kept.toFixed(3)} × trivial alone  (target ≥ 0.7: ${keptMet ? 'met' : 'NOT met'})`,
  );
  console.log('\nratios against the trivial route (same run):');
  for (const line of lines) console.log(`  ${line}`);
  console.log(`all targets: ${allMet ? 'met' : 'NOT met'}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
