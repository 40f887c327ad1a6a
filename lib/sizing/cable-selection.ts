import type { CableRowData } from './tables/cables';

/** What the engine knows about one candidate cable size. */
export interface SizeEvaluation {
  row: CableRowData | null;
  csaMm2: number;
  cpcMm2: number;
  vdV: number | null;
  vdPct: number | null;
  r1r2Ohm: number | null;
  zsOhm: number | null;
  farEndFaultA: number | null;
  cpcMinMm2: number | null;
  adiabaticTimeS: number | null;
  energyBasis: string | null;
  energyFaultA: number | null;
  /** Voltage drop within its limit. */
  vdOk: boolean;
  /** Zs within its maximum and the cpc at least the adiabatic minimum. */
  faultOk: boolean;
}

/** Gives the evaluation of the table row at an index. */
export interface SizeEvaluator {
  at(i: number): SizeEvaluation;
}

/**
 * Choose a cable size from a table (rows ascending by size): the smallest whose tabulated
 * current meets `requiredItA`; then the smallest at or above it whose voltage drop is within
 * its limit (else the largest); then the smallest at or above that which meets Zs and the
 * adiabatic check (else the largest, unless no size can help — `faultHopeless`). Each step
 * only moves up (and never below `minCsaMm2`), so every rule that tightens with length, heat, grouping or insulation can
 * only give an equal or larger size. Returns the row index, or -1 if no size carries the current.
 */
export function chooseCableSize(
  rows: readonly CableRowData[],
  requiredItA: number,
  evaluate: SizeEvaluator,
  faultHopeless: boolean,
  minCsaMm2 = 0,
): number {
  let i0 = -1;
  for (let i = 0; i < rows.length; i++) {
    if (rows[i].itA >= requiredItA && rows[i].csaMm2 >= minCsaMm2) {
      i0 = i;
      break;
    }
  }
  if (i0 < 0) return -1;
  const last = rows.length - 1;
  let iv = last;
  for (let i = i0; i <= last; i++) {
    if (evaluate.at(i).vdOk) {
      iv = i;
      break;
    }
  }
  if (faultHopeless) return iv;
  for (let i = iv; i <= last; i++) if (evaluate.at(i).faultOk) return i;
  return last;
}
