/**
 * Maximum d.c. resistance of plain copper conductors at 20 °C, class 1/2, in mΩ/m.
 * Source: IEC 60228 (BS EN 60228) Table 1/2.
 * Confirmed against a public source: 1.0–35 mm². 50–300 mm²: CONFIRMED against a cable
 * maker's published BS 5467 datasheet (conductor resistance at 20 °C, Ω/km: 0.387, 0.268,
 * 0.193, 0.153, 0.124, 0.0991, 0.0754, 0.0601), which quotes BS EN 60228.
 */
export const COPPER_R20_MOHM_PER_M = {
  1: 18.1,
  1.5: 12.1,
  2.5: 7.41,
  4: 4.61,
  6: 3.08,
  10: 1.83,
  16: 1.15,
  25: 0.727,
  35: 0.524,
  50: 0.387,
  70: 0.268,
  95: 0.193,
  120: 0.153,
  150: 0.124,
  185: 0.0991,
  240: 0.0754,
  300: 0.0601,
} as const satisfies Record<number, number>;

/** Conductor sizes the engine knows, mm². */
export const CONDUCTOR_SIZES_MM2 = [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240, 300] as const;

/**
 * Multiplier from 20 °C to the conductor's maximum operating temperature, BS 7671
 * Appendix 3 practice: 1 + 0.004·(θ − 20) → 1.20 at 70 °C, 1.28 at 90 °C (confirmed).
 */
export const OPERATING_TEMPERATURE_FACTOR = { 70: 1.2, 90: 1.28 } as const;
