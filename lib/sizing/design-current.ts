import { STANDARD_RATINGS_A } from './tables/ratings';
import { SOCKET_ARRANGEMENTS } from './tables/disconnection';
import type { ProtectiveDeviceKind, SocketArrangementKind } from './types';
import { lineVoltage } from './voltage-drop';

export type Load =
  | { kind: 'known'; watts: number; powerFactor: number }
  | {
      kind: 'socket-arrangement';
      arrangement: SocketArrangementKind;
      floorAreaM2: number;
      assumedA?: number;
    };

/**
 * Default design current of a socket arrangement: the largest standard rating of the
 * device kind not above the arrangement's nominal rating (32 A, or 30 A for a BS 3036
 * fuse; 20 A). Taking Ib = In is conservative common practice (UK on-site guidance).
 */
export function socketArrangementCurrent(arrangement: SocketArrangementKind, deviceKind: ProtectiveDeviceKind): number {
  const nominal = SOCKET_ARRANGEMENTS[arrangement].nominalA;
  const list = STANDARD_RATINGS_A[deviceKind];
  let best: number = list[0];
  for (const r of list) if (r <= nominal) best = r;
  return best;
}

/**
 * Design current Ib, A. Known load: P / (Uo·pf) single-phase, P / (√3·UL·pf) three-phase
 * with UL the nominal line voltage (400 V on a 230/400 V supply, see lineVoltage). Socket
 * arrangement: the assumed current or the arrangement's default (see socketArrangementCurrent).
 */
export function designCurrent(load: Load, phases: 1 | 3, uoV: number, deviceKind: ProtectiveDeviceKind): number {
  if (load.kind === 'socket-arrangement') {
    return load.assumedA ?? socketArrangementCurrent(load.arrangement, deviceKind);
  }
  if (phases === 3) {
    return load.watts / (Math.sqrt(3) * lineVoltage(uoV) * load.powerFactor);
  }
  return load.watts / (uoV * load.powerFactor);
}

/** Smallest standard rating of the device kind with In ≥ Ib, or null if none is large enough. */
export function chooseRating(ibA: number, deviceKind: ProtectiveDeviceKind): number | null {
  for (const r of STANDARD_RATINGS_A[deviceKind]) if (r >= ibA) return r;
  return null;
}
