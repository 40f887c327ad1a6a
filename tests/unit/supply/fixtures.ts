import type { SiteBoardInput, SiteTreeInput } from '@/lib/supply';

// Invented trees of the demo scenario (Hollin Lane Joinery's workshop and the flat above it).
// Every sub-main's cable size is fixed so the carried values can be worked by hand.

const circuitBase = { method: 'C', ambientC: 30, insulationMm: 0, concealedInWall: false } as const;

/** A single-phase fixed load on a B-curve MCB in 2.5 mm² twin and earth, clipped direct. */
export function fixedWay(id: string, watts: number, ratingA: number, lengthM: number, phase?: 'L1' | 'L2' | 'L3') {
  return {
    id,
    device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA, ...(phase ? { phase } : {}) },
    circuit: {
      ...circuitBase,
      phases: 1,
      use: 'fixed',
      serves: `Load of ${watts} W`,
      load: { kind: 'known', watts, powerFactor: 1 },
      lengthM,
      cable: 'te-70',
      csaMm2: 2.5,
    },
  } as const;
}

const mainSwitch = (ratingA: number) => ({ kind: 'main-switch', ratingA }) as const;

/**
 * Two levels, single-phase, TN-C-S (Ze 0.35 Ω, 1.5 kA at the origin): Workshop DB1 feeds the
 * Finishing room board from way 1 (MCB C32, 10 mm² armoured 3-core, a spare core as cpc, 20 m,
 * clipped direct). The finishing room has a 2300 W load (B16) and a 1150 W load (B10).
 */
export function twoLevel(): SiteTreeInput {
  return {
    siteId: 'hollin-lane',
    origin: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
    boards: [
      {
        id: 'db1',
        name: 'Workshop DB1',
        siteId: 'hollin-lane',
        feed: { from: 'origin' },
        board: {
          phases: 1,
          enclosureModules: 12,
          incoming: mainSwitch(100),
          ways: [
            {
              id: 'w-sub',
              device: { kind: 'mcb', poles: 1, modules: 1, curve: 'C', ratingA: 32 },
              circuit: {
                ...circuitBase,
                phases: 1,
                use: 'distribution',
                serves: 'Finishing room board',
                load: { kind: 'known', watts: 0, powerFactor: 1 },
                lengthM: 20,
                cable: 'swa-xlpe-90',
                csaMm2: 10,
              },
            },
            fixedWay('w-bench', 920, 10, 8),
          ],
        },
      },
      {
        id: 'fin',
        name: 'Finishing room board',
        siteId: 'hollin-lane',
        feed: { from: 'way', boardId: 'db1', wayId: 'w-sub' },
        board: {
          phases: 1,
          enclosureModules: 8,
          incoming: mainSwitch(63),
          ways: [fixedWay('f-spray', 2300, 16, 10), fixedWay('f-fan', 1150, 10, 6)],
        },
      },
    ],
  } as SiteTreeInput;
}

/**
 * Three levels, TN-S (Ze 0.2 Ω, 6 kA at the origin): Workshop DB1 (three-phase) feeds the
 * Machine shop board (three-phase) from a 63 A BS 88-2 fuse over 16 mm² four-core armoured
 * cable, the armour as cpc, 30 m; the Machine shop board feeds the Finishing room board
 * (single-phase) from an MCB C20 on L3 over 4 mm² twin and earth, 15 m.
 */
export function threeLevel(): SiteTreeInput {
  const site = 'hollin-lane';
  const boards: SiteBoardInput[] = [
    {
      id: 'db1',
      name: 'Workshop DB1',
      siteId: site,
      feed: { from: 'origin' },
      board: {
        phases: 3,
        enclosureModules: 18,
        incoming: mainSwitch(125),
        ways: [
          {
            id: 'w-ms',
            device: { kind: 'fuse-bs88-2', poles: 3, modules: 3, ratingA: 63 },
            circuit: {
              ...circuitBase,
              phases: 3,
              use: 'distribution',
              serves: 'Machine shop board',
              load: { kind: 'known', watts: 0, powerFactor: 1 },
              lengthM: 30,
              cable: 'swa-xlpe-90',
              csaMm2: 16,
            },
          },
        ],
      },
    },
    {
      id: 'ms',
      name: 'Machine shop board',
      siteId: site,
      feed: { from: 'way', boardId: 'db1', wayId: 'w-ms' },
      board: {
        phases: 3,
        enclosureModules: 18,
        incoming: mainSwitch(100),
        ways: [
          {
            id: 'm-saw',
            device: { kind: 'fuse-bs88-2', poles: 3, modules: 3, ratingA: 16 },
            circuit: {
              ...circuitBase,
              phases: 3,
              use: 'fixed',
              serves: 'Panel saw',
              loadType: 'motor',
              load: { kind: 'known', watts: 4000, powerFactor: 0.85 },
              lengthM: 12,
              cable: 'multi-pvc-70',
              csaMm2: 2.5,
            },
          },
          { id: 'm-b1', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null },
          { id: 'm-b2', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null },
          {
            id: 'm-fin',
            device: { kind: 'mcb', poles: 1, modules: 1, curve: 'C', ratingA: 20, phase: 'L3' },
            circuit: {
              ...circuitBase,
              phases: 1,
              use: 'distribution',
              serves: 'Finishing room board',
              load: { kind: 'known', watts: 0, powerFactor: 1 },
              lengthM: 15,
              cable: 'te-70',
              csaMm2: 4,
            },
          },
        ],
      },
    },
    {
      id: 'fin',
      name: 'Finishing room board',
      siteId: site,
      feed: { from: 'way', boardId: 'ms', wayId: 'm-fin' },
      board: {
        phases: 1,
        enclosureModules: 6,
        incoming: mainSwitch(63),
        ways: [fixedWay('f-spray', 2300, 16, 10)],
      },
    },
  ] as SiteBoardInput[];
  return {
    siteId: site,
    origin: { earthing: 'TN-S', uoV: 230, zeOhm: 0.2, pfcKa: 6, source: 'public' },
    boards,
  };
}
