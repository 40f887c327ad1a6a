import { VOLTAGE_DROP_LIMITS_PCT } from './tables/disconnection';
import type { CircuitUse } from './types';

/**
 * Nominal line-to-line voltage UL for a line-to-earth Uo: the IEC 60038 pairs (120/208,
 * 127/220, 220/380, 230/400, 240/415, 277/480 V), so a 230 V supply gives 400 V, not
 * √3·230 = 398.4 V; any other Uo gives √3·Uo.
 */
export function lineVoltage(uoV: number): number {
  const ul = NOMINAL_UL_V[uoV];
  return ul === undefined ? Math.sqrt(3) * uoV : ul;
}

const NOMINAL_UL_V: Record<number, number> = { 120: 208, 127: 220, 220: 380, 230: 400, 240: 415, 277: 480 };

/** Voltage the drop is a percentage of: Uo single-phase, UL (400 V on a 230/400 V supply) three-phase. */
export function nominalVoltage(phases: 1 | 3, uoV: number): number {
  return phases === 3 ? lineVoltage(uoV) : uoV;
}

/**
 * Voltage drop limit, % (BS 7671 Appendix 4 Table 4Ab): lighting 3 % / other 5 % on a public
 * supply, 6 % / 8 % on a private one. A distribution circuit takes the "other" limit, which
 * it shares with the final circuits it feeds.
 */
export function voltageDropLimitPct(use: CircuitUse, source: 'public' | 'private'): number {
  const limits = VOLTAGE_DROP_LIMITS_PCT[source];
  return use === 'lighting' ? limits.lighting : limits.other;
}

/**
 * Voltage drop, V: (mV/A/m)·Ib·L/1000 with the single- or three-phase column already chosen.
 * A ring divides by 4 (load taken at the midpoint, common practice).
 */
export function voltageDrop(mvAm: number, ibA: number, lengthM: number, ring: boolean): number {
  return (mvAm * ibA * lengthM) / 1000 / (ring ? 4 : 1);
}
