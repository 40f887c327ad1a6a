import { DISTRIBUTION_TIMES_S, FINAL_CIRCUIT_LIMITS_A, FINAL_CIRCUIT_TIMES_S } from './tables/disconnection';
import { K_VALUES } from './tables/k-values';
import { CLASS3_LET_THROUGH_A2S } from './tables/let-through';
import { BREAKER_TRIP_MULTIPLE, CMIN, FUSE_MAX_ZS_OHM } from './tables/max-zs';
import type { CableKind, CircuitUse, Curve, Earthing, ProtectiveDeviceKind } from './types';

/** The device facts the protection rules need. */
export interface DeviceFacts {
  kind: ProtectiveDeviceKind;
  curve: Curve | null;
  inA: number;
}

type FuseKind = keyof typeof FUSE_MAX_ZS_OHM;

function isBreaker(kind: ProtectiveDeviceKind): boolean {
  return kind === 'mcb' || kind === 'rcbo';
}

/**
 * Maximum disconnection time, s (BS 7671 411.3.2): final circuits up to 63 A with sockets
 * and up to 32 A otherwise take Table 41.1 (TN 0.4 s / TT 0.2 s at 230 V); distribution
 * circuits and larger final circuits 5 s (TN) / 1 s (TT).
 */
export function requiredDisconnectionTime(use: CircuitUse, inA: number, earthing: Earthing, uoV: number): number {
  const tt = earthing === 'TT';
  const limit = use === 'sockets' ? FINAL_CIRCUIT_LIMITS_A.sockets : FINAL_CIRCUIT_LIMITS_A.other;
  if (use === 'distribution' || inA > limit) return tt ? DISTRIBUTION_TIMES_S.tt : DISTRIBUTION_TIMES_S.tn;
  for (const row of FINAL_CIRCUIT_TIMES_S) if (uoV <= row.maxUoV) return tt ? row.tt : row.tn;
  return tt ? FINAL_CIRCUIT_TIMES_S[3].tt : FINAL_CIRCUIT_TIMES_S[3].tn;
}

/** Current that trips a breaker instantaneously, Ia = 5/10/20·In for curve B/C/D (BS EN 60898-1). */
export function breakerTripCurrent(curve: Curve, inA: number): number {
  return BREAKER_TRIP_MULTIPLE[curve] * inA;
}

/**
 * Current that disconnects a breaker within `timeS`: the instantaneous current 5/10/20·In
 * for 0.4 s; for 5 s a Type D breaker needs only 10·In (BS 7671:2018+A2:2022 Table 41.3,
 * 5 s column: D32 0.68 Ω), B and C are unchanged.
 */
export function breakerDisconnectionCurrent(curve: Curve, inA: number, timeS: number): number {
  return (curve === 'D' && timeS >= 5 ? TYPE_D_5S_MULTIPLE : BREAKER_TRIP_MULTIPLE[curve]) * inA;
}

/** Type D breakers at 5 s: Ia = 10·In (Table 41.3). */
const TYPE_D_5S_MULTIPLE = 10;

/**
 * Fuse current for a disconnection time column ('0.4' or '5'), derived from the tabulated
 * max Zs: Ia = Cmin·230 / Zs(table). Null where the table has no value.
 */
export function fuseOperatingCurrent(kind: FuseKind, inA: number, column: '0.4' | '5'): number | null {
  const zs = (FUSE_MAX_ZS_OHM[kind][column] as Record<number, number>)[inA];
  return zs === undefined ? null : (CMIN * 230) / zs;
}

/**
 * Maximum earth fault loop impedance Zs, Ω, for the device to disconnect in `timeS`.
 * Breakers: Cmin·Uo / Ia (BS 7671 Table 41.3 by formula; instantaneous within 0.1 s, so any
 * required time ≥ 0.1 s). Fuses: Cmin·Uo / Ia with Ia from Tables 41.2 (0.4 s) or 41.4 (5 s),
 * using the longest tabulated time not above the required time. Null when not tabulated.
 */
export function maxZs(device: DeviceFacts, timeS: number, uoV: number): number | null {
  if (isBreaker(device.kind)) {
    if (!device.curve || timeS < 0.1) return null;
    return (CMIN * uoV) / breakerDisconnectionCurrent(device.curve, device.inA, timeS);
  }
  const column = timeS >= 5 ? '5' : timeS >= 0.4 ? '0.4' : null;
  if (column === null) return null;
  const ia = fuseOperatingCurrent(device.kind as FuseKind, device.inA, column);
  return ia === null ? null : (CMIN * uoV) / ia;
}

/** Lower limit of the fuse time model, s: a half cycle; below it the fuse limits the energy. */
const FUSE_MIN_TIME_S = 0.01;

/**
 * Slope of a gG fuse's time-current curve on log-log axes (t ∝ I^-n) where the tables give
 * no 0.4 s point to fix it: n = 4 is typical of gG fuses between 0.1 s and 5 s (assumption,
 * from memory of manufacturers' curves; check against the fuse's own data).
 */
export const FUSE_ASSUMED_SLOPE = 4;

/**
 * The straight line on log-log axes that models a fuse's time-current curve: through the 5 s
 * point of Table 41.4 and the 0.4 s point of Table 41.2 when both exist, otherwise from the
 * 5 s point with the assumed slope. Null when not even the 5 s point is tabulated.
 */
function fuseCurve(kind: FuseKind, inA: number): { i5: number; n: number } | null {
  const i5 = fuseOperatingCurrent(kind, inA, '5');
  if (i5 === null) return null;
  const i04 = fuseOperatingCurrent(kind, inA, '0.4');
  const n = i04 !== null && i04 > i5 ? Math.log(5 / 0.4) / Math.log(i04 / i5) : FUSE_ASSUMED_SLOPE;
  return { i5, n };
}

/**
 * Fuse operating time, s, at fault current I, on the modelled curve (an approximation of the
 * time-current curve — common practice when no manufacturer's curve is to hand), never
 * below 10 ms. Null below the 5 s current (too slow to model).
 */
export function fuseOperatingTime(kind: FuseKind, inA: number, faultA: number): number | null {
  const curve = fuseCurve(kind, inA);
  if (curve === null || faultA < curve.i5) return null;
  return Math.max(FUSE_MIN_TIME_S, 5 * Math.pow(curve.i5 / faultA, curve.n));
}

/** The current at which the modelled fuse curve reaches 10 ms; above it the fuse limits the energy. */
function fuseCurrentAt10ms(kind: FuseKind, inA: number): number | null {
  const curve = fuseCurve(kind, inA);
  return curve === null ? null : curve.i5 * Math.pow(5 / FUSE_MIN_TIME_S, 1 / curve.n);
}

/** Energy let through, A²s, and how it was found. */
export interface FaultEnergy {
  i2t: number;
  /** Time used, s, or null when the energy came from a let-through figure. */
  timeS: number | null;
  basis: string;
}

/**
 * Energy let through by a breaker at a fault current I at or above its instantaneous trip
 * current. B and C curves up to 32 A: the energy-limiting class 3 limits of BS EN 60898-1
 * Annex ZA (from memory) are upper bounds at the listed prospective currents, and a
 * device's let-through never falls as the current rises, so at I the bound is the figure
 * of the next listed current at or above I — capped by I²·0.1 s (the instantaneous trip
 * is within 0.1 s). No interpolation. Others, or above 10 kA: I²·0.1 s (common practice).
 */
export function breakerLetThrough(curve: Curve, inA: number, faultA: number): FaultEnergy {
  const instantaneous = faultA * faultA * 0.1;
  const table =
    curve === 'D' || inA > 32
      ? null
      : CLASS3_LET_THROUGH_A2S[`${curve}-${inA <= 16 ? 16 : 32}` as keyof typeof CLASS3_LET_THROUGH_A2S];
  if (table) {
    for (const [ip, i2t] of table) {
      if (faultA <= ip && i2t < instantaneous) return { i2t, timeS: null, basis: LET_THROUGH_BASIS[ip] };
    }
  }
  return { i2t: instantaneous, timeS: 0.1, basis: 'I²t with t = 0.1 s (instantaneous trip)' };
}

/** How each let-through figure is described, by prospective current (built once). */
const LET_THROUGH_BASIS: Record<number, string> = Object.fromEntries(
  Object.values(CLASS3_LET_THROUGH_A2S)
    .flat()
    .map(([ip]) => [ip, `class 3 let-through limit at ${ip / 1000} kA (BS EN 60898-1 Annex ZA)`]),
);

/** Maximum tripping time of a general (non-delayed) RCD at IΔn, s (BS EN 61008/61009). */
export const RCD_MAX_TIME_S = 0.3;

/**
 * Energy the cpc must withstand for an earth fault at the far end of the circuit (I = Uo/Zs,
 * BS 7671:2018+A2:2022 543.1.3), with the device's operating time at that current:
 * - Breakers: at or above the instantaneous current (5/10/20·In) the trip is within 0.1 s
 *   (or the class 3 let-through bound, see breakerLetThrough). A Type D breaker on a 5 s
 *   circuit between 10·In and 20·In may take up to 5 s (Table 41.3): t = 5 s.
 * - Fuses: t from fuseOperatingTime; below 10 ms the energy is held at its 10 ms value.
 * - Otherwise, with an RCD: t = 0.3 s (its maximum at IΔn; faster above it).
 * Null when the time cannot be found (the disconnection check then fails too).
 */
export function faultEnergy(args: {
  device: DeviceFacts;
  farEndFaultA: number | null;
  rcdMa: number | null;
  timeS: number;
}): { energy: FaultEnergy; faultA: number } | null {
  const { device, rcdMa, farEndFaultA } = args;
  if (!usable(farEndFaultA)) return null;
  const i = farEndFaultA;
  if (isBreaker(device.kind)) {
    if (device.curve && i >= breakerTripCurrent(device.curve, device.inA)) {
      return { energy: breakerLetThrough(device.curve, device.inA, i), faultA: i };
    }
    if (device.curve === 'D' && args.timeS >= 5 && i >= breakerDisconnectionCurrent('D', device.inA, 5)) {
      return {
        energy: { i2t: i * i * 5, timeS: 5, basis: 'Type D between 10·In and 20·In: up to 5 s (Table 41.3)' },
        faultA: i,
      };
    }
  } else {
    const kind = device.kind as FuseKind;
    const t = fuseOperatingTime(kind, device.inA, i);
    if (t !== null) {
      let i2t = i * i * t;
      // Above the 10 ms current a current-limiting fuse lets through about its 10 ms energy.
      const iAt10ms = fuseCurrentAt10ms(kind, device.inA);
      if (t === FUSE_MIN_TIME_S && iAt10ms !== null) i2t = iAt10ms * iAt10ms * FUSE_MIN_TIME_S;
      return {
        energy: {
          i2t,
          timeS: t,
          basis: 'fuse time from Tables 41.2/41.4 (log-log line; slope assumed where 41.2 has no value)',
        },
        faultA: i,
      };
    }
  }
  if (rcdMa !== null) {
    return {
      energy: { i2t: i * i * RCD_MAX_TIME_S, timeS: RCD_MAX_TIME_S, basis: 'RCD operating time 0.3 s' },
      faultA: i,
    };
  }
  return null;
}

/** A fault current that can be used: positive and finite. */
function usable(i: number | null): i is number {
  return i !== null && i > 0 && Number.isFinite(i);
}

/**
 * Adiabatic k for the cable's cpc. Table 54.3 wherever the cpc is a core of the cable or
 * bunched with the line conductors — which includes single-core cables in conduit or
 * trunking (115 for 70 °C thermoplastic, 103 above 300 mm²; 143 for 90 °C thermosetting);
 * Table 54.4 for steel armour (46 for a 90 °C thermosetting cable). Table 54.2 (143 for a
 * separate, unbunched 70 °C cpc) is never assumed: the engine cannot know the cpc is apart.
 */
export function kFactor(cable: CableKind, cpcMm2: number, armour = false): number {
  if (cable === 'swa-xlpe-90') return armour ? K_VALUES.steelArmourThermosetting90 : K_VALUES.coreThermosetting90;
  return cpcMm2 > 300 ? K_VALUES.coreThermoplastic70Over300 : K_VALUES.coreThermoplastic70;
}

/** Minimum cpc size, mm², from the adiabatic equation S = √(I²t) / k (BS 7671 543.1.3). */
export function minimumCpc(i2t: number, k: number): number {
  return Math.sqrt(i2t) / k;
}

/**
 * Whether a 30 mA RCD is required for additional protection, and why: every circuit in a
 * room containing a bath or shower (701.411.3.3), equipment used outdoors up to 32 A and
 * sockets up to 32 A (411.3.3), cables concealed in a wall at less than 50 mm
 * (522.6.202/203), lighting in dwellings (411.3.4).
 */
export function additionalRcdReasons(args: {
  use: CircuitUse;
  inA: number;
  concealedInWall: boolean;
  dwelling: boolean;
  specialLocation?: 'none' | 'bath-shower' | 'outdoors';
}): string[] {
  const reasons: string[] = [];
  if (args.specialLocation === 'bath-shower')
    reasons.push('every circuit of a room containing a bath or shower (701.411.3.3)');
  if (args.specialLocation === 'outdoors' && args.inA <= 32)
    reasons.push('equipment used outdoors, rated up to 32 A (411.3.3)');
  if (args.use === 'sockets' && args.inA <= 32) reasons.push('socket-outlets rated up to 32 A (411.3.3)');
  if (args.concealedInWall) reasons.push('cable concealed in a wall at less than 50 mm (522.6.202)');
  if (args.use === 'lighting' && args.dwelling) reasons.push('lighting in a dwelling (411.3.4)');
  return reasons;
}
