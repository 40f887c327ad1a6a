/**
 * Typical rated breaking capacity, kA, used when the input does not give one.
 * FROM MEMORY / typical catalogue values, not a BS 7671 table: circuit-breakers and RCBOs
 * to BS EN 60898 / 61009 are commonly 6 kA or 10 kA (6 assumed); BS 88-2 gG fuses 80 kA;
 * BS 88-3 fuses 16.5 kA; BS 3036 semi-enclosed fuses 1, 2 or 4 kA by class S1A/S2A/S4A
 * (1 kA, the lowest class, assumed). The designer should enter the device's marked value.
 */
export const DEFAULT_BREAKING_KA = {
  mcb: 6,
  rcbo: 6,
  'fuse-bs88-2': 80,
  'fuse-bs88-3': 16.5,
  'fuse-bs3036': 1,
} as const;
