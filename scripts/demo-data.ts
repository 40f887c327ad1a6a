/**
 * The demo scenario, invented for Boardwright: Larchfield Electrical, a small contractor,
 * is wiring Hollin Lane Joinery, a joinery workshop with a three-phase board, and the
 * flat above it with a single-phase consumer unit. Every figure here is made up for the demo.
 */
import crypto from 'node:crypto';

import { layoutWays } from '@/lib/boards/layout';
import type { BoardSettings, WayInput } from '@/lib/boards/schemas';
import type { Role } from '@/models/user';

export const DEMO_ORG = 'Larchfield Electrical';
export const OTHER_ORG = 'Brookside Wiring Co';

export const DEMO_USERS: { email: string; name: string; role: Role; password: string }[] = [
  { email: 'admin@example.test', name: 'Maya Okafor', role: 'admin', password: 'admin-demo-2026' },
  { email: 'designer@example.test', name: 'Tom Reyes', role: 'designer', password: 'designer-demo-2026' },
  { email: 'inspector@example.test', name: 'Priya Lund', role: 'inspector', password: 'inspector-demo-2026' },
  { email: 'installer@example.test', name: 'Sam Kowalski', role: 'installer', password: 'installer-demo-2026' },
];

export const OTHER_USER = {
  email: 'admin@brookside.example.test',
  name: 'Ellis Brook',
  role: 'admin' as Role,
  password: 'brookside-demo-2026',
};

export const DEMO_SITE = {
  name: 'Hollin Lane Joinery',
  address: 'Unit 4, Hollin Lane Trading Estate',
  client: 'Hollin Lane Joinery Ltd',
};

type Way = Omit<WayInput, 'id' | 'rail' | 'position'>;
type Circuit = NonNullable<WayInput['circuit']>;

const mainSwitch = (poles: 2 | 4, ratingA: number): Way => ({
  device: { kind: 'main-switch', poles, modules: poles, ratingA },
  circuit: null,
});
const rcd = (poles: 2 | 4, ratingA: number, rcdMa: number): Way => ({
  device: { kind: 'rcd', poles, modules: poles, ratingA, rcdMa, rcdType: 'A' },
  circuit: null,
});
const spare = (): Way => ({ device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null });

const base = {
  ambientC: 30,
  grouping: { circuits: 1, arrangement: 'bunched' as const },
  insulationMm: 0,
  csaMm2: null,
  concealedInWall: false,
  buried: false,
};

function breaker(
  kind: 'mcb' | 'rcbo',
  curve: 'B' | 'C' | 'D',
  ratingA: number,
  circuit: Partial<Circuit> & Pick<Circuit, 'use' | 'load' | 'lengthM' | 'cable' | 'method'>,
  poles: 1 | 3 = 1,
): Way {
  return {
    device: {
      kind,
      poles,
      modules: poles,
      curve,
      ratingA,
      breakingKa: 6,
      ...(kind === 'rcbo' ? { rcdMa: 30, rcdType: 'A' as const } : {}),
    },
    circuit: { ...base, phases: poles === 3 ? 3 : 1, ...circuit } as Circuit,
  };
}

const known = (watts: number, powerFactor = 1) => ({ kind: 'known' as const, watts, powerFactor });

export const FLAT_BOARD: { settings: BoardSettings; ways: Way[] } = {
  settings: {
    name: 'Flat 1 consumer unit',
    location: 'First-floor flat, hall cupboard',
    phases: 1,
    supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.32, pfcKa: 2.1, source: 'public' },
    incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: 100 },
    enclosureModules: 18,
    rails: 1,
    dwelling: true,
    // A consumer unit to BS EN 61439-3 (its maker's declaration; invented for the demo)
    conditionalRatingKa: 16,
  },
  ways: [
    mainSwitch(2, 100),
    rcd(2, 63, 30),
    breaker('mcb', 'B', 32, {
      serves: 'Sockets: kitchen and utility (ring)',
      use: 'sockets',
      loadType: 'sockets',
      load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 18 },
      lengthM: 34,
      cable: 'te-70',
      method: 'C',
      concealedInWall: true,
    }),
    breaker('mcb', 'B', 32, {
      serves: 'Sockets: living room and bedrooms (ring)',
      use: 'sockets',
      loadType: 'sockets',
      load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 52 },
      lengthM: 58,
      cable: 'te-70',
      method: 'C',
      concealedInWall: true,
    }),
    breaker('mcb', 'B', 6, {
      serves: 'Lighting: kitchen, living room, hall',
      use: 'lighting',
      loadType: 'lighting',
      load: known(420, 0.9),
      lengthM: 26,
      cable: 'te-70',
      method: '101',
      insulationMm: 0,
    }),
    breaker('mcb', 'B', 16, {
      serves: 'Immersion heater, airing cupboard',
      use: 'fixed',
      loadType: 'water-heater',
      load: known(3000),
      lengthM: 9,
      cable: 'te-70',
      method: 'C',
      csaMm2: 2.5,
    }),
    rcd(2, 63, 30),
    breaker('mcb', 'B', 32, {
      serves: 'Cooker: oven and hob',
      use: 'fixed',
      loadType: 'cooker',
      load: known(6900),
      lengthM: 11,
      cable: 'te-70',
      method: 'C',
      csaMm2: 6,
    }),
    breaker('mcb', 'B', 6, {
      serves: 'Towel rail and extract fan, bathroom',
      use: 'fixed',
      loadType: 'other',
      specialLocation: 'bath-shower',
      load: known(450, 0.95),
      lengthM: 12,
      cable: 'te-70',
      method: '103',
    }),
    breaker('mcb', 'B', 6, {
      serves: 'Lighting: bedrooms and bathroom',
      use: 'lighting',
      loadType: 'lighting',
      specialLocation: 'bath-shower',
      load: known(300, 0.9),
      lengthM: 22,
      cable: 'te-70',
      method: '101',
    }),
    breaker('mcb', 'B', 6, {
      serves: 'Smoke and heat alarms',
      use: 'fixed',
      loadType: 'other',
      load: known(40),
      lengthM: 24,
      cable: 'te-70',
      method: '101',
    }),
    spare(),
  ],
};

const swa = { cable: 'swa-xlpe-90' as const, method: 'C' as const };

export const WORKSHOP_BOARD: { settings: BoardSettings; ways: Way[] } = {
  settings: {
    name: 'Workshop DB1',
    location: 'Machine shop, north wall by the roller door',
    phases: 3,
    supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.2, pfcKa: 5.5, source: 'public' },
    incoming: { kind: 'main-switch', ratingA: 125, busbarRatingA: 125 },
    enclosureModules: 36,
    rails: 1,
    dwelling: false,
  },
  ways: [
    mainSwitch(4, 125),
    breaker(
      'mcb',
      'C',
      20,
      { serves: 'Panel saw', use: 'fixed', loadType: 'motor', load: known(7500, 0.85), lengthM: 18, ...swa },
      3,
    ),
    breaker(
      'mcb',
      'C',
      16,
      { serves: 'Dust extractor', use: 'fixed', loadType: 'motor', load: known(5500, 0.85), lengthM: 26, ...swa },
      3,
    ),
    breaker(
      'mcb',
      'C',
      20,
      { serves: 'Spindle moulder', use: 'fixed', loadType: 'motor', load: known(7500, 0.85), lengthM: 14, ...swa },
      3,
    ),
    breaker('rcbo', 'B', 10, {
      serves: 'Lighting: machine shop',
      use: 'lighting',
      loadType: 'lighting',
      load: known(1400, 0.95),
      lengthM: 38,
      cable: 'single-pvc-70',
      method: 'B',
      grouping: { circuits: 3, arrangement: 'bunched' },
    }),
    breaker('rcbo', 'B', 6, {
      serves: 'Lighting: office, WC, store',
      use: 'lighting',
      loadType: 'lighting',
      load: known(450, 0.95),
      lengthM: 24,
      cable: 'single-pvc-70',
      method: 'B',
      grouping: { circuits: 3, arrangement: 'bunched' },
    }),
    breaker('rcbo', 'B', 6, {
      serves: 'Emergency lighting',
      use: 'lighting',
      loadType: 'lighting',
      load: known(120, 0.9),
      lengthM: 40,
      cable: 'single-pvc-70',
      method: 'B',
      grouping: { circuits: 3, arrangement: 'bunched' },
    }),
    breaker('rcbo', 'B', 20, {
      serves: 'Sockets: bench wall (radial)',
      use: 'sockets',
      loadType: 'sockets',
      load: { kind: 'socket-arrangement', arrangement: 'radial-20', floorAreaM2: 40 },
      lengthM: 28,
      cable: 'single-pvc-70',
      method: 'B',
      grouping: { circuits: 3, arrangement: 'bunched' },
    }),
    breaker('rcbo', 'B', 32, {
      serves: 'Sockets: office and mess room (radial)',
      use: 'sockets',
      loadType: 'sockets',
      load: { kind: 'socket-arrangement', arrangement: 'radial-32', floorAreaM2: 35 },
      lengthM: 22,
      cable: 'single-pvc-70',
      method: 'B',
      grouping: { circuits: 3, arrangement: 'bunched' },
    }),
    breaker('rcbo', 'B', 16, {
      serves: 'Water heater, mess room',
      use: 'fixed',
      loadType: 'water-heater',
      load: known(3000),
      lengthM: 16,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('mcb', 'C', 16, {
      serves: 'Compressor',
      use: 'fixed',
      loadType: 'motor',
      load: known(2200, 0.8),
      lengthM: 12,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('mcb', 'C', 16, {
      serves: 'Pillar drill and bench grinder',
      use: 'fixed',
      loadType: 'motor',
      load: known(1500, 0.8),
      lengthM: 15,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('mcb', 'C', 20, {
      serves: 'Spray booth extract fan',
      use: 'fixed',
      loadType: 'motor',
      load: known(1800, 0.85),
      lengthM: 20,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('rcbo', 'B', 16, {
      serves: 'Roller door motor',
      use: 'fixed',
      loadType: 'motor',
      load: known(750, 0.8),
      lengthM: 10,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('rcbo', 'B', 20, {
      serves: 'Office heater',
      use: 'fixed',
      loadType: 'other',
      load: known(3000),
      lengthM: 18,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('mcb', 'B', 6, {
      serves: 'Fire alarm panel',
      use: 'fixed',
      loadType: 'other',
      load: known(60),
      lengthM: 8,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    spare(),
    spare(),
    spare(),
  ],
};

/**
 * The demo site as one supply tree. Workshop DB1 is fed from the origin (its typed supply is the
 * site's origin); two of its spare ways become sub-mains: a three-pole MCB feeding the finishing
 * room's board over armoured cable, and a single-pole MCB (on the phase of its way) feeding the
 * flat's consumer unit upstairs. The flat's and the finishing room's supply values are then
 * carried down from the workshop, not typed. Lengths and loads are invented for the demo.
 */
export const WORKSHOP_SUB_MAINS = {
  finishing: breaker(
    'mcb',
    'C',
    40,
    {
      serves: 'Sub-main: finishing room board',
      use: 'distribution',
      loadType: 'other',
      load: known(0),
      lengthM: 32,
      cable: 'swa-xlpe-90',
      method: 'C',
      csaMm2: 10,
    },
    3,
  ),
  // A BS 88-2 fuse: a C-curve breaker of 80 A would not disconnect in time at the flat's Zdb
  flat: {
    device: { kind: 'fuse-bs88-2', poles: 1, modules: 1, ratingA: 80, breakingKa: 80 },
    circuit: {
      ...base,
      phases: 1,
      serves: 'Sub-main: flat 1 consumer unit',
      use: 'distribution',
      loadType: 'other',
      load: known(0),
      lengthM: 24,
      cable: 'swa-xlpe-90',
      method: 'C',
      csaMm2: 16,
    },
  } satisfies Way,
} as const;

/** Workshop DB1 as the demo site stores it: its last two spares became its sub-mains. */
export const WORKSHOP_SITE_BOARD: { settings: BoardSettings; ways: Way[] } = {
  // A larger main switch: the workshop now carries the flat and the finishing room as well
  settings: { ...WORKSHOP_BOARD.settings, incoming: { kind: 'main-switch', ratingA: 200, busbarRatingA: 200 } },
  // Its drawn main switch is the 200 A of its settings too (the first way of WORKSHOP_BOARD is the 125 A one)
  ways: [
    mainSwitch(4, 200),
    ...WORKSHOP_BOARD.ways.slice(1, -2),
    WORKSHOP_SUB_MAINS.finishing,
    WORKSHOP_SUB_MAINS.flat,
  ],
};

/** The finishing room's board, fed from Workshop DB1 (its supply values are carried down). */
export const FINISHING_BOARD: { settings: BoardSettings; ways: Way[] } = {
  settings: {
    name: 'Finishing room DB2',
    location: 'Finishing room, beside the spray booth door',
    phases: 3,
    // Kept only until the tree carries the values down from Workshop DB1
    supply: WORKSHOP_BOARD.settings.supply,
    incoming: { kind: 'main-switch', ratingA: 63, busbarRatingA: 100 },
    enclosureModules: 18,
    rails: 1,
    dwelling: false,
  },
  ways: [
    mainSwitch(4, 63),
    breaker(
      'mcb',
      'C',
      16,
      { serves: 'Spray booth extract', use: 'fixed', loadType: 'motor', load: known(4000, 0.85), lengthM: 9, ...swa },
      3,
    ),
    breaker('rcbo', 'B', 10, {
      serves: 'Lighting: finishing room',
      use: 'lighting',
      loadType: 'lighting',
      load: known(600, 0.95),
      lengthM: 18,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('rcbo', 'B', 20, {
      serves: 'Sockets: finishing benches (radial)',
      use: 'sockets',
      loadType: 'sockets',
      load: { kind: 'socket-arrangement', arrangement: 'radial-20', floorAreaM2: 30 },
      lengthM: 22,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    breaker('rcbo', 'B', 16, {
      serves: 'Drying cabinet heater',
      use: 'fixed',
      loadType: 'other',
      load: known(2000),
      lengthM: 12,
      cable: 'multi-pvc-70',
      method: 'C',
    }),
    spare(),
  ],
};

/**
 * The demo board's ways ready to store: fresh ids, places along one rail, and on a
 * three-phase board each single-pole device given the phase of its position.
 */
export function demoWays(demo: { settings: BoardSettings; ways: Way[] }): WayInput[] {
  // Copies, so that a caller changing a way never changes the demo itself
  const ways = demo.ways.map((w, position) => ({ ...structuredClone(w), id: crypto.randomUUID(), rail: 0, position }));
  const places = new Map(layoutWays(demo.settings.phases, ways).map((p) => [p.id, p]));
  return ways.map((w) => {
    const phase = demo.settings.phases === 3 && w.device.poles < 3 && places.get(w.id)?.phases[0];
    return phase ? { ...w, device: { ...w.device, phase } } : w;
  });
}

/** The demo account of one role. */
export function demoUser(role: Role) {
  return DEMO_USERS.find((u) => u.role === role)!;
}
