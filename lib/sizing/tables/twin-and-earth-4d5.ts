/**
 * Flat twin and earth cable, 70 °C thermoplastic (PVC) insulation, copper.
 * Source: BS 7671:2018+A2:2022 Table 4D5 (current-carrying capacity and voltage drop).
 *
 * Confirmed against a public source:
 *   1.0 mm² and 1.5 mm² rows (all methods and mV/A/m), 2.5 mm² method C (27 A) and
 *   mV/A/m (18), 4 mm² method 100 (27 A).
 * From memory (verify against a printed copy): every other cell of the 2.5–16 mm² rows. The
 * 2.5 mm² row agrees with a public discussion of 433.1.204 (a ring needs Iz ≥ 20 A: met in
 * methods A, 100 and 102, not in 101), which does not quote the cells themselves.
 *
 * Methods 100–103 are the UK insulated-joist and stud-wall methods (their values already
 * allow for the thermal insulation described in the method); A = enclosed in conduit in an
 * insulated wall; C = clipped direct. The cpc sizes are those of the cable's construction.
 */
export const TWIN_AND_EARTH_4D5 = {
  source: 'BS 7671:2018+A2:2022 Table 4D5',
  sizesMm2: [1, 1.5, 2.5, 4, 6, 10, 16],
  cpcMm2: [1, 1, 1.5, 1.5, 2.5, 4, 6],
  itA: {
    '100': [13, 16, 21, 27, 34, 45, 57],
    '101': [10.5, 13, 17, 22, 27, 36, 46],
    '102': [13, 16, 21, 27, 35, 47, 63],
    '103': [8, 10, 13.5, 17.5, 23.5, 32, 42.5],
    C: [16, 20, 27, 37, 47, 64, 85],
    A: [11.5, 14.5, 20, 26, 32, 44, 57],
  },
  /** Single-phase voltage drop, mV/A/m (the cable has no three-phase use). */
  mvAm1: [44, 29, 18, 11, 7.3, 4.4, 2.8],
} as const;
