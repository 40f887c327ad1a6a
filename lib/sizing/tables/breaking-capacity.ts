/**
 * Typical rated breaking capacity, kA, used when the input does not give one.
 * Typical catalogue values, not a BS 7671 table: circuit-breakers and RCBOs to BS EN 60898 /
 * 61009 are commonly 6 kA or 10 kA (6 assumed); BS 88-2 gG fuses 80 kA; BS 88-3 fuses
 * 16.5 kA; BS 3036 semi-enclosed fuses 1, 2 or 4 kA by class S1A/S2A/S4A (1 kA, the lowest
 * class, assumed). CONFIRMED against a public copy of a guide to the wiring regulations (its
 * table of fault ratings of common devices: BS 3036 S1A 1, S2A 2, S4A 4 kA; BS 1361/BS 88-3
 * type I 16.5 kA; BS 88 part 6 80 kA at 400 V). The designer should enter the marked value.
 * A board may declare its assembly's rated conditional short-circuit current instead
 * (BS EN 61439-3; BS 7671 536.4.201, from memory), which the check then uses.
 */
export const DEFAULT_BREAKING_KA = {
  mcb: 6,
  rcbo: 6,
  'fuse-bs88-2': 80,
  'fuse-bs88-3': 16.5,
  'fuse-bs3036': 1,
} as const;
