/**
 * In-process benchmark of the supply tree (not a timed test): re-sizing a site of 10 boards ×
 * 36 ways with `sizeSite` after an upstream change, against sizing the same 10 boards alone with
 * `sizeBoard` (the ratio shows the cost of carrying the values: the bottom-up demand pass sizes
 * every board below the origin once more). The route-level figure the issue asks for (≥ 0.2 × the
 * trivial authenticated route's req/s at 16 connections) needs the site route, which comes later.
 * Run: npx tsx scripts/supply-bench.ts [iterations]
 */
import { performance } from 'node:perf_hooks';

import { parseBoardInput, sizeBoard } from '@/lib/sizing';
import { sizeSite, type SiteBoardInput, type SiteTreeInput } from '@/lib/supply';

const ITER = Number(process.argv[2] ?? 30);

/** 36 single-phase ways: an RCD ahead of every twelve, then final circuits and sub-mains. */
function ways(boardIndex: number, subMainsTo: number[]): unknown[] {
  const out: unknown[] = [];
  let n = 0;
  for (const to of subMainsTo) {
    out.push({
      id: `b${boardIndex}-to-b${to}`,
      device: { kind: 'fuse-bs88-2', poles: 1, modules: 1, ratingA: 100 },
      circuit: {
        phases: 1,
        use: 'distribution',
        load: { kind: 'known', watts: 0, powerFactor: 1 },
        lengthM: 25 + to,
        cable: 'swa-xlpe-90',
        method: 'C',
        ambientC: 30,
        csaMm2: null,
      },
    });
    n += 1;
  }
  while (n < 36) {
    if (n % 12 === 0) {
      out.push({
        id: `b${boardIndex}-rcd${n}`,
        device: { kind: 'rcd', poles: 2, modules: 2, ratingA: 63, rcdMa: 30 },
        circuit: null,
      });
    }
    out.push({
      id: `b${boardIndex}-w${n}`,
      device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: null },
      circuit: {
        phases: 1,
        use: n % 3 === 0 ? 'lighting' : 'fixed',
        load: { kind: 'known', watts: n % 3 === 0 ? 300 : 800 + 40 * n, powerFactor: 1 },
        lengthM: 8 + (n % 20),
        cable: 'te-70',
        method: 'C',
        ambientC: 30,
        csaMm2: null,
      },
    });
    n += 1;
  }
  return out;
}

/** One origin board feeding three boards, each feeding two: 10 boards. */
function site(zeOhm: number): SiteTreeInput {
  const parentOf = [-1, 0, 0, 0, 1, 1, 2, 2, 3, 3];
  const boards: SiteBoardInput[] = parentOf.map((p, i) => {
    const children = parentOf.flatMap((q, j) => (q === i ? [j] : []));
    return {
      id: `b${i}`,
      name: `Board ${i}`,
      siteId: 'bench',
      feed: p < 0 ? { from: 'origin' } : { from: 'way', boardId: `b${p}`, wayId: `b${p}-to-b${i}` },
      board: {
        phases: 1,
        enclosureModules: 60,
        incoming: { kind: 'main-switch', ratingA: 100 },
        ways: ways(i, children),
      },
    } as SiteBoardInput;
  });
  return { siteId: 'bench', origin: { earthing: 'TN-C-S', uoV: 230, zeOhm, pfcKa: 6, source: 'public' }, boards };
}

function time(label: string, run: (i: number) => void): number {
  for (let i = 0; i < 5; i += 1) run(i); // warm-up
  const samples: number[] = [];
  for (let i = 0; i < ITER; i += 1) {
    const t0 = performance.now();
    run(i);
    samples.push(performance.now() - t0);
  }
  samples.sort((a, b) => a - b);
  const median = samples[Math.floor(samples.length / 2)];
  const p95 = samples[Math.min(samples.length - 1, Math.floor(samples.length * 0.95))];
  console.log(`${label}: median ${median.toFixed(1)} ms, p95 ${p95.toFixed(1)} ms (${ITER} runs)`);
  return median;
}

// An upstream change: the origin's Ze differs on every run, so nothing can be reused.
const inputs = Array.from({ length: ITER + 5 }, (_, i) => site(0.2 + i * 0.001));
const alone = inputs.map((s) => {
  const out = sizeSite(s);
  return out.boards.map((b) => b.sizedInput!);
});
const boards = inputs[0].boards.length;
const ways0 = inputs[0].boards[0].board.ways.filter((w) => (w as { circuit: unknown }).circuit).length;
console.log(`Site: ${boards} boards, ${ways0} circuits on the first board (36 ways each, RCDs besides).`);
const tSite = time('sizeSite (whole site, carried values)', (i) => void sizeSite(inputs[i % inputs.length]));
const tAlone = time('sizeBoard × 10 (the same boards, values typed in)', (i) => {
  for (const b of alone[i % alone.length]) sizeBoard({ ...b, supply: { ...b.supply } });
});
time('parseBoardInput × 10 (validation alone)', (i) => {
  for (const b of alone[i % alone.length]) parseBoardInput({ ...b, supply: { ...b.supply } });
});
console.log(`Ratio site / boards alone: ${(tSite / tAlone).toFixed(2)}`);
