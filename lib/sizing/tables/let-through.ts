/**
 * Energy-limiting class 3 let-through I²t limits, A²s, for type B and C circuit-breakers
 * up to 32 A, by prospective current, A. Source: BS EN 60898-1 Annex ZA (Table ZA.1) —
 * FROM MEMORY, verify against the standard (searched for; no public copy of the figures
 * found — a manufacturers' association guide to the standard was found but not its table). Each value is an upper bound on the energy
 * let through at (and below) the listed prospective current by a class 3 device.
 * Manufacturers' data for a given device is usually lower.
 */
export const CLASS3_LET_THROUGH_A2S = {
  'B-16': [
    [3000, 15000],
    [4500, 25000],
    [6000, 35000],
    [10000, 70000],
  ],
  'B-32': [
    [3000, 18000],
    [4500, 32000],
    [6000, 45000],
    [10000, 90000],
  ],
  'C-16': [
    [3000, 17000],
    [4500, 28000],
    [6000, 40000],
    [10000, 80000],
  ],
  'C-32': [
    [3000, 20000],
    [4500, 36000],
    [6000, 50000],
    [10000, 100000],
  ],
} as const;
