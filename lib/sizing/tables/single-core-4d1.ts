/**
 * Single-core non-armoured cables, 70 °C thermoplastic (PVC) insulation, copper, in conduit
 * or trunking (methods A and B) or clipped direct (method C).
 * Source: BS 7671:2018+A2:2022 Tables 4D1A (current) and 4D1B (voltage drop).
 *
 * Confirmed against a public source: 25 mm² A 80 / 73, B 101 / 89, C 114 (two loaded);
 * 10 mm² method A two loaded 46 A.
 * From memory (verify against a printed copy): every other cell, including all mV/A/m
 * values (Table 4D1B, columns for cables enclosed in conduit or trunking, which have the
 * largest reactance, so they are used for every method).
 * 25 mm² and above: CORRECTED — the earlier copy held the resistance r alone (e.g. 0.41 for
 * 120 mm² single-phase, where z is about 0.47, 15 % more). The engine now uses the impedance
 * z = √(r² + x²) from the r and x below (from memory; three-phase = √3/2 × single-phase, the
 * relation between the columns of Appendix 4 tables).
 *
 * "2" = two loaded conductors (single-phase), "3" = three loaded conductors (three-phase);
 * method C three loaded is flat touching.
 */
export const SINGLE_CORE_4D1 = {
  source: 'BS 7671:2018+A2:2022 Tables 4D1A/4D1B',
  sizesMm2: [1, 1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120],
  itA: {
    A: {
      2: [11, 14.5, 20, 26, 34, 46, 61, 80, 99, 119, 151, 182, 210],
      3: [10.5, 13.5, 18, 24, 31, 42, 56, 73, 89, 108, 136, 164, 188],
    },
    B: {
      2: [13.5, 17.5, 24, 32, 41, 57, 76, 101, 125, 151, 192, 232, 269],
      3: [12, 15.5, 21, 28, 36, 50, 68, 89, 110, 134, 171, 207, 239],
    },
    C: {
      2: [15.5, 20, 27, 37, 47, 65, 87, 114, 141, 182, 234, 284, 330],
      3: [14, 18, 25, 33, 43, 59, 79, 104, 129, 167, 214, 261, 303],
    },
  },
  /** mV/A/m up to 16 mm² (r; x negligible); 25 mm² and above: replaced by z from rx1/rx3. */
  mvAm1: [44, 29, 18, 11, 7.3, 4.4, 2.8, 1.8, 1.3, 0.95, 0.65, 0.49, 0.38],
  mvAm3: [38, 25, 15, 9.5, 6.4, 3.8, 2.4, 1.55, 1.1, 0.82, 0.57, 0.42, 0.33],
  /** r and x, mV/A/m, of the 25–120 mm² rows, single-phase, enclosed (from memory). */
  rx1: [
    [1.8, 0.33],
    [1.3, 0.31],
    [0.95, 0.3],
    [0.65, 0.29],
    [0.49, 0.28],
    [0.38, 0.27],
  ],
  /** Three-phase: √3/2 × the single-phase r and x. */
  rx3: [
    [1.56, 0.29],
    [1.13, 0.27],
    [0.82, 0.26],
    [0.56, 0.25],
    [0.42, 0.24],
    [0.33, 0.23],
  ],
} as const;
