import type { CableKind, Method } from '../types';
import { ARMOURED_4E4 } from './armoured-4e4';
import { MULTICORE_4D2 } from './multicore-4d2';
import { SINGLE_CORE_4D1 } from './single-core-4d1';
import { TWIN_AND_EARTH_4D5 } from './twin-and-earth-4d5';

/** One usable row: a size, its tabulated current for a method and column, and its mV/A/m. */
export interface CableRowData {
  csaMm2: number;
  itA: number;
  mvAm: number;
  /** cpc of the cable's construction (twin and earth only). */
  constructionCpcMm2: number | null;
}

/** Facts about each cable kind that do not depend on size. */
export const CABLE_PROPERTIES = {
  'te-70': { label: 'flat twin and earth 70 °C', maxTempC: 70, table: TWIN_AND_EARTH_4D5.source },
  'single-pvc-70': { label: 'single-core 70 °C', maxTempC: 70, table: SINGLE_CORE_4D1.source },
  'multi-pvc-70': { label: 'multicore 70 °C', maxTempC: 70, table: MULTICORE_4D2.source },
  'swa-xlpe-90': { label: 'armoured multicore 90 °C', maxTempC: 90, table: ARMOURED_4E4.source },
} as const satisfies Record<CableKind, { label: string; maxTempC: 70 | 90; table: string }>;

const METHODS_BY_CABLE = {
  'te-70': ['100', '101', '102', '103', 'A', 'C'],
  'single-pvc-70': ['A', 'B', 'C'],
  'multi-pvc-70': ['A', 'B', 'C', 'E'],
  'swa-xlpe-90': ['C', 'D', 'E'],
} as const satisfies Record<CableKind, readonly Method[]>;

/**
 * Installation methods that the tables give for a cable. Method D is only for armoured
 * cable (direct in the ground or in ducts in the ground, Table 4E4A column D).
 */
export function methodsFor(cable: CableKind): readonly Method[] {
  return METHODS_BY_CABLE[cable];
}

/**
 * mV/A/m of each size: the single tabulated value up to 16 mm², and above it the impedance
 * z = √(r² + x²) from the table's r and x (BS 7671 Appendix 4: the z column, never r alone,
 * unless the load's power factor is used to combine r and x).
 */
function impedanceColumn(mv: readonly number[], rx: readonly (readonly [number, number])[] | undefined): number[] {
  if (!rx) return [...mv];
  const first = mv.length - rx.length;
  return mv.map((v, i) => (i < first ? v : Math.hypot(rx[i - first][0], rx[i - first][1])));
}

function build(
  sizes: readonly number[],
  it: readonly number[],
  mv: readonly number[],
  cpc: readonly number[] | null,
): readonly CableRowData[] {
  return sizes.map((csaMm2, i) => ({
    csaMm2,
    itA: it[i],
    mvAm: mv[i],
    constructionCpcMm2: cpc ? cpc[i] : null,
  }));
}

// Precomputed at load time so sizing a circuit is a map lookup, not a table walk.
const ROWS = new Map<string, readonly CableRowData[]>();
for (const [method, it] of Object.entries(TWIN_AND_EARTH_4D5.itA)) {
  const t = TWIN_AND_EARTH_4D5;
  ROWS.set(`te-70|${method}|1`, build(t.sizesMm2, it, t.mvAm1, t.cpcMm2));
}
const multiTables = [
  ['single-pvc-70', SINGLE_CORE_4D1],
  ['multi-pvc-70', MULTICORE_4D2],
  ['swa-xlpe-90', ARMOURED_4E4],
] as const;
for (const [cable, t] of multiTables) {
  const mv1 = impedanceColumn(t.mvAm1, 'rx1' in t ? t.rx1 : undefined);
  const mv3 = impedanceColumn(t.mvAm3, 'rx3' in t ? t.rx3 : undefined);
  for (const [method, cols] of Object.entries(t.itA)) {
    ROWS.set(`${cable}|${method}|1`, build(t.sizesMm2, cols[2], mv1, null));
    ROWS.set(`${cable}|${method}|3`, build(t.sizesMm2, cols[3], mv3, null));
  }
}

/**
 * Rows of the cable's table for a method and number of phases, ascending by size, or null
 * when the tables have no such column (method not valid for the cable, or twin and earth
 * used three-phase).
 */
export function cableRows(cable: CableKind, method: Method, phases: 1 | 3): readonly CableRowData[] | null {
  return ROWS.get(`${cable}|${method}|${phases}`) ?? null;
}
