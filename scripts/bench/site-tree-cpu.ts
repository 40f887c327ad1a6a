/**
 * The CPU work of one re-size of the bench site (scripts/bench/site-resize.ts: 10 boards × 36
 * ways, the origin's Ze alternating) in one process, without a server or a database: the boards
 * as `readTreeBoards` hands them over (parsed from JSON text), the tree sized (`sizeTree`), what
 * the route stores serialised (issues, carried values, outcomes: the whole sizings are left
 * pending), the way labels for the ripple, and the answer's tree built and serialised. Prints the CPU time per re-size (and the wall time); for a profile run it under
 * `node --cpu-prof`.
 * Run: npx tsx --conditions=react-server scripts/bench/site-tree-cpu.ts [iterations] [--parts]
 */
import { performance } from 'node:perf_hooks';

import type { BoardSettings } from '@/lib/boards/schemas';
import { treeDtoOf } from '@/lib/sites/tree-dto';
import type { SiteOrigin } from '@/lib/sites/tree-types';
import { sizingOutcome } from '@/lib/supply';

import * as siteTree from '@/lib/supply/size-tree';

import { BENCH_SETTINGS, finalWay, subMainWay } from './bench-site-ways';

const ITER = Number(process.argv[2] ?? 200);
const SHOW_PARTS = process.argv.includes('--parts');
type TreeBoard = Parameters<typeof siteTree.sizeTree>[2][number];
const sizeTree = siteTree.sizeTree;

let n = 0;
const id = (tag: string) => `00000000-0000-4000-8000-${(n++).toString(16).padStart(12, '0')}${tag ? '' : ''}`;

function benchSite(): TreeBoard[] {
  const settings = { ...BENCH_SETTINGS, conditionalRatingKa: null } as unknown as BoardSettings;
  const board = (name: string, ways: object[], feed: object): TreeBoard =>
    ({
      id: id('b'),
      ...settings,
      name,
      status: 'draft',
      version: 1,
      archived: false,
      feed,
      ways: ways.map((w, position) => ({ id: id('w'), rail: 0, position, ...w })),
      stored: null,
    }) as unknown as TreeBoard;
  const main = board(
    'Bench main board',
    [...Array.from({ length: 9 }, (_, i) => subMainWay(i)), ...Array.from({ length: 27 }, (_, i) => finalWay(i))],
    { from: 'origin' },
  );
  const subs = Array.from({ length: 9 }, (_, b) =>
    board(
      `Bench sub-board ${b + 1}`,
      Array.from({ length: 36 }, (_, i) => finalWay(i)),
      {
        from: 'way',
        boardId: main.id,
        wayId: main.ways[b].id,
        designCurrentOverride: null,
        upstreamRcdTimeDelayed: false,
      },
    ),
  );
  return [main, ...subs];
}

const text = JSON.stringify(benchSite());
const ORIGIN = { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.2, pfcKa: 6, source: 'public' } as SiteOrigin;

/** Wall time per part of a re-size, ms (printed with `--parts`). */
const parts = { read: 0, size: 0, store: 0, answer: 0 };
let mark = 0;
const lap = (part: keyof typeof parts) => {
  const now = performance.now();
  parts[part] += now - mark;
  mark = now;
};

function once(i: number): number {
  mark = performance.now();
  const origin = { ...ORIGIN, zeOhm: i % 2 ? 0.2 : 0.35 };
  const boards = JSON.parse(text) as TreeBoard[];
  lap('read');
  const sized = sizeTree('bench', origin, boards);
  lap('size');
  let bytes = 0;
  // As resizeSite stores an origin change: every board's supply changed, so no whole sizing is
  // made (each is left pending for its first read); issues, carried values and outcome are
  for (const [, b] of sized.boards) {
    bytes += JSON.stringify(b.issues).length;
    if (b.carried) bytes += JSON.stringify({ ...b.carried, treeVersion: i }).length;
    if (b.sizing) bytes += JSON.stringify(sizingOutcome(b.sizing)).length;
  }
  for (const b of boards) bytes += siteTree.wayLabelsOf(b).size;
  lap('store');
  const tree = treeDtoOf({ id: 'bench', name: 'Bench', origin, treeVersion: i }, boards, sized);
  bytes += JSON.stringify({ tree }).length;
  lap('answer');
  return bytes;
}

for (let i = 0; i < 20; i++) once(i);
for (const k of Object.keys(parts) as (keyof typeof parts)[]) parts[k] = 0;
// CPU time rather than wall time: the machine is shared, and the wall clock counts the others' work
const started = performance.now();
const cpu = process.cpuUsage();
let sink = 0;
for (let i = 0; i < ITER; i++) sink += once(i);
const used = process.cpuUsage(cpu);
const cpuMs = (used.user + used.system) / 1000 / ITER;
const wallMs = (performance.now() - started) / ITER;
console.log(
  `re-size of the bench site in one process: ${cpuMs.toFixed(2)} ms of CPU each (wall ${wallMs.toFixed(2)} ms) over ${ITER} (${sink % 7})`,
);
if (SHOW_PARTS) {
  const each = Object.entries(parts).map(([k, v]) => `${k} ${(v / ITER).toFixed(2)}`);
  console.log(`wall ms per part: ${each.join(', ')}`);
}
