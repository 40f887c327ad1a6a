import { z } from 'zod';

import { deviceKindName } from '../names';

import { CONDUCTOR_SIZES_MM2 } from './tables/conductor-resistance';
import { RCD_SENSITIVITIES_MA, STANDARD_RATINGS_A } from './tables/ratings';
import {
  ARMOURED_CPC_KINDS,
  CABLE_KINDS,
  CIRCUIT_USES,
  CURVES,
  EARTHING_SYSTEMS,
  LOAD_TYPES,
  METHODS,
  PROTECTIVE_DEVICE_KINDS,
  SOCKET_ARRANGEMENT_KINDS,
  SPECIAL_LOCATIONS,
} from './types';

const sizeList = CONDUCTOR_SIZES_MM2 as readonly number[];
const rcdList = RCD_SENSITIVITIES_MA as readonly number[];

const conductorSize = z
  .number()
  .refine((v) => sizeList.includes(v), { message: `must be one of ${sizeList.join(', ')} mm²` });

const rcdMa = z
  .number()
  .refine((v) => rcdList.includes(v), { message: `must be one of ${rcdList.join(', ')} mA` })
  .nullable();

/** The message for a Uo outside 100–277 V. */
export const UO_MESSAGE =
  'Uo is the line-to-earth voltage (230 V on a 230/400 V supply): enter 100–277 V, not the line-to-line voltage';

/** The supply at the board. */
export const supplySchema = z
  .object({
    earthing: z.enum(EARTHING_SYSTEMS),
    // Uo is line-to-earth: 230 V on a 230/400 V supply. 400 V is the line voltage of a
    // three-phase supply, which the engine derives; entering it would undersize by √3.
    uoV: z.number().min(100, UO_MESSAGE).max(277, UO_MESSAGE).default(230),
    zeOhm: z.number().min(0).max(2000),
    pfcKa: z.number().min(0).max(200),
    source: z.enum(['public', 'private']).default('public'),
    /**
     * Voltage drop already used between the origin and this board by the sub-mains above it,
     * % (absent: 0, a board fed from the origin). The final circuits' limit is the origin's
     * limit less this (BS 7671 Appendix 4 Table 4Ab: the limits run from the origin).
     */
    vdUsedPct: z.number().min(0).max(100).optional(),
  })
  .strict();
export type SupplyInput = z.infer<typeof supplySchema>;

const knownLoadSchema = z
  .object({
    kind: z.literal('known'),
    watts: z.number().min(0).max(2e6),
    // Real loads run from about 0.3 upwards; below 0.05 the design current is not meaningful.
    powerFactor: z.number().min(0.05, 'must be at least 0.05').max(1).default(1),
  })
  .strict();

const socketLoadSchema = z
  .object({
    kind: z.literal('socket-arrangement'),
    arrangement: z.enum(SOCKET_ARRANGEMENT_KINDS),
    floorAreaM2: z.number().min(0).max(100000),
    assumedA: z.number().gt(0).max(125).optional(),
  })
  .strict();

/** The protective device of a circuit; `ratingA: null` means "choose it". */
export const circuitDeviceSchema = z
  .object({
    kind: z.enum(PROTECTIVE_DEVICE_KINDS),
    curve: z.enum(CURVES).optional(),
    ratingA: z.number().nullable(),
    breakingKa: z.number().gt(0).max(200).optional(),
    rcdMa: rcdMa.optional(),
    /**
     * Rated conditional short-circuit current of the assembly the device sits in, kA, where
     * the board declares one (a consumer unit to BS EN 61439-3: 16 kA).
     */
    conditionalRatingKa: z.number().gt(0).max(200).nullable().optional(),
  })
  .strict()
  .superRefine((d, ctx) => {
    const list = STANDARD_RATINGS_A[d.kind] as readonly number[];
    if (d.ratingA !== null && !list.includes(d.ratingA)) {
      ctx.addIssue({
        code: 'custom',
        path: ['ratingA'],
        message: `must be null (choose) or a standard rating of ${deviceKindName(d.kind)}: ${list.join(', ')} A`,
      });
    }
    const breaker = d.kind === 'mcb' || d.kind === 'rcbo';
    if (breaker && !d.curve) {
      ctx.addIssue({ code: 'custom', path: ['curve'], message: 'a circuit-breaker needs a curve (B, C or D)' });
    }
    if (!breaker && d.curve) {
      ctx.addIssue({ code: 'custom', path: ['curve'], message: 'only circuit-breakers have a curve' });
    }
    if (d.kind === 'rcbo' && (d.rcdMa === undefined || d.rcdMa === null)) {
      ctx.addIssue({ code: 'custom', path: ['rcdMa'], message: 'an RCBO needs its residual current (mA)' });
    }
  });
export type CircuitDeviceInput = z.infer<typeof circuitDeviceSchema>;

// Fields of a circuit other than its device, shared by the single-circuit and board schemas.
const circuitSpecShape = {
  serves: z.string().max(120).optional(),
  phases: z.union([z.literal(1), z.literal(3)]),
  use: z.enum(CIRCUIT_USES),
  load: z.discriminatedUnion('kind', [knownLoadSchema, socketLoadSchema]),
  lengthM: z.number().gt(0).max(2000),
  cable: z.enum(CABLE_KINDS),
  method: z.enum(METHODS),
  ambientC: z.number().min(-30).max(90),
  grouping: z
    .object({
      circuits: z.number().int().min(1).max(40),
      arrangement: z.enum(['bunched', 'single-layer']),
      /**
       * Method D only: clearance between the cables (or ducts) in the ground, m; 0 or absent
       * = touching (Tables 4C2/4C3 take the column at or below it).
       */
      spacingM: z.number().min(0).max(10).optional(),
    })
    .strict()
    .default(() => ({ circuits: 1, arrangement: 'bunched' as const })),
  insulationMm: z.number().min(0).max(100000).default(0),
  csaMm2: conductorSize.nullable(),
  cpcMm2: conductorSize.nullable().optional(),
  concealedInWall: z.boolean().default(false),
  buried: z.boolean().optional(),
  /** Method D only: in ducts in the ground (grouping from Table 4C3) rather than direct (4C2). */
  inDucts: z.boolean().optional(),
  /** The kind of load, for diversity on a board (absent: from `use`; "other" for fixed loads). */
  loadType: z.enum(LOAD_TYPES).optional(),
  /** Where the circuit goes: a room with a bath or shower (Section 701), outdoors, or neither. */
  specialLocation: z.enum(SPECIAL_LOCATIONS).optional(),
  /**
   * Armoured cable only: its cpc is a spare core or the steel armour. Absent: a spare core where
   * the cable has one (3-core, single-phase), else the armour (4-core, three-phase).
   */
  armouredCpc: z.enum(ARMOURED_CPC_KINDS).optional(),
  /** Whether the circuit is in a dwelling (lighting RCD rule); lighting and sockets default to yes. */
  dwelling: z.boolean().optional(),
};

type SpecLike = {
  cable: string;
  armouredCpc?: string;
  phases: 1 | 3;
  use: string;
  load: { kind: string };
};

function refineSpec(c: SpecLike, ctx: z.RefinementCtx): void {
  if (c.armouredCpc !== undefined && c.cable !== 'swa-xlpe-90') {
    ctx.addIssue({
      code: 'custom',
      path: ['armouredCpc'],
      message: 'only an armoured cable has an armour to use as its cpc',
    });
  }
  if (c.load.kind === 'socket-arrangement') {
    if (c.use !== 'sockets') {
      ctx.addIssue({ code: 'custom', path: ['use'], message: 'a socket arrangement is a sockets circuit' });
    }
    if (c.phases !== 1) {
      ctx.addIssue({ code: 'custom', path: ['phases'], message: 'a socket arrangement is single-phase' });
    }
  }
}

/** A circuit without its device: what a way on a board holds (the device is the way's). */
export const circuitSpecSchema = z.object(circuitSpecShape).strict().superRefine(refineSpec);
export type CircuitSpec = z.infer<typeof circuitSpecSchema>;

/** A circuit with its device. */
export const circuitSchema = z
  .object({ ...circuitSpecShape, device: circuitDeviceSchema })
  .strict()
  .superRefine(refineSpec);
export type CircuitFields = z.infer<typeof circuitSchema>;

/** Input of `sizeCircuit`: the supply at the board and one circuit. */
export const circuitInputSchema = z.object({ supply: supplySchema, circuit: circuitSchema }).strict();
export type CircuitInput = z.infer<typeof circuitInputSchema>;

export const RAIL_DEVICE_KINDS = [
  'main-switch',
  'rcd',
  'mcb',
  'rcbo',
  'fuse-bs88-2',
  'fuse-bs88-3',
  'fuse-bs3036',
  'spd',
  'blank',
] as const;
export type RailDeviceKind = (typeof RAIL_DEVICE_KINDS)[number];

const PROTECTIVE = new Set<string>(PROTECTIVE_DEVICE_KINDS);

/** A device on the board's rail, in rail order. */
export const deviceOnRailSchema = z
  .object({
    kind: z.enum(RAIL_DEVICE_KINDS),
    poles: z.union([z.literal(1), z.literal(2), z.literal(3), z.literal(4)]),
    modules: z.number().int().min(1).max(4),
    curve: z.enum(CURVES).optional(),
    ratingA: z.number().gt(0).max(4000).nullable().optional(),
    rcdMa: rcdMa.optional(),
    rcdType: z.enum(['AC', 'A', 'F', 'B']).optional(),
    breakingKa: z.number().gt(0).max(200).optional(),
    phase: z.enum(['L1', 'L2', 'L3']).optional(),
  })
  .strict()
  .superRefine((d, ctx) => {
    if (PROTECTIVE.has(d.kind)) {
      const list = STANDARD_RATINGS_A[d.kind as keyof typeof STANDARD_RATINGS_A] as readonly number[];
      if (d.ratingA !== undefined && d.ratingA !== null && !list.includes(d.ratingA)) {
        ctx.addIssue({
          code: 'custom',
          path: ['ratingA'],
          message: `must be null (choose) or a standard rating of ${deviceKindName(d.kind)}: ${list.join(', ')} A`,
        });
      }
    }
    const breaker = d.kind === 'mcb' || d.kind === 'rcbo';
    if (breaker && !d.curve) {
      ctx.addIssue({ code: 'custom', path: ['curve'], message: 'a circuit-breaker needs a curve (B, C or D)' });
    }
    if (!breaker && d.curve) {
      ctx.addIssue({ code: 'custom', path: ['curve'], message: 'only circuit-breakers have a curve' });
    }
    if ((d.kind === 'rcd' || d.kind === 'rcbo') && (d.rcdMa === undefined || d.rcdMa === null)) {
      ctx.addIssue({
        code: 'custom',
        path: ['rcdMa'],
        message: `an ${deviceKindName(d.kind)} needs its residual current (mA)`,
      });
    }
  });
export type DeviceOnRail = z.infer<typeof deviceOnRailSchema>;

/** One way of a board: a device and, for a protective device, the circuit it feeds (null = spare). */
export const waySchema = z
  .object({
    id: z.string().min(1).max(64),
    device: deviceOnRailSchema,
    circuit: circuitSpecSchema.nullable(),
  })
  .strict();
/** A way as the engine sizes it; a board's way with its place on the rail is `WayInput` (lib/boards/schemas.ts). */
export type EngineWayInput = z.infer<typeof waySchema>;

/** Input of `sizeBoard`. */
export const boardInputSchema = z
  .object({
    supply: supplySchema,
    phases: z.union([z.literal(1), z.literal(3)]),
    enclosureModules: z.number().int().min(1).max(400),
    incoming: z
      .object({
        kind: z.enum(['main-switch', 'mcb', 'fuse-bs88-2', 'rcd']),
        ratingA: z.number().gt(0).max(4000),
        busbarRatingA: z.number().gt(0).max(6300).optional(),
        /** Residual current of an incoming RCD, mA (30 assumed when absent). */
        rcdMa: rcdMa.optional(),
      })
      .strict(),
    dwelling: z.boolean().optional(),
    /**
     * Rated conditional short-circuit current of the assembly, kA, where the board declares
     * one (a consumer unit to BS EN 61439-3: 16 kA); the breaking-capacity check uses it.
     */
    conditionalRatingKa: z.number().gt(0).max(200).nullable().optional(),
    ways: z.array(waySchema).max(200),
  })
  .strict()
  .superRefine((b, ctx) => {
    const seen = new Set<string>();
    b.ways.forEach((w, i) => {
      if (seen.has(w.id)) {
        ctx.addIssue({ code: 'custom', path: ['ways', i, 'id'], message: `duplicate way id "${w.id}"` });
      }
      seen.add(w.id);
      if (w.circuit && !PROTECTIVE.has(w.device.kind)) {
        ctx.addIssue({
          code: 'custom',
          path: ['ways', i, 'circuit'],
          message: `a ${deviceKindName(w.device.kind)} does not feed a circuit; use null`,
        });
      }
      if (w.circuit && w.circuit.phases === 3 && b.phases === 1) {
        ctx.addIssue({
          code: 'custom',
          path: ['ways', i, 'circuit', 'phases'],
          message: 'a three-phase circuit cannot be fed from a single-phase board',
        });
      }
    });
  });
export type BoardInput = z.infer<typeof boardInputSchema>;
