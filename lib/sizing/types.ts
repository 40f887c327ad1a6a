/**
 * Kinds of cable the engine sizes: flat twin and earth, 70 °C thermoplastic (BS 7671 Table 4D5);
 * single-core 70 °C thermoplastic in conduit or trunking (4D1A/B); non-armoured multicore 70 °C
 * thermoplastic (4D2A/B); armoured multicore, 90 °C thermosetting (4E4A/B).
 */
export const CABLE_KINDS = ['te-70', 'single-pvc-70', 'multi-pvc-70', 'swa-xlpe-90'] as const;
export type CableKind = (typeof CABLE_KINDS)[number];

/** Installation reference methods (BS 7671 Appendix 4, Table 4A2). */
export const METHODS = ['A', 'B', 'C', 'D', 'E', '100', '101', '102', '103'] as const;
export type Method = (typeof METHODS)[number];

export const EARTHING_SYSTEMS = ['TN-S', 'TN-C-S', 'TT'] as const;
export type Earthing = (typeof EARTHING_SYSTEMS)[number];

export const CIRCUIT_USES = ['lighting', 'sockets', 'fixed', 'distribution'] as const;
export type CircuitUse = (typeof CIRCUIT_USES)[number];

export const PROTECTIVE_DEVICE_KINDS = ['mcb', 'rcbo', 'fuse-bs88-2', 'fuse-bs88-3', 'fuse-bs3036'] as const;
export type ProtectiveDeviceKind = (typeof PROTECTIVE_DEVICE_KINDS)[number];

export const CURVES = ['B', 'C', 'D'] as const;
export type Curve = (typeof CURVES)[number];

export const SOCKET_ARRANGEMENT_KINDS = ['ring-32', 'radial-32', 'radial-20'] as const;
export type SocketArrangementKind = (typeof SOCKET_ARRANGEMENT_KINDS)[number];

/**
 * The kind of load a way feeds, chosen from a list (never guessed from the way's free text):
 * it picks the diversity allowance on the board. `shower` is an instantaneous water heater;
 * `water-heater` is a thermostatically controlled one (an immersion heater).
 */
export const LOAD_TYPES = [
  'lighting',
  'sockets',
  'cooker',
  'shower',
  'water-heater',
  'storage-heating',
  'ev-charger',
  'motor',
  'other',
] as const;
export type LoadType = (typeof LOAD_TYPES)[number];

/** Where a circuit goes, for the special-location rules of BS 7671 Part 7. */
export const SPECIAL_LOCATIONS = ['none', 'bath-shower', 'outdoors'] as const;
export type SpecialLocation = (typeof SPECIAL_LOCATIONS)[number];

/** The protective conductor of an armoured cable: a spare core of the cable, or its steel armour. */
export const ARMOURED_CPC_KINDS = ['spare-core', 'armour'] as const;
export type ArmouredCpc = (typeof ARMOURED_CPC_KINDS)[number];

/** One rule checked for a circuit. `reference` names the regulation or table behind it. */
export interface Check {
  code: string;
  ok: boolean;
  message: string;
  reference: string;
}

export type Verdict = 'passes' | 'near-limit' | 'fails';

/** Which table row the chosen (or fixed) cable size was read from. */
export interface TableRow {
  table: string;
  method: string;
  csaMm2: number;
  itA: number;
  mvAm: number;
}

/** Correction factors applied to the tabulated current. */
export interface Factors {
  /** Ambient temperature, Table 4B1; null when the ambient is above the table. */
  ca: number | null;
  /** Grouping, Table 4C1 (4C2 direct in the ground, 4C3 in ducts in the ground, for method D). */
  cg: number | null;
  /**
   * Thermal insulation, Table 52.2 (1 for methods 100–103 and for 0 mm). It derates the
   * method C rating: the run's tabulated current is min(It of its method, It of method C × Ci).
   */
  ci: number;
  /** 0.725 for a BS 3036 fuse, 0.9 buried in the ground, their product for both, else 1. */
  cc: number;
}

/**
 * The sizing of one circuit. Nothing is rounded; a number that cannot be computed (for
 * example because no cable size in the table carries the load) is null and a failed check
 * says why.
 */
export interface CircuitResult {
  ibA: number;
  inA: number | null;
  factors: Factors;
  requiredItA: number | null;
  csaMm2: number | null;
  cpcMm2: number | null;
  itA: number | null;
  izA: number | null;
  vdV: number | null;
  vdPct: number | null;
  vdLimitPct: number;
  r1r2Ohm: number | null;
  zsOhm: number | null;
  zsMaxOhm: number | null;
  faultCurrentA: number | null;
  cpcMinMm2: number | null;
  /** Maximum disconnection time required for this circuit, s (Table 41.1 / 411.3.2). */
  disconnectionTimeS: number;
  /** What the cpc is: the cable's own core(s), a spare core, or the steel armour of an armoured cable. */
  cpcKind: 'core' | 'spare-core' | 'armour';
  /** Time used in the adiabatic check, s (null when the energy came from a let-through figure or is unknown). */
  adiabaticTimeS: number | null;
  tableRow: TableRow | null;
  checks: Check[];
  verdict: Verdict;
  notes: string[];
}
