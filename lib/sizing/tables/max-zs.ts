/**
 * Maximum earth fault loop impedance, Ω, at Uo = 230 V, Cmin = 0.95.
 *
 * Circuit-breakers (BS EN 60898 / RCBOs to BS EN 61009): by formula,
 * Zs = Cmin·Uo / Ia with Ia = 5·In (type B), 10·In (C), 20·In (D) — the formula behind
 * BS 7671:2018+A2:2022 Table 41.3 (confirmed: B32 1.37 Ω, C20 1.09 Ω). Instantaneous
 * tripping is within 0.1 s, so the same limit serves 0.4 s and 5 s.
 *
 * Type D at 5 s uses 10·In (Table 41.3: D32 0.68 Ω), see breakerDisconnectionCurrent; a
 * public table of the 18th edition values agrees (D32 0.34 Ω at 0.4 s, 0.68 Ω at 5 s).
 *
 * Fuses: FROM MEMORY — BS 7671:2018+A2:2022 Table 41.2 (0.4 s) and Table 41.4 (5 s), the
 * 18th edition values with Cmin = 0.95 (the BS 88-2 0.4 s cells equal the 2008 values × 0.95,
 * e.g. 32 A 1.04 → 0.99 Ω). Checked against public sources: NOT confirmed — a calculator
 * site's table gives different fuse values (e.g. BS 88 20 A 1.84 Ω) while mixing editions
 * (its 32 A 1.04 Ω is the 2008 figure), and a question-and-answer page gives a BS 88-3 20 A
 * figure without Cmin. Verify every cell against a printed copy before relying on it. A
 * rating missing from a column has no tabulated value (null).
 */
export const BREAKER_TRIP_MULTIPLE = { B: 5, C: 10, D: 20 } as const;

/** Cmin, the minimum voltage factor of BS 7671 Chapter 41 (18th edition). */
export const CMIN = 0.95;

export const FUSE_MAX_ZS_OHM = {
  'fuse-bs88-2': {
    '0.4': { 2: 33.1, 4: 15.6, 6: 7.8, 10: 4.65, 16: 2.43, 20: 1.68, 25: 1.29, 32: 0.99, 40: 0.75, 50: 0.57, 63: 0.44 },
    '5': {
      2: 44,
      4: 21,
      6: 12.6,
      10: 6.8,
      16: 4,
      20: 2.8,
      25: 2.2,
      32: 1.7,
      40: 1.3,
      50: 0.99,
      63: 0.78,
      80: 0.55,
      100: 0.42,
      125: 0.32,
      160: 0.27,
      200: 0.18,
    },
  },
  'fuse-bs88-3': {
    '0.4': { 5: 9.93, 16: 2.3, 20: 1.64, 32: 0.87, 45: 0.53, 63: 0.39 },
    '5': { 5: 16.4, 16: 3.94, 20: 2.8, 32: 1.44, 45: 1, 63: 0.73, 80: 0.52, 100: 0.38 },
  },
  'fuse-bs3036': {
    '0.4': { 5: 9.1, 15: 2.43, 20: 1.68, 30: 1.04 },
    '5': { 5: 16.8, 15: 5.08, 20: 3.64, 30: 2.51, 45: 1.51, 60: 1.07, 100: 0.51 },
  },
} as const satisfies Record<string, Record<'0.4' | '5', Record<number, number>>>;
