/**
 * Armoured multicore cables, 90 °C thermosetting (XLPE) insulation, copper conductors.
 * Source: BS 7671:2018+A2:2022 Tables 4E4A (current) and 4E4B (voltage drop).
 *
 * Table 4E4B (voltage drop), every cell 1.5–120 mm²: CONFIRMED against a public copy of the
 * 18th edition table (a cable distributor's reproduction, cse-distributors.co.uk "Table 4E4B").
 * For 25 mm² and above the engine uses the impedance z column (r and x kept beside it):
 * CORRECTED here — the earlier copy held r or rounded values for 25, 95 and 120 mm²
 * (1.85 / 0.51 / 0.41 single-phase, 1.6 / 0.44 / 0.36 three-phase).
 * Table 4E4A (current-carrying capacity): FROM MEMORY — every cell (no public copy found;
 * verify against a printed copy).
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
  /** Two-core, single-phase a.c., mV/A/m: up to 16 mm² the single value, above it z. */
  mvAm1: [31, 19, 12, 7.9, 4.7, 2.9, 1.9, 1.35, 1.0, 0.69, 0.52, 0.42],
  /** Three- or four-core, three-phase a.c., mV/A/m: up to 16 mm² the single value, above it z. */
  mvAm3: [27, 16, 10, 6.8, 4.0, 2.5, 1.65, 1.15, 0.87, 0.6, 0.45, 0.37],
  /** r and x of the 25–120 mm² rows (Table 4E4B, confirmed): the printed z is used as it is. */
  printedRx1: [
    [1.85, 0.16],
    [1.35, 0.155],
    [0.99, 0.155],
    [0.67, 0.15],
    [0.5, 0.15],
    [0.4, 0.145],
  ],
  printedRx3: [
    [1.6, 0.14],
    [1.15, 0.135],
    [0.86, 0.135],
    [0.59, 0.13],
    [0.43, 0.13],
    [0.34, 0.13],
  ],
} as const;

/**
 * Steel wire armour of BS 5467 600/1000 V XLPE/SWA cables, by conductor size (same sizes as
 * ARMOURED_4E4) and number of cores: gross cross-sectional area of the armour wires, mm², and
 * the maximum d.c. resistance of the armour at 20 °C, mΩ/m.
 * Two-core armour areas: CONFIRMED against a manufacturer's published datasheet (Eland,
 * BS 5467 SWA, 15/17/19/22/26/42/42/60/68/80/113/125 mm²). Four-core 2.5 mm² armour
 * resistance 7.9 mΩ/m: agrees with a published figure quoted in a trade forum. Every other
 * cell: FROM MEMORY of BS 5467 Tables — verify against the cable maker's data; the real
 * cable's own figures should be used where known.
 */
export const SWA_ARMOUR = {
  2: {
    areaMm2: [15, 17, 19, 22, 26, 42, 42, 60, 68, 80, 113, 125],
    r20MohmPerM: [10.2, 8.8, 7.9, 7.0, 6.0, 3.7, 3.7, 2.6, 2.3, 2.0, 1.4, 1.3],
  },
  3: {
    areaMm2: [16, 19, 21, 23, 28, 43, 62, 70, 80, 92, 132, 145],
    r20MohmPerM: [9.5, 8.2, 7.5, 6.7, 5.7, 4.0, 2.5, 2.3, 2.0, 1.8, 1.3, 1.2],
  },
  4: {
    areaMm2: [17, 20, 23, 35, 40, 46, 67, 76, 88, 126, 140, 157],
    r20MohmPerM: [9.0, 7.9, 7.0, 6.2, 5.3, 3.5, 2.3, 2.0, 1.8, 1.3, 1.2, 1.1],
  },
} as const;

/**
 * Multiplier from 20 °C to the armour's temperature when the cable runs at 90 °C: the armour
 * is taken at 80 °C (the initial temperature BS 7671 Table 54.4 assumes for steel armour of a
 * 90 °C thermosetting cable) with steel's temperature coefficient 0.0045/K (from memory):
 * 1 + 0.0045 × 60 = 1.27.
 */
export const ARMOUR_TEMPERATURE_FACTOR = 1.27;
