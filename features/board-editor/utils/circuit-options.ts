/**
 * Rated breaking capacities offered for circuit-breakers, kA (common BS EN 60898-1 values,
 * from memory; the manufacturer's figure is the one that counts).
 */
export const BREAKING_KA = [3, 4.5, 6, 10, 15, 25] as const;
