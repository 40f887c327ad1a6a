/**
 * Standard rated currents, A, per kind of protective device.
 * Sources: BS EN 60898-1 / BS EN 61009-1 preferred ratings (circuit-breakers, RCBOs);
 * BS 88-2 (gG fuses, systems E and G), BS 88-3 (system C, household cartridge fuses) and
 * BS 3036 (semi-enclosed fuses) as listed in BS 7671:2018+A2:2022 Tables 41.2/41.4.
 * The breaker list is the preferred series of those two standards (6–125 A); the fuse lists are
 * from memory (verify against a printed copy).
 */
export const STANDARD_RATINGS_A = {
  mcb: [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125],
  rcbo: [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125],
  'fuse-bs88-2': [2, 4, 6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125, 160, 200],
  'fuse-bs88-3': [5, 16, 20, 32, 45, 63, 80, 100],
  'fuse-bs3036': [5, 15, 20, 30, 45, 60, 100],
} as const;

/** Residual operating currents IΔn, mA, for RCDs and RCBOs (BS EN 61008/61009). */
export const RCD_SENSITIVITIES_MA = [10, 30, 100, 300, 500] as const;
