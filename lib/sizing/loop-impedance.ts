import { COPPER_R20_MOHM_PER_M, OPERATING_TEMPERATURE_FACTOR } from './tables/conductor-resistance';

/** Copper resistance at 20 °C, Ω/m (IEC 60228), or null for a size not in the table. */
export function conductorResistance20(csaMm2: number): number | null {
  const r = (COPPER_R20_MOHM_PER_M as Record<number, number>)[csaMm2];
  return r === undefined ? null : r / 1000;
}

/**
 * (R1+R2) per metre at the conductor's maximum operating temperature, Ω/m: the sum of the
 * IEC 60228 values at 20 °C times 1.20 (70 °C) or 1.28 (90 °C), BS 7671 Appendix 3 practice.
 */
export function r1r2PerMetre(csaMm2: number, cpcMm2: number, maxTempC: 70 | 90): number | null {
  const r1 = conductorResistance20(csaMm2);
  const r2 = conductorResistance20(cpcMm2);
  if (r1 === null || r2 === null) return null;
  return (r1 + r2) * OPERATING_TEMPERATURE_FACTOR[maxTempC];
}

/**
 * R1+R2 of the run and Zs = Ze + R1+R2, Ω. A ring divides the end-to-end loop by 4
 * (fault at the midpoint, common practice). `r2PerM` replaces the cpc's resistance per
 * metre at its operating temperature, Ω/m, where the cpc is not a copper core (the armour).
 */
export function loopImpedance(args: {
  csaMm2: number;
  cpcMm2: number;
  maxTempC: 70 | 90;
  lengthM: number;
  ring: boolean;
  zeOhm: number;
  r2PerM?: number;
}): { r1r2Ohm: number; zsOhm: number } | null {
  let perM: number | null;
  if (args.r2PerM === undefined) {
    perM = r1r2PerMetre(args.csaMm2, args.cpcMm2, args.maxTempC);
  } else {
    const r1 = conductorResistance20(args.csaMm2);
    perM = r1 === null ? null : r1 * OPERATING_TEMPERATURE_FACTOR[args.maxTempC] + args.r2PerM;
  }
  if (perM === null) return null;
  const r1r2Ohm = (perM * args.lengthM) / (args.ring ? 4 : 1);
  return { r1r2Ohm, zsOhm: args.zeOhm + r1r2Ohm };
}
