import { VOLTAGE_DROP_LIMITS_PCT } from './tables/disconnection';
import type { CircuitUse } from './types';

/** Voltage the drop is a percentage of: Uo single-phase, UL = √3·Uo three-phase. */
export function nominalVoltage(phases: 1 | 3, uoV: number): number {
  return phases === 3 ? Math.sqrt(3) * uoV : uoV;
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
