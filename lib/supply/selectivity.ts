import type { Curve } from '@/lib/sizing';
import type { SelectivityOutcome } from '@/lib/names';

import type { Working } from './types';

/** An overcurrent device as selectivity needs it. */
export interface OvercurrentDevice {
  kind: 'mcb' | 'rcbo' | 'fuse-bs88-2' | 'fuse-bs88-3' | 'fuse-bs3036';
  curve: Curve | null;
  inA: number;
}

/** A judgement on one pair, before the names of the devices are added. */
export interface Judgement {
  outcome: SelectivityOutcome;
  upToA: number | null;
  working: Working;
}

/**
 * Lower edge of a breaker's instantaneous tripping band, × In: B 3–5, C 5–10, D 10–20
 * (BS EN 60898-1 tripping bands; the upper edges are the 5/10/20·In of Table 41.3).
 */
export const INSTANTANEOUS_LOWER_MULTIPLE: Record<Curve, number> = { B: 3, C: 5, D: 10 };

/**
 * Ratio of rated currents at which gG fuse-links discriminate: In(up) ≥ 1.6 · In(down) (the
 * selectivity ratio the fuse standard gives for gG fuse-links, BS 88 / IEC 60269; from memory).
 */
export const GG_FUSE_RATIO = 1.6;

/** Ratio of residual currents for RCD over RCD: IΔn(up) ≥ 3 · IΔn(down), upstream time-delayed (common practice). */
export const RCD_RATIO = 3;

const isBreaker = (d: OvercurrentDevice) => d.kind === 'mcb' || d.kind === 'rcbo';
const isGg = (d: OvercurrentDevice) => d.kind === 'fuse-bs88-2' || d.kind === 'fuse-bs88-3';
const COMMON = 'Common practice (site-supply method, selectivity rules)';

const fmtA = (a: number) => `${Math.round(a)} A`;

/**
 * Selectivity of an overcurrent device above (the sub-main's) and one below (on the board it
 * feeds), at the prospective fault current at the lower board, A. Rules (each common practice,
 * stated with its basis in the working):
 * - a device below rated at or above the one above: not selective (the one above can operate
 *   first on overload);
 * - gG fuse above gG fuse (BS 88-2, BS 88-3): selective throughout when In(up) ≥ 1.6·In(down);
 * - breaker above breaker: selective up to the upper breaker's lower instantaneous threshold
 *   (3·In B, 5·In C, 10·In D); throughout where the fault current at the lower board is below it;
 * - anything else (a fuse above a breaker, whose pre-arcing I²t is not held; a breaker above a
 *   fuse; a BS 3036 fuse): cannot be judged from the data held.
 */
export function overcurrentSelectivity(up: OvercurrentDevice, down: OvercurrentDevice, faultA: number): Judgement {
  if (down.inA >= up.inA) {
    return {
      outcome: 'not-selective',
      upToA: null,
      working: {
        text: `The device below (${down.inA} A) is rated at or above the one above (${up.inA} A), so the one above can operate first, even on overload.`,
        steps: [`In below ${down.inA} A ≥ In above ${up.inA} A`],
        sources: [COMMON],
      },
    };
  }
  if (isGg(up) && isGg(down)) {
    const need = GG_FUSE_RATIO * down.inA;
    const ok = up.inA >= need;
    return {
      outcome: ok ? 'selective' : 'not-selective',
      upToA: null,
      working: {
        text: ok
          ? `Fuse above fuse: ${up.inA} A ≥ 1.6 × ${down.inA} A = ${need.toFixed(1)} A, so the fuses discriminate at any fault current.`
          : `Fuse above fuse: ${up.inA} A < 1.6 × ${down.inA} A = ${need.toFixed(1)} A, below the ratio at which gG fuse-links discriminate.`,
        steps: [`1.6 × ${down.inA} A = ${need.toFixed(1)} A; In above ${up.inA} A`],
        sources: ['gG fuse-link selectivity ratio 1.6:1 (BS 88 / IEC 60269; from memory)', COMMON],
      },
    };
  }
  if (isBreaker(up) && isBreaker(down) && up.curve) {
    const m = INSTANTANEOUS_LOWER_MULTIPLE[up.curve];
    const limitA = m * up.inA;
    const throughout = faultA <= limitA;
    return {
      outcome: throughout ? 'selective' : 'selective-up-to',
      upToA: throughout ? null : limitA,
      working: {
        text: throughout
          ? `Breaker above breaker: the fault current at the board, ${fmtA(faultA)}, is below the upper breaker's lowest instantaneous trip, ${m} × ${up.inA} A = ${fmtA(limitA)}, so the lower breaker clears every fault first.`
          : `Breaker above breaker: selective only up to the upper breaker's lowest instantaneous trip, ${m} × ${up.inA} A = ${fmtA(limitA)}; the fault current at the board is ${fmtA(faultA)}, so a fault above ${fmtA(limitA)} can trip both.`,
        steps: [
          `Type ${up.curve}: instantaneous band from ${m} × In; ${m} × ${up.inA} A = ${limitA} A`,
          `Fault current at the board ${fmtA(faultA)}`,
        ],
        sources: ['BS EN 60898-1 instantaneous tripping bands (B 3–5, C 5–10, D 10–20 × In)', COMMON],
      },
    };
  }
  const why =
    !isBreaker(up) && isBreaker(down)
      ? 'a fuse above a breaker needs the fuse’s pre-arcing I²t to compare with the breaker’s let-through energy, and it is not held'
      : isBreaker(up) && !isBreaker(down)
        ? 'a breaker above a fuse needs both makers’ time-current and energy data, which are not held'
        : 'a rewirable (BS 3036) fuse has no selectivity ratio held';
  return {
    outcome: 'cannot-judge',
    upToA: null,
    working: {
      text: `Cannot be judged from the data held: ${why}. Check the makers’ selectivity tables.`,
      steps: [],
      sources: [COMMON],
    },
  };
}

/**
 * Selectivity of an RCD above (protecting the sub-main) and one below: selective only when the
 * upper one is time-delayed (type S) and its IΔn is at least three times the lower one's
 * (common practice).
 */
export function rcdSelectivity(up: { rcdMa: number; timeDelayed: boolean }, down: { rcdMa: number }): Judgement {
  const need = RCD_RATIO * down.rcdMa;
  const ok = up.timeDelayed && up.rcdMa >= need;
  const reasons: string[] = [];
  if (!up.timeDelayed) reasons.push('the RCD above is not time-delayed (type S)');
  if (up.rcdMa < need) reasons.push(`${up.rcdMa} mA is less than 3 × ${down.rcdMa} mA = ${need} mA`);
  return {
    outcome: ok ? 'selective' : 'not-selective',
    upToA: null,
    working: {
      text: ok
        ? `RCD above RCD: the one above is time-delayed and ${up.rcdMa} mA ≥ 3 × ${down.rcdMa} mA = ${need} mA.`
        : `RCD above RCD: not selective, because ${reasons.join(' and ')}.`,
      steps: [`3 × ${down.rcdMa} mA = ${need} mA; IΔn above ${up.rcdMa} mA${up.timeDelayed ? ', time-delayed' : ''}`],
      sources: [COMMON],
    },
  };
}
