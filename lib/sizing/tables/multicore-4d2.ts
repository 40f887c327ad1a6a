/**
 * Multicore non-armoured cables, 70 °C thermoplastic (PVC) insulation, copper.
 * Source: BS 7671:2018+A2:2022 Tables 4D2A (current) and 4D2B (voltage drop).
 *
 * Confirmed against a public source: three- or four-core method C 4 mm² 32 A and
 * 10 mm² 57 A; three-phase mV/A/m 4 mm² 9.5 and 10 mm² 3.8.
 * From memory (verify against a printed copy): every other cell. For 25 mm² and above
 * the engine uses the impedance z = √(r² + x²) from the r and x below (from memory; the
 * multicore reactance is small, so z differs from r by under 6 %).
 *
 * "2" = one two-core cable, single-phase; "3" = one three- or four-core cable, three-phase.
 * Methods: A (in conduit in an insulated wall), B (in conduit on a wall), C (clipped
 * direct), E (free air, on a perforated tray).
 */
export const MULTICORE_4D2 = {
  source: 'BS 7671:2018+A2:2022 Tables 4D2A/4D2B',
  sizesMm2: [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95],
  itA: {
    A: {
      2: [11, 14, 18.5, 25, 32, 43, 57, 75, 92, 110, 139, 167],
      3: [10, 13, 17.5, 23, 29, 39, 52, 68, 83, 99, 125, 150],
    },
    B: {
      2: [13, 16.5, 23, 30, 38, 52, 69, 90, 111, 133, 168, 201],
      3: [11.5, 15, 20, 27, 34, 46, 62, 80, 99, 118, 149, 179],
    },
    C: {
      2: [15, 19.5, 27, 36, 46, 63, 85, 112, 138, 168, 213, 258],
      3: [13.5, 17.5, 24, 32, 41, 57, 76, 96, 119, 144, 184, 223],
    },
    E: {
      2: [17, 22, 30, 40, 51, 70, 94, 119, 148, 180, 232, 282],
      3: [14.5, 18.5, 25, 34, 43, 60, 80, 101, 126, 153, 196, 238],
    },
  },
  mvAm1: [44, 29, 18, 11, 7.3, 4.4, 2.8, 1.75, 1.25, 0.93, 0.63, 0.46],
  mvAm3: [38, 25, 15, 9.5, 6.4, 3.8, 2.4, 1.5, 1.1, 0.8, 0.55, 0.4],
  rx1: [
    [1.75, 0.17],
    [1.25, 0.165],
    [0.93, 0.165],
    [0.63, 0.16],
    [0.46, 0.155],
  ],
  rx3: [
    [1.5, 0.145],
    [1.1, 0.145],
    [0.8, 0.14],
    [0.55, 0.14],
    [0.4, 0.135],
  ],
} as const;
