import { AMBIENT_CA, GROUND_CA_90 } from './tables/ambient';
import { GROUND_GROUPING_CG, GROUPING_CG } from './tables/grouping';
import { INSULATION_CI } from './tables/insulation';
import type { Factors, Method, ProtectiveDeviceKind } from './types';

/**
 * Ambient factor Ca from BS 7671 Table 4B1: the row at or next above the ambient
 * (25 °C row below 25 °C); null above the last row (the cable may not be used there).
 */
export function ambientFactor(ambientC: number, maxTempC: 70 | 90): number | null {
  for (const [t, ca] of AMBIENT_CA[maxTempC]) if (ambientC <= t) return ca;
  return null;
}

/**
 * Ground temperature factor for method D (buried armoured cable) from BS 7671 Table 4B2, at
 * the row at or next above the ground temperature; null above the table.
 */
export function groundFactor(groundC: number): number | null {
  for (const [t, ca] of GROUND_CA_90) if (groundC <= t) return ca;
  return null;
}

/** Grouping factor Cg from BS 7671 Table 4C1, at the count or the next higher count. */
export function groupingFactor(circuits: number, arrangement: 'bunched' | 'single-layer'): number {
  const rows = GROUPING_CG[arrangement];
  for (const [n, cg] of rows) if (circuits <= n) return cg;
  return rows[rows.length - 1][1];
}

/**
 * Grouping factor for method D from BS 7671 Table 4C2 (direct in the ground) or 4C3 (in
 * ducts in the ground), at the column at or below the clearance; null beyond 6 circuits
 * (the tables stop there).
 */
export function groundGroupingFactor(circuits: number, inDucts: boolean, spacingM: number): number | null {
  if (circuits <= 1) return 1;
  const t = inDucts ? GROUND_GROUPING_CG.ducts : GROUND_GROUPING_CG.direct;
  let col = 0;
  for (let i = 0; i < t.spacingsM.length; i++) if (spacingM >= t.spacingsM[i]) col = i;
  for (const [n, cgs] of t.rows) if (circuits <= n) return cgs[col];
  return null;
}

/** True for the twin-and-earth methods whose ratings already include thermal insulation. */
export function isInsulationMethod(method: Method): boolean {
  return method === '100' || method === '101' || method === '102' || method === '103';
}

/**
 * Thermal insulation factor Ci from BS 7671 Table 52.2 at the next longer length; 1 when
 * there is no insulation or for methods 100–103 (their ratings already allow for it).
 */
export function insulationFactor(insulationMm: number, method: Method): number {
  if (insulationMm <= 0 || isInsulationMethod(method)) return 1;
  for (const [mm, ci] of INSULATION_CI) if (insulationMm <= mm) return ci;
  return INSULATION_CI[INSULATION_CI.length - 1][1];
}

/**
 * Factor Cc: 0.725 for a BS 3036 semi-enclosed fuse, 0.9 for a cable buried in the ground,
 * their product for both (BS 7671 Appendix 4, 5.1.1).
 */
export function conductorFactor(deviceKind: ProtectiveDeviceKind, buried: boolean): number {
  return (deviceKind === 'fuse-bs3036' ? 0.725 : 1) * (buried ? 0.9 : 1);
}

/**
 * All four correction factors for one circuit (for method D, `ambientC` is the ground
 * temperature). `cg` is null for more circuits in the ground than Tables 4C2/4C3 cover.
 */
export function correctionFactors(args: {
  ambientC: number;
  maxTempC: 70 | 90;
  circuits: number;
  arrangement: 'bunched' | 'single-layer';
  insulationMm: number;
  method: Method;
  deviceKind: ProtectiveDeviceKind;
  buried: boolean;
  inDucts?: boolean;
  spacingM?: number;
}): Omit<Factors, 'cg'> & { cg: number | null } {
  return {
    // Method D is rated at 20 °C ground temperature (Table 4B2); the others at 30 °C air.
    ca: args.method === 'D' ? groundFactor(args.ambientC) : ambientFactor(args.ambientC, args.maxTempC),
    cg:
      args.method === 'D'
        ? groundGroupingFactor(args.circuits, args.inDucts ?? false, args.spacingM ?? 0)
        : groupingFactor(args.circuits, args.arrangement),
    ci: insulationFactor(args.insulationMm, args.method),
    cc: conductorFactor(args.deviceKind, args.buried),
  };
}

/**
 * The current the cable's capacity must reach, A: In, or for a ring final circuit on a 30 or
 * 32 A device 20 A (BS 7671:2018+A2:2022 433.1.204: a 2.5 mm² thermoplastic or thermosetting
 * ring is deemed to comply where Iz ≥ 20 A).
 */
export function requiredCapacity(inA: number, ring: boolean): number {
  return ring && (inA === 30 || inA === 32) ? RING_IZ_A : inA;
}

/** Iz a ring final circuit on a 30/32 A device needs (433.1.204). */
export const RING_IZ_A = 20;
/** Smallest conductor of a ring final circuit under 433.1.204 (copper, non-MI cable). */
export const RING_MIN_CSA_MM2 = 2.5;

/**
 * Tabulated current the cable must have, before thermal insulation: It ≥ need / (Ca·Cg·Cc)
 * with `need` from requiredCapacity. Thermal insulation (Ci) is applied to the method C
 * rating of each size instead (see effectiveTabulated). Null when a factor is missing.
 */
export function requiredTabulatedCurrent(
  inA: number,
  f: { ca: number | null; cg: number | null; cc: number },
  ring: boolean,
): number | null {
  if (f.ca === null || f.cg === null) return null;
  return requiredCapacity(inA, ring) / (f.ca * f.cg * f.cc);
}

/**
 * A run's tabulated current where part of it is totally surrounded by thermal insulation:
 * the lower of its method's rating and the method C rating × Ci (BS 7671:2018+A2:2022
 * 523.9 and Table 52.2, whose factors apply to the clipped-direct rating).
 */
export function effectiveTabulated(itMethod: number, itMethodC: number | null, ci: number): number {
  if (ci >= 1 || itMethodC === null) return itMethod;
  return Math.min(itMethod, itMethodC * ci);
}
