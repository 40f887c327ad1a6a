/**
 * Throughput of the sizing engine on one core: circuits sized per second over a realistic mix
 * (lighting, rings, radials, showers, cookers, three-phase motors, submains, TT outbuildings).
 * Inputs are validated once up front with parseCircuitInput (the engine then knows them and does
 * not parse them again; any other input it validates itself); the loop measures sizeCircuit.
 * Run: npx tsx scripts/bench/sizing-engine.ts
 */
import { type CircuitInput, parseCircuitInput, sizeCircuit } from '@/lib/sizing';

const TN = { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' };
const TT = { earthing: 'TT', uoV: 230, zeOhm: 40, pfcKa: 1, source: 'public' };
const te = { cable: 'te-70', ambientC: 30, csaMm2: null, phases: 1 };

const raw: unknown[] = [
  {
    supply: TN,
    circuit: {
      ...te,
      use: 'lighting',
      method: '100',
      lengthM: 25,
      load: { kind: 'known', watts: 600, powerFactor: 1 },
      device: { kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 },
    },
  },
  {
    supply: TN,
    circuit: {
      ...te,
      use: 'sockets',
      method: 'C',
      lengthM: 55,
      load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 80 },
      device: { kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 },
    },
  },
  {
    supply: TN,
    circuit: {
      ...te,
      use: 'sockets',
      method: '103',
      lengthM: 18,
      load: { kind: 'socket-arrangement', arrangement: 'radial-20', floorAreaM2: 30 },
      device: { kind: 'mcb', curve: 'B', ratingA: null, rcdMa: 30 },
    },
  },
  {
    supply: TN,
    circuit: {
      ...te,
      use: 'fixed',
      method: 'C',
      lengthM: 14,
      load: { kind: 'known', watts: 9500, powerFactor: 1 },
      device: { kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 },
    },
  },
  {
    supply: TN,
    circuit: {
      ...te,
      use: 'fixed',
      method: 'A',
      lengthM: 9,
      insulationMm: 150,
      load: { kind: 'known', watts: 7000, powerFactor: 1 },
      device: { kind: 'mcb', curve: 'B', ratingA: null },
    },
  },
  {
    supply: TN,
    circuit: {
      cable: 'multi-pvc-70',
      phases: 3,
      use: 'fixed',
      method: 'C',
      ambientC: 35,
      csaMm2: null,
      grouping: { circuits: 3, arrangement: 'bunched' },
      lengthM: 30,
      load: { kind: 'known', watts: 5500, powerFactor: 0.85 },
      device: { kind: 'mcb', curve: 'C', ratingA: null },
    },
  },
  {
    supply: TN,
    circuit: {
      cable: 'single-pvc-70',
      phases: 3,
      use: 'fixed',
      method: 'B',
      ambientC: 30,
      csaMm2: null,
      lengthM: 40,
      load: { kind: 'known', watts: 15000, powerFactor: 0.9 },
      device: { kind: 'mcb', curve: 'D', ratingA: null },
    },
  },
  {
    supply: TN,
    circuit: {
      cable: 'swa-xlpe-90',
      phases: 1,
      use: 'distribution',
      method: 'D',
      ambientC: 15,
      csaMm2: null,
      lengthM: 45,
      load: { kind: 'known', watts: 12000, powerFactor: 1 },
      device: { kind: 'fuse-bs88-2', ratingA: null },
    },
  },
  {
    supply: TN,
    circuit: {
      cable: 'swa-xlpe-90',
      phases: 3,
      use: 'distribution',
      method: 'E',
      ambientC: 30,
      csaMm2: 16,
      lengthM: 80,
      load: { kind: 'known', watts: 40000, powerFactor: 0.9 },
      device: { kind: 'fuse-bs88-2', ratingA: 80 },
    },
  },
  {
    supply: TT,
    circuit: {
      ...te,
      use: 'sockets',
      method: 'C',
      lengthM: 30,
      load: { kind: 'socket-arrangement', arrangement: 'radial-32', floorAreaM2: 20 },
      device: { kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 },
    },
  },
  {
    supply: TN,
    circuit: {
      ...te,
      use: 'sockets',
      method: 'C',
      lengthM: 60,
      load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 70 },
      device: { kind: 'fuse-bs3036', ratingA: null, breakingKa: 2, rcdMa: 30 },
    },
  },
  {
    supply: TN,
    circuit: {
      ...te,
      use: 'fixed',
      method: '102',
      lengthM: 12,
      load: { kind: 'known', watts: 7000, powerFactor: 1 },
      device: { kind: 'fuse-bs88-3', ratingA: null },
    },
  },
];
const inputs: CircuitInput[] = raw.map((r) => parseCircuitInput(r));

function run(count: number): number {
  let sink = 0;
  for (let i = 0; i < count; i++) sink += sizeCircuit(inputs[i % inputs.length]).ibA;
  return sink;
}

// Warm-up so the JIT has compiled the hot paths.
run(200_000);

// Measure for at least 2 s.
let done = 0;
const start = process.hrtime.bigint();
let elapsedS = 0;
while (elapsedS < 2) {
  run(50_000);
  done += 50_000;
  elapsedS = Number(process.hrtime.bigint() - start) / 1e9;
}
const perSecond = done / elapsedS;
console.log(
  `sizing engine: ${Math.round(perSecond).toLocaleString('en-GB')} circuits/s ` +
    `(${done.toLocaleString('en-GB')} circuits in ${elapsedS.toFixed(2)} s, ${inputs.length}-circuit mix, one core)`,
);
console.log(perSecond >= 200_000 ? 'target ≥ 200,000 circuits/s: met' : 'target ≥ 200,000 circuits/s: NOT met');
