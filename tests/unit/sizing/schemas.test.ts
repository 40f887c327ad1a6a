import { describe, expect, it } from 'vitest';

import { boardInputSchema, circuitInputSchema, circuitSpecSchema, sizeBoard } from '@/lib/sizing';

import { FLAT_SUPPLY } from './helpers';

const good = {
  supply: FLAT_SUPPLY,
  circuit: {
    phases: 1,
    use: 'fixed',
    load: { kind: 'known', watts: 3000, powerFactor: 1 },
    lengthM: 10,
    cable: 'te-70',
    method: 'C',
    ambientC: 30,
    csaMm2: null,
    device: { kind: 'mcb', curve: 'B', ratingA: null, breakingKa: 6 },
  },
};

/** Paths of the issues for a bad input, joined with dots. */
function issuePaths(input: unknown): string[] {
  const r = circuitInputSchema.safeParse(input);
  expect(r.success).toBe(false);
  return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
}

describe('circuit input schema', () => {
  it('accepts a good circuit and fills defaults', () => {
    const r = circuitInputSchema.parse(good);
    expect(r.circuit.grouping).toEqual({ circuits: 1, arrangement: 'bunched' });
    expect(r.circuit.insulationMm).toBe(0);
    expect(r.circuit.concealedInWall).toBe(false);
  });
  it.each([
    ['circuit.lengthM', { lengthM: 0 }],
    ['circuit.lengthM', { lengthM: 2500 }],
    ['circuit.ambientC', { ambientC: 120 }],
    ['circuit.load.powerFactor', { load: { kind: 'known', watts: 100, powerFactor: 1.2 } }],
    ['circuit.load.watts', { load: { kind: 'known', watts: -1, powerFactor: 1 } }],
    ['circuit.grouping.circuits', { grouping: { circuits: 2.5, arrangement: 'bunched' } }],
    ['circuit.csaMm2', { csaMm2: 3 }],
    ['circuit.device.ratingA', { device: { kind: 'mcb', curve: 'B', ratingA: 17 } }],
    ['circuit.device.curve', { device: { kind: 'mcb', ratingA: 16 } }],
    ['circuit.device.rcdMa', { device: { kind: 'rcbo', curve: 'B', ratingA: 16 } }],
    ['circuit.use', { load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 50 } }],
    ['circuit.serves', { serves: 'x'.repeat(121) }],
    ['circuit', { colour: 'red' }],
  ])('rejects bad %s', (path, patch) => {
    expect(issuePaths({ ...good, circuit: { ...good.circuit, ...patch } })).toContain(path);
  });
  it('rejects a bad supply field with its path', () => {
    expect(issuePaths({ ...good, supply: { ...FLAT_SUPPLY, earthing: 'IT' } })).toContain('supply.earthing');
    expect(issuePaths({ ...good, supply: { ...FLAT_SUPPLY, zeOhm: -1 } })).toContain('supply.zeOhm');
  });
  it('the spec schema (for the way form) has no device', () => {
    const { device: _device, ...spec } = good.circuit;
    expect(circuitSpecSchema.safeParse(spec).success).toBe(true);
    expect(circuitSpecSchema.safeParse(good.circuit).success).toBe(false);
  });
});

describe('board input schema', () => {
  const board = {
    supply: FLAT_SUPPLY,
    phases: 1,
    enclosureModules: 10,
    incoming: { kind: 'main-switch', ratingA: 100 },
    ways: [
      { id: 'a', device: { kind: 'main-switch', poles: 2, modules: 2 }, circuit: null },
      { id: 'b', device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 16 }, circuit: null },
    ],
  };
  it('accepts a board', () => {
    expect(boardInputSchema.safeParse(board).success).toBe(true);
  });
  it('rejects duplicate ids, a circuit on a main switch and an RCD without mA, by path', () => {
    const { device: _d, ...spec } = good.circuit;
    const bad = {
      ...board,
      ways: [
        { id: 'a', device: { kind: 'main-switch', poles: 2, modules: 2 }, circuit: spec },
        { id: 'a', device: { kind: 'rcd', poles: 2, modules: 2 }, circuit: null },
      ],
    };
    const r = boardInputSchema.safeParse(bad);
    expect(r.success).toBe(false);
    const paths = r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['ways.0.circuit', 'ways.1.id', 'ways.1.device.rcdMa']));
  });
});

describe('power factor (a counterexample fast-check found)', () => {
  const supply = { earthing: 'TN-S', uoV: 100, zeOhm: 0, pfcKa: 0, source: 'public' };
  const circuit = (powerFactor: number) => ({
    phases: 1,
    use: 'lighting',
    load: { kind: 'known', watts: 1, powerFactor },
    lengthM: 5,
    cable: 'te-70',
    method: 'A',
    ambientC: 30,
    csaMm2: null,
  });
  const board = (powerFactor: number) => ({
    supply,
    phases: 1,
    enclosureModules: 4,
    incoming: { kind: 'main-switch', ratingA: 100 },
    ways: [
      {
        id: 'w',
        device: { kind: 'rcbo', poles: 1, modules: 1, curve: 'B', rcdMa: 30, ratingA: null },
        circuit: circuit(powerFactor),
      },
    ],
  });

  it('a power factor next to zero is refused: its design current would be infinite', () => {
    const parsed = boardInputSchema.safeParse(board(5e-324));
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0].path.join('.')).toBe('ways.0.circuit.load.powerFactor');
  });

  it('the smallest accepted power factor still gives a finite demand', () => {
    const out = sizeBoard(boardInputSchema.parse(board(0.05)));
    // Ib = 1 W / (100 V × 0.05) = 0.2 A
    expect(out.ways[0].result!.ibA).toBeCloseTo(0.2, 9);
    expect(Number.isFinite(out.summary.maxDemandA)).toBe(true);
  });
});
