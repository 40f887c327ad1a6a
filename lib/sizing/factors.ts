import { AMBIENT_CA, GROUND_CA_90 } from './tables/ambient';
import { GROUPING_CG } from './tables/grouping';
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

/** All four correction factors for one circuit (for method D, `ambientC` is the ground temperature). */
export function correctionFactors(args: {
  ambientC: number;
  maxTempC: 70 | 90;
  circuits: number;
  arrangement: 'bunched' | 'single-layer';
  insulationMm: number;
  method: Method;
  deviceKind: ProtectiveDeviceKind;
  buried: boolean;
}): Factors {
  return {
    // Method D is rated at 20 °C ground temperature (Table 4B2); the others at 30 °C air.
    ca: args.method === 'D' ? groundFactor(args.ambientC) : ambientFactor(args.ambientC, args.maxTempC),
    cg: groupingFactor(args.circuits, args.arrangement),
    ci: insulationFactor(args.insulationMm, args.method),
    cc: conductorFactor(args.deviceKind, args.buried),
  };
}

/**
 * Tabulated current the cable must have: It ≥ In / (Ca·Cg·Ci·Cc), or 0.67·In / (…) for a
 * ring final circuit (BS 7671 433.1.204). Null when a factor is missing.
 */
export function requiredTabulatedCurrent(inA: number, f: Factors, ring: boolean): number | null {
  if (f.ca === null) return null;
  return ((ring ? 0.67 : 1) * inA) / (f.ca * f.cg * f.ci * f.cc);
}
