/**
 * Armoured multicore cables, 90 °C thermosetting (XLPE) insulation, copper conductors.
 * Source: BS 7671:2018+A2:2022 Tables 4E4A (current) and 4E4B (voltage drop).
 *
 * From memory — every cell (no public copy seen yet; verify against a printed copy).
 * For 25 mm² and above the mV/A/m given is the impedance (z) value.
 *
 * "2" = two-core, single-phase; "3" = three- or four-core, three-phase.
 * Methods: C (clipped direct), E (free air, on a perforated tray), D (direct in the ground
 * or in ducts in the ground — the 18th edition column covers both, at 2.5 K·m/W soil).
 */
export const ARMOURED_4E4 = {
  source: 'BS 7671:2018+A2:2022 Tables 4E4A/4E4B',
  sizesMm2: [1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120],
  itA: {
    C: {
      2: [27, 36, 49, 62, 85, 110, 146, 180, 219, 279, 338, 392],
      3: [23, 31, 42, 53, 73, 94, 124, 154, 187, 238, 289, 335],
    },
    E: {
      2: [29, 39, 52, 66, 90, 115, 152, 188, 228, 291, 354, 410],
      3: [25, 33, 44, 56, 78, 99, 131, 162, 197, 251, 304, 353],
    },
    D: {
      2: [25, 33, 43, 53, 71, 91, 116, 139, 164, 203, 239, 271],
      3: [21, 28, 36, 44, 58, 75, 96, 115, 135, 167, 197, 223],
    },
  },
  mvAm1: [31, 19, 12, 7.9, 4.7, 2.9, 1.85, 1.35, 1, 0.69, 0.51, 0.41],
  mvAm3: [27, 16, 10, 6.8, 4, 2.5, 1.6, 1.15, 0.87, 0.6, 0.44, 0.36],
} as const;
