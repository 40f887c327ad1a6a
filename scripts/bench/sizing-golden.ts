/**
 * Every number the engine and the supply tree give, for a broad fixed set of inputs, written to
 * one file, so that a change meant to make sizing cheaper can be shown to change no number:
 * run it before the change (`write out.txt`) and after (`check out.txt`); `check` compares the
 * two answer by answer, byte for byte, and names the first inputs whose answers differ. Not a
 * test: the file is what the engine answered, not what it should answer (the engine's tests hold
 * that).
 *
 * Inputs: the demo boards (scripts/demo-data.ts) alone and as the demo site's tree, the bench
 * boards (scripts/bench/bench-board.ts, site-resize.ts), the supply tests' trees
 * (tests/unit/supply/fixtures.ts), and pseudo-random boards, trees and single circuits
 * (`sizeCircuit`) from a fixed seed (every device, load, cable, method, supply and option the schemas
 * allow, some of them invalid on purpose, so that refusals and their messages are kept too).
 *
 * Run: npx tsx --conditions=react-server scripts/bench/sizing-golden.ts write|check FILE
 */
import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';

import type { BoardFeed, BoardSettings, WayInput } from '@/lib/boards/schemas';
import type { SiteOrigin } from '@/lib/sites/tree-types';
import {
  CABLE_KINDS,
  CIRCUIT_USES,
  EARTHING_SYSTEMS,
  methodsFor,
  parseBoardInput,
  parseCircuitInput,
  PROTECTIVE_DEVICE_KINDS,
  sizeBoard,
  sizeCircuit,
  SizingInputError,
  STANDARD_RATINGS_A,
} from '@/lib/sizing';
import { ARMOURED_CPC_KINDS, LOAD_TYPES, SOCKET_ARRANGEMENT_KINDS, SPECIAL_LOCATIONS } from '@/lib/sizing/types';
import { CONDUCTOR_SIZES_MM2 } from '@/lib/sizing/tables/conductor-resistance';
import { treeDtoOf } from '@/lib/sites/tree-dto';
import { groupSelectivity, sizeSite, SiteTreeError, type SelectivityPair, type SiteTreeInput } from '@/lib/supply';
import { sizeTree as sizeTreeOf, type TreeBoard } from '@/lib/supply/size-tree';
import * as demo from '@/scripts/demo-data';
import { BENCH_SETTINGS, finalWay, subMainWay } from '@/scripts/bench/bench-site-ways';
import * as fixtures from '@/tests/unit/supply/fixtures';

type TreeBoardLike = BoardSettings & {
  id: string;
  status: 'draft';
  version: number;
  archived: boolean;
  ways: WayInput[];
  feed: BoardFeed;
  stored: null;
};

/** A fixed-seed generator (mulberry32), so every run makes the same inputs. */
function rng(seed: number) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(next() * xs.length)];
  const num = (lo: number, hi: number) => lo + next() * (hi - lo);
  const chance = (p: number) => next() < p;
  return { next, pick, num, chance };
}
type Rng = ReturnType<typeof rng>;

let uuidCounter = 0;
/** A stable uuid-shaped id (the tree's feed schema wants uuids). */
const uid = (tag: string) => {
  const h = createHash('sha1').update(`${tag}:${uuidCounter++}`).digest('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-4${h.slice(13, 16)}-8${h.slice(17, 20)}-${h.slice(20, 32)}`;
};

function randomSupply(r: Rng) {
  const earthing = r.pick(EARTHING_SYSTEMS);
  const s: Record<string, unknown> = {
    earthing,
    uoV: r.chance(0.9) ? 230 : r.pick([110, 120, 240, 277]),
    zeOhm: earthing === 'TT' ? r.num(1, 250) : r.pick([0.05, 0.2, 0.35, 0.8, r.num(0.01, 2.5)]),
    pfcKa: r.pick([0.5, 1.5, 3, 6, 10, 16, 25, r.num(0.2, 30)]),
    source: r.pick(['public', 'private']),
  };
  if (r.chance(0.25)) s.vdUsedPct = r.num(0, 4);
  if (r.chance(0.01)) s.uoV = 400; // refused: the line voltage
  return s;
}

function randomCircuit(r: Rng, phases: 1 | 3, use?: string) {
  const cable = r.pick(CABLE_KINDS);
  const ph = cable === 'te-70' ? 1 : phases;
  const u = use ?? r.pick(CIRCUIT_USES);
  const socket = u === 'sockets' && ph === 1 && r.chance(0.6);
  const methods = methodsFor(cable);
  const c: Record<string, unknown> = {
    phases: ph,
    use: u,
    load: socket
      ? {
          kind: 'socket-arrangement',
          arrangement: r.pick(SOCKET_ARRANGEMENT_KINDS),
          floorAreaM2: r.num(5, 120),
          ...(r.chance(0.2) ? { assumedA: r.num(5, 32) } : {}),
        }
      : {
          kind: 'known',
          watts: r.pick([0, 100, 600, 2300, 3000, 7200, 9500, r.num(0, 40000)]),
          powerFactor: r.num(0.6, 1),
        },
    lengthM: r.pick([1, 5, 12, 25, 40, r.num(0.5, 180)]),
    cable,
    method: r.chance(0.95) ? r.pick(methods) : r.pick(['A', 'B', 'C', 'D', 'E', 'F', '100', '101', '102', '103']),
    ambientC: r.pick([25, 30, 35, 40, 50, r.num(-10, 70)]),
    csaMm2: r.chance(0.55) ? null : r.pick(CONDUCTOR_SIZES_MM2 as readonly number[]),
  };
  if (r.chance(0.5)) c.serves = r.pick(['Lighting: workshop', 'Sockets: bench', 'Compressor', 'Sub-main']);
  if (r.chance(0.4)) {
    c.grouping = {
      circuits: Math.floor(r.num(1, 12)),
      arrangement: r.pick(['bunched', 'single-layer']),
      ...(r.chance(0.3) ? { spacingM: r.pick([0, 0.125, 0.25, 0.5, 1]) } : {}),
    };
  }
  if (r.chance(0.3)) c.insulationMm = r.pick([0, 50, 100, 200, 400, 600]);
  if (r.chance(0.2) && c.csaMm2 !== null) c.cpcMm2 = r.pick(CONDUCTOR_SIZES_MM2 as readonly number[]);
  if (r.chance(0.5)) c.concealedInWall = r.chance(0.5);
  if (r.chance(0.1)) c.buried = r.chance(0.5);
  if (r.chance(0.1)) c.inDucts = r.chance(0.5);
  if (r.chance(0.3)) c.loadType = r.pick(LOAD_TYPES);
  if (r.chance(0.15)) c.specialLocation = r.pick(SPECIAL_LOCATIONS);
  if (cable === 'swa-xlpe-90' && r.chance(0.4)) c.armouredCpc = r.pick(ARMOURED_CPC_KINDS);
  if (r.chance(0.3)) c.dwelling = r.chance(0.5);
  if (r.chance(0.01)) c.lengthM = 0; // refused
  return c;
}

function randomDevice(r: Rng, kind: string, phases: 1 | 3, boardPhases: 1 | 3) {
  const breaker = kind === 'mcb' || kind === 'rcbo';
  const list = (STANDARD_RATINGS_A as Record<string, readonly number[]>)[kind];
  const poles = phases === 3 ? r.pick([3, 4] as const) : r.chance(0.85) ? 1 : 2;
  const d: Record<string, unknown> = {
    kind,
    poles,
    modules: poles,
    ratingA: list ? (r.chance(0.3) ? null : r.pick(list)) : r.pick([40, 63, 80, 100]),
  };
  if (breaker) d.curve = r.pick(['B', 'C', 'D']);
  if (kind === 'rcbo' || kind === 'rcd') d.rcdMa = r.pick([10, 30, 30, 30, 100, 300]);
  if (kind === 'rcd' || kind === 'rcbo') if (r.chance(0.5)) d.rcdType = r.pick(['AC', 'A', 'F', 'B']);
  if (r.chance(0.4) && list) d.breakingKa = r.pick([3, 6, 10, 16, 25, 50, 80]);
  if (boardPhases === 3 && poles < 3 && r.chance(0.7)) d.phase = r.pick(['L1', 'L2', 'L3']);
  if (r.chance(0.005)) d.curve = breaker ? undefined : 'B'; // refused
  return d;
}

function randomWay(r: Rng, boardPhases: 1 | 3, tag: string) {
  const roll = r.next();
  if (roll < 0.04) return { id: uid(tag), device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null };
  if (roll < 0.1) {
    const p = boardPhases === 3 ? 4 : 2;
    return { id: uid(tag), device: randomDevice(r, 'rcd', boardPhases === 3 ? 3 : 1, boardPhases), circuit: null, p };
  }
  if (roll < 0.12) return { id: uid(tag), device: { kind: 'spd', poles: 2, modules: 2 }, circuit: null };
  const kind = r.pick(PROTECTIVE_DEVICE_KINDS);
  const phases: 1 | 3 = boardPhases === 3 && r.chance(0.3) ? 3 : 1;
  const spare = r.chance(0.08);
  return {
    id: uid(tag),
    device: randomDevice(r, kind, phases, boardPhases),
    circuit: spare ? null : randomCircuit(r, phases),
  };
}

function randomSettings(r: Rng, name: string): BoardSettings {
  const phases: 1 | 3 = r.chance(0.4) ? 3 : 1;
  return {
    name,
    location: '',
    phases,
    supply: randomSupply(r) as BoardSettings['supply'],
    incoming: {
      kind: r.pick(['main-switch', 'mcb', 'fuse-bs88-2', 'rcd'] as const),
      ratingA: r.pick([40, 63, 80, 100, 125, 200]),
      ...(r.chance(0.3) ? { busbarRatingA: r.pick([63, 100, 125, 250]) } : {}),
    },
    enclosureModules: r.pick([12, 18, 24, 36, 72, 120]),
    rails: 1,
    dwelling: r.chance(0.4),
    ...(r.chance(0.3) ? { conditionalRatingKa: r.pick([6, 10, 16]) } : {}),
  } as BoardSettings;
}

/** Places a board's ways on one rail, in order. */
const placed = (ways: unknown[]): WayInput[] =>
  ways.map((w, position) => {
    const { p: _p, ...rest } = w as Record<string, unknown> & { p?: number };
    return { ...rest, rail: 0, position } as WayInput;
  });

/** Deterministic ids and places for a demo board's ways (demoWays draws random ids). */
function demoBoardWays(d: { settings: BoardSettings; ways: unknown[] }, tag: string): WayInput[] {
  return placed(d.ways.map((w) => ({ ...structuredClone(w as object), id: uid(tag) })));
}

/** Serialises with Maps as their entries (the tree's answer holds Maps). */
const text = (v: unknown) =>
  JSON.stringify(v, (_k, x) => (x instanceof Map ? { map: [...x] } : x instanceof Set ? { set: [...x] } : x));

function attempt(f: () => unknown): string {
  try {
    return text(f());
  } catch (err) {
    if (err instanceof SizingInputError || err instanceof SiteTreeError)
      return text({ error: err.message, issues: err.issues });
    throw err;
  }
}

const sizeTree = (siteId: string, origin: SiteOrigin | null, boards: TreeBoardLike[]) =>
  sizeTreeOf(siteId, origin, boards as unknown as TreeBoard[]);

async function main() {
  const [mode, file] = process.argv.slice(2);
  if ((mode !== 'write' && mode !== 'check') || !file) throw new Error('usage: write|check FILE');
  const out: [string, string][] = [];
  const add = (name: string, f: () => unknown) => out.push([name, attempt(f)]);
  const tree = (name: string, siteId: string, origin: SiteOrigin | null, boards: TreeBoardLike[]) => {
    add(name, () => sizeTree(siteId, origin, boards));
    // The tree as the route answers it (its selectivity grouped), and the pack's groups
    add(`${name} (answer)`, () =>
      treeDtoOf(
        { id: siteId, name, origin, treeVersion: 1 },
        boards as unknown as TreeBoard[],
        sizeTree(siteId, origin, boards) as never,
      ),
    );
    add(`${name} (selectivity groups)`, () => {
      const sized = sizeTree(siteId, origin, boards) as { site: { boards: { selectivity: SelectivityPair[] }[] } };
      return sized.site.boards.map((b) => groupSelectivity(b.selectivity));
    });
    // What the route stores: each sizing as its JSON text
    add(`${name} (stored text)`, () => {
      const sized = sizeTree(siteId, origin, boards) as { boards: Map<string, { sizing: unknown }> };
      return [...sized.boards].map(([id, b]) => [id, b.sizing && JSON.stringify(b.sizing)]);
    });
  };
  const treeBoard = (settings: BoardSettings, ways: WayInput[], feed: BoardFeed, id = uid('board')): TreeBoardLike => ({
    ...settings,
    id,
    status: 'draft',
    version: 1,
    archived: false,
    ways,
    feed,
    stored: null,
  });

  // The supply tests' trees (and, as a marker, which engine bench the file was written beside)
  const engineBench = readFileSync(new URL('./sizing-engine.ts', import.meta.url), 'utf8');
  add('engine bench source hash', () => createHash('sha1').update(engineBench).digest('hex'));
  for (const name of Object.keys(fixtures) as (keyof typeof fixtures)[]) {
    const f = fixtures[name] as unknown;
    if (typeof f !== 'function' || f.length > 0) continue;
    const input = (f as () => SiteTreeInput)();
    if (!input || typeof input !== 'object' || !('boards' in input)) continue;
    add(`fixture ${name}`, () => sizeSite(input));
    for (const b of input.boards)
      add(`fixture ${name} board ${b.id}`, () => sizeBoard({ ...b.board, supply: input.origin } as never));
  }

  // The demo boards, alone with their typed supply and with others
  const demos = {
    flat: demo.FLAT_BOARD,
    workshop: demo.WORKSHOP_BOARD,
    workshopSite: demo.WORKSHOP_SITE_BOARD,
    finishing: demo.FINISHING_BOARD,
  };
  const r0 = rng(7671);
  for (const [name, d] of Object.entries(demos)) {
    const ways = demoBoardWays(d as never, name);
    const tb = treeBoard(d.settings, ways, { from: 'origin' });
    add(`demo ${name}`, () => sizeTree('demo', null, [tb]));
    for (let i = 0; i < 12; i++) {
      const supply = randomSupply(r0) as BoardSettings['supply'];
      add(`demo ${name} supply ${i}`, () => sizeTree('demo', null, [{ ...tb, supply }]));
      add(`demo ${name} dwelling ${i}`, () => sizeTree('demo', null, [{ ...tb, supply, dwelling: !tb.dwelling }]));
    }
  }
  // The demo site as one tree (seed.ts links them so)
  {
    const ws = demoBoardWays(demo.WORKSHOP_SITE_BOARD as never, 'ws');
    const finishingWay = ws[ws.length - 2];
    const flatWay = ws[ws.length - 1];
    const workshop = treeBoard(demo.WORKSHOP_SITE_BOARD.settings, ws, { from: 'origin' });
    const finishing = treeBoard(demo.FINISHING_BOARD.settings, demoBoardWays(demo.FINISHING_BOARD as never, 'fin'), {
      from: 'way',
      boardId: workshop.id,
      wayId: finishingWay.id,
      designCurrentOverride: null,
      upstreamRcdTimeDelayed: false,
    });
    const flat = treeBoard(demo.FLAT_BOARD.settings, demoBoardWays(demo.FLAT_BOARD as never, 'flat'), {
      from: 'way',
      boardId: workshop.id,
      wayId: flatWay.id,
      designCurrentOverride: { amps: 45, reason: 'Measured' },
      upstreamRcdTimeDelayed: true,
    });
    const origin = { ...demo.WORKSHOP_SITE_BOARD.settings.supply } as unknown as SiteOrigin;
    tree('demo site, no origin', 'demo', null, [workshop, finishing, flat]);
    tree('demo site', 'demo', origin, [workshop, finishing, flat]);
    tree('demo site, flat at design current', 'demo', origin, [
      workshop,
      finishing,
      { ...flat, feed: { ...(flat.feed as object), designCurrentOverride: null } as BoardFeed },
    ]);
    for (let i = 0; i < 8; i++) {
      const o = randomSupply(r0) as unknown as SiteOrigin;
      tree(`demo site origin ${i}`, 'demo', o, [workshop, finishing, flat]);
    }
    // A parent the engine refuses: the children are cut loose
    tree('demo site, refused parent', 'demo', origin, [
      { ...workshop, enclosureModules: 0 } as TreeBoardLike,
      finishing,
      flat,
    ]);
    // A loop
    tree('demo site, loop', 'demo', null, [
      { ...workshop, feed: { ...(flat.feed as object), boardId: flat.id, wayId: flat.ways[1].id } as BoardFeed },
      finishing,
      flat,
    ]);
  }

  // The bench boards: bench-board.ts's 36 ways and site-resize.ts's site of 10 boards
  {
    const all = demoBoardWays(demo.WORKSHOP_BOARD as never, 'bb');
    const outgoing = all.filter((w) => w.device.kind !== 'main-switch');
    const ways = placed([all[0], ...outgoing, ...outgoing.map((w) => ({ ...w, id: uid('bb2') }))]);
    const tb = treeBoard({ ...demo.WORKSHOP_BOARD.settings, enclosureModules: 72 }, ways, { from: 'origin' });
    add('bench board', () => sizeTree('bench', null, [tb]));
    add('bench board as the engine sees it', () => sizeBoard(parseBoardInput({ ...tb, ways: tb.ways } as never)));
  }
  const siteBoards = (): TreeBoardLike[] => {
    const settings = { ...BENCH_SETTINGS, name: 'Bench main board' } as BoardSettings;
    const mainWays = placed([
      ...Array.from({ length: 9 }, (_, i) => ({ ...subMainWay(i), id: uid('sm') })),
      ...Array.from({ length: 27 }, (_, i) => ({ ...finalWay(i), id: uid('mw') })),
    ]);
    const main = treeBoard(settings, mainWays, { from: 'origin' });
    const subs = Array.from({ length: 9 }, (_, b) =>
      treeBoard(
        { ...settings, name: `Bench sub-board ${b + 1}` },
        placed(Array.from({ length: 36 }, (_, i) => ({ ...finalWay(i), id: uid('sw') }))),
        {
          from: 'way',
          boardId: main.id,
          wayId: mainWays[b].id,
          designCurrentOverride: null,
          upstreamRcdTimeDelayed: false,
        },
      ),
    );
    return [main, ...subs];
  };
  {
    const boards = siteBoards();
    for (const ze of [0.2, 0.35, 0.8, 1.6]) {
      tree(
        `bench site Ze ${ze}`,
        'bench',
        { earthing: 'TN-C-S', uoV: 230, zeOhm: ze, pfcKa: 6, source: 'public' } as unknown as SiteOrigin,
        boards,
      );
    }
    tree('bench site, no origin', 'bench', null, boards);
    tree(
      'bench site, TT',
      'bench',
      { earthing: 'TT', uoV: 230, zeOhm: 21, pfcKa: 1, source: 'public' } as unknown as SiteOrigin,
      boards,
    );
  }

  // Pseudo-random boards, alone and as trees
  const r = rng(20261203);
  for (let i = 0; i < 400; i++) {
    const settings = randomSettings(r, `Random board ${i}`);
    const n = Math.floor(r.num(1, 40));
    const ways = placed(Array.from({ length: n }, () => randomWay(r, settings.phases, `rb${i}`)));
    const tb = treeBoard(settings, ways, { from: 'origin' });
    add(`random board ${i}`, () => sizeTree('random', null, [tb]));
  }
  for (let t = 0; t < 120; t++) {
    const count = Math.floor(r.num(2, 7));
    const boards: TreeBoardLike[] = [];
    for (let b = 0; b < count; b++) {
      const settings = randomSettings(r, `Tree ${t} board ${b}`);
      const n = Math.floor(r.num(2, 24));
      const ways = placed(Array.from({ length: n }, () => randomWay(r, settings.phases, `t${t}b${b}`)));
      let feed: BoardFeed = { from: 'origin' };
      if (b > 0 && r.chance(0.85)) {
        const parent = boards[Math.floor(r.num(0, boards.length))];
        // A sub-main way on the parent for it (sometimes an unfit way, to be cut)
        const phases: 1 | 3 = settings.phases === 3 && parent.phases === 3 ? 3 : 1;
        const kind = r.pick(PROTECTIVE_DEVICE_KINDS);
        const way = {
          id: uid('feed'),
          device: randomDevice(r, kind, phases, parent.phases),
          circuit: r.chance(0.93) ? randomCircuit(r, phases, r.chance(0.95) ? 'distribution' : 'fixed') : null,
        };
        parent.ways = placed([...parent.ways, way]);
        feed = {
          from: 'way',
          boardId: parent.id,
          wayId: way.id,
          designCurrentOverride: r.chance(0.2) ? { amps: r.num(5, 80), reason: 'Measured' } : null,
          upstreamRcdTimeDelayed: r.chance(0.2),
        };
      }
      boards.push(treeBoard(settings, ways, feed));
    }
    const origin = r.chance(0.7) ? (randomSupply(r) as unknown as SiteOrigin) : null;
    tree(`random tree ${t}`, 'random', origin, boards);
  }
  // Single circuits with every option, as sizeCircuit takes them
  for (let i = 0; i < 600; i++) {
    const phases: 1 | 3 = r.chance(0.3) ? 3 : 1;
    const kind = r.pick(PROTECTIVE_DEVICE_KINDS);
    const d = randomDevice(r, kind, phases, phases);
    const device = {
      kind,
      ratingA: d.ratingA,
      curve: d.curve,
      rcdMa: kind === 'rcbo' ? d.rcdMa : r.chance(0.5) ? 30 : null,
    };
    if (d.breakingKa !== undefined) Object.assign(device, { breakingKa: d.breakingKa });
    const raw = { supply: randomSupply(r), circuit: { ...randomCircuit(r, phases), device } };
    add(`circuit ${i}`, () => sizeCircuit(parseCircuitInput(raw)));
  }

  const body = out.map(([k, v]) => `${JSON.stringify(k)}\t${v}`).join('\n') + '\n';
  const digest = createHash('sha256').update(body).digest('hex');
  if (mode === 'write') {
    writeFileSync(file, body);
    console.log(`${out.length} answers written to ${file} (sha256 ${digest.slice(0, 16)})`);
    return;
  }
  // Compared answer by answer (by name): an answer added to this script since the file was
  // written is counted, not compared
  const split = (t: string) =>
    new Map(
      t
        .split('\n')
        .filter(Boolean)
        .map((l) => [l.slice(0, l.indexOf('\t')), l.slice(l.indexOf('\t') + 1)] as [string, string]),
    );
  const before = split(readFileSync(file, 'utf8'));
  const after = split(body);
  let differ = 0;
  let compared = 0;
  for (const [name, a] of before) {
    const b = after.get(name);
    if (b === undefined) {
      differ++;
      console.log(`missing now: ${name}`);
      continue;
    }
    compared++;
    if (a === b) continue;
    differ++;
    if (differ <= 3) {
      let at = 0;
      while (at < a.length && a[at] === b[at]) at++;
      console.log(`differs: ${name} at character ${at}`);
      console.log(`  before …${a.slice(Math.max(0, at - 80), at + 80)}`);
      console.log(`  after  …${b.slice(Math.max(0, at - 80), at + 80)}`);
    }
  }
  const added = [...after.keys()].filter((k) => !before.has(k)).length;
  console.log(
    differ
      ? `${differ} of ${before.size} answers differ or are missing`
      : `all ${compared} answers of the file identical, byte for byte${added ? ` (${added} answers new since, not compared)` : ''}`,
  );
  if (differ) process.exitCode = 1;
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
