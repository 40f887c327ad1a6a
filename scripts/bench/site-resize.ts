/**
 * The site tree's routes under load, as ratios against the trivial signed-in route (`GET
 * /api/me`) measured in the same run on the same server (autocannon, 16 connections,
 * BENCH_SECONDS (10) each after BENCH_WARMUP_SECONDS (3) of warm-up):
 * - re-sizing a site of 10 boards × 36 ways after an upstream change: `PUT
 *   /api/sites/[siteId]/origin` with the origin's Ze alternating, so every request changes what
 *   is carried to all ten boards and re-sizes and stores them (target ≥ 0.2 × trivial);
 * - the site pack of those 10 boards, one request at a time (target < 3 s each).
 * Needs a running server at APP_URL with the demo seeded (scripts/bench/site.sh does that).
 */
import crypto from 'node:crypto';

import { db } from '@/lib/db';
import { Board, Organisation, Site, Way } from '@/models';
import { DEMO_ORG, demoUser } from '@/scripts/demo-data';

import { BENCH_ORIGIN, BENCH_SETTINGS, finalWay, subMainWay } from './bench-site-ways';
import { signInCookie } from './http-session';
import { describe, load, type LoadResult } from './load';

const baseUrl = process.env.APP_URL ?? 'http://127.0.0.1:3450';
const duration = Number(process.env.BENCH_SECONDS ?? 10);
const warmup = Number(process.env.BENCH_WARMUP_SECONDS ?? 3);
const CONNECTIONS = 16;
const SITE_NAME = 'Bench site, 10 boards of 36 ways';
const ORIGIN = BENCH_ORIGIN;

/**
 * The bench site, made once and found again by its name: a main board (9 sub-mains and 27
 * final circuits) feeding 9 boards of 36 final circuits each, single-phase.
 */
async function benchSite(): Promise<{ siteId: string; boards: number; ways: number }> {
  const org = await Organisation.findOne({ where: { name: DEMO_ORG } });
  if (!org) throw new Error('seed the demo first');
  let site = await Site.findOne({ where: { organisationId: org.id, name: SITE_NAME } });
  if (!site) {
    site = await Site.create({ organisationId: org.id, name: SITE_NAME });
    const settings = BENCH_SETTINGS;
    const main = await Board.create({ ...settings, name: 'Bench main board', organisationId: org.id, siteId: site.id });
    const mainWays = [
      ...Array.from({ length: 9 }, (_, i) => subMainWay(i)),
      ...Array.from({ length: 27 }, (_, i) => finalWay(i)),
    ].map((w, position) => ({ ...w, id: crypto.randomUUID(), rail: 0, position, boardId: main.id }));
    await Way.bulkCreate(mainWays);
    for (let b = 0; b < 9; b++) {
      const board = await Board.create({
        ...settings,
        name: `Bench sub-board ${b + 1}`,
        organisationId: org.id,
        siteId: site.id,
      });
      const ways = Array.from({ length: 36 }, (_, i) => ({ ...finalWay(i), id: crypto.randomUUID() }));
      await Way.bulkCreate(ways.map((w, position) => ({ ...w, rail: 0, position, boardId: board.id })));
      // Fed from way b of the main board (the columns of migration 0009)
      await db().query('UPDATE boards SET fed_from_way_id = $2 WHERE id = $1', { bind: [board.id, mainWays[b].id] });
    }
  }
  const boards = await Board.count({ where: { siteId: site.id, deletedAt: null } });
  const ways = await Way.count({ include: [{ model: Board, where: { siteId: site.id }, required: true }] }).catch(
    () => boards * 36,
  );
  return { siteId: site.id, boards, ways };
}

async function settle(): Promise<void> {
  for (let i = 0; i < 120; i++) {
    const started = performance.now();
    const ok = await fetch(`${baseUrl}/login`).then(
      (r) => r.arrayBuffer().then(() => true),
      () => false,
    );
    if (ok && performance.now() - started < 500) return;
  }
}

/** Waits until `url` (a route that reads the database) answers 200 within half a second. */
async function drain(url: string, cookie: string): Promise<void> {
  for (let i = 0; i < 60; i++) {
    const started = performance.now();
    const res = await fetch(url, { headers: { cookie } }).catch(() => null);
    await res?.arrayBuffer();
    if (res?.ok && performance.now() - started < 500) return;
    await new Promise((r) => setTimeout(r, 250));
  }
}

async function main() {
  db();
  const cookie = await signInCookie(baseUrl, demoUser('designer').email, demoUser('designer').password);
  const inspector = await signInCookie(baseUrl, demoUser('inspector').email, demoUser('inspector').password);
  const { siteId, boards, ways } = await benchSite();
  await db().close();
  console.log(
    `site: ${boards} boards, ${ways} ways; ${CONNECTIONS} connections, ${duration} s each after ${warmup} s of warm-up, ${baseUrl}`,
  );

  // One re-size through the route first: every board stored with what is carried to it
  const first = await fetch(`${baseUrl}/api/sites/${siteId}/origin`, {
    method: 'PUT',
    headers: { cookie, 'content-type': 'application/json' },
    body: JSON.stringify(ORIGIN),
  });
  if (!first.ok) throw new Error(`PUT origin: ${first.status} ${await first.text()}`);
  const text = await first.text();
  const answer = JSON.parse(text) as { tree: { boards: { depth: number }[] } };
  console.log(
    `tree: ${answer.tree.boards.length} boards, ${answer.tree.boards.filter((b) => b.depth > 0).length} fed from the main board; ` +
      `the answer ${(Buffer.byteLength(text) / 1024).toFixed(0)} KiB`,
  );

  const measure = async (opts: Parameters<typeof load>[0]): Promise<LoadResult> => {
    await settle();
    await load({ ...opts, duration: warmup });
    await settle();
    return load({ ...opts, duration });
  };
  const trivial = await measure({
    url: `${baseUrl}/api/me`,
    connections: CONNECTIONS,
    headers: { cookie },
    timeout: 60,
  });
  console.log(describe('GET /api/me (trivial, signed in)', trivial));
  let n = 0;
  const resize = await measure({
    url: `${baseUrl}/api/sites/${siteId}/origin`,
    connections: CONNECTIONS,
    timeout: 60,
    requests: [
      {
        method: 'PUT',
        headers: { cookie, 'content-type': 'application/json' },
        // The origin's Ze alternates, so each request changes what is carried to every board
        setupRequest: (req) => ({ ...req, body: JSON.stringify({ ...ORIGIN, zeOhm: n++ % 2 ? 0.2 : 0.35 }) }),
      },
    ],
  });
  console.log(describe('PUT origin (re-size 10 boards)', resize));
  const ratio = resize.rps / trivial.rps;
  const resizeMet = ratio >= 0.2 && resize.errors + resize.non2xx === 0;

  // The site pack, one at a time, once the server has finished the re-sizes still queued on the
  // site's lock when the load stopped (autocannon leaves them in flight)
  await drain(`${baseUrl}/api/sites/${siteId}/tree`, cookie);
  const packMs: number[] = [];
  for (let i = 0; i < 4; i++) {
    const started = performance.now();
    const res = await fetch(`${baseUrl}/api/sites/${siteId}/pack`, { headers: { cookie: inspector } });
    const bytes = await res.arrayBuffer();
    if (!res.ok) throw new Error(`pack: ${res.status} ${new TextDecoder().decode(bytes).slice(0, 300)}`);
    packMs.push(performance.now() - started);
    if (i === 0) console.log(`site pack: ${(bytes.byteLength / 1024).toFixed(0)} KiB`);
  }
  const later = packMs.slice(1).sort((a, b) => a - b);
  const packMet = later.every((ms) => ms < 3000);
  console.log(
    `site pack of ${boards} boards: first ${packMs[0].toFixed(0)} ms, then ${later.map((m) => m.toFixed(0)).join(', ')} ms`,
  );
  console.log('\nagainst the targets (same run):');
  console.log(
    `  re-size through PUT origin   ${ratio.toFixed(3)} × trivial  (target ≥ 0.2: ${resizeMet ? 'met' : 'NOT met'})`,
  );
  console.log(
    `  site pack                    ${later.map((m) => (m / 1000).toFixed(2)).join(' / ')} s  (target < 3 s: ${packMet ? 'met' : 'NOT met'})`,
  );
  console.log(`all targets: ${resizeMet && packMet ? 'met' : 'NOT met'}`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
