/**
 * The bench site's boards, shared by `bench:site` (site-resize.ts), the in-process re-size
 * (site-tree-cpu.ts) and the golden sizing check (sizing-golden.ts): a main board of 9 sub-mains
 * and 27 final circuits feeding 9 boards of 36 final circuits each, single-phase. Invented.
 */

/** The origin every bench board starts from. */
export const BENCH_ORIGIN = { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.2, pfcKa: 6, source: 'public' } as const;

/** The settings of every bench board but its name. */
export const BENCH_SETTINGS = {
  location: '',
  phases: 1,
  supply: { ...BENCH_ORIGIN },
  incoming: { kind: 'main-switch', ratingA: 100 },
  enclosureModules: 48,
  rails: 1,
  dwelling: false,
} as const;

const base = { method: 'C', ambientC: 30, insulationMm: 0, concealedInWall: false, phases: 1, cable: 'te-70' } as const;

/** A final circuit: a fixed load on a B-curve MCB in 2.5 mm² twin and earth. */
export const finalWay = (i: number) => ({
  device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 16 },
  circuit: {
    ...base,
    use: 'fixed',
    serves: `Load ${i + 1}`,
    load: { kind: 'known', watts: 400 + (i % 5) * 100, powerFactor: 1 },
    lengthM: 8 + (i % 7) * 2,
    csaMm2: 2.5,
  },
});

/** A sub-main: an MCB C63 over 16 mm² armoured cable, 25 m. */
export const subMainWay = (i: number) => ({
  device: { kind: 'mcb', poles: 1, modules: 1, curve: 'C', ratingA: 63 },
  circuit: {
    ...base,
    cable: 'swa-xlpe-90',
    use: 'distribution',
    serves: `Sub-board ${i + 1}`,
    load: { kind: 'known', watts: 0, powerFactor: 1 },
    lengthM: 25,
    csaMm2: 16,
  },
});
