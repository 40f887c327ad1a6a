/**
 * Thermal insulation factor Ci for a cable totally surrounded by thermal insulation over
 * the given length. Source: BS 7671:2018+A2:2022 Table 52.2.
 * Confirmed: 100 mm 0.78, 500 mm and over 0.50 (0.50 also in the 16th edition's table, seen in
 * a public copy). From memory: 50 mm 0.88, 200 mm 0.63, 400 mm 0.51 — not confirmed: the only
 * public copy found is the superseded 16th edition table (0.89 / 0.68 / 0.55), which differs.
 * Between lengths use the next longer length; 0 mm → 1. Ci derates the method C rating (see
 * effectiveTabulated in factors.ts).
 */
export const INSULATION_CI = [
  [50, 0.88],
  [100, 0.78],
  [200, 0.63],
  [400, 0.51],
  [500, 0.5],
] as const;
