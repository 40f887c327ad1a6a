import { CABLE_PROPERTIES } from '@/lib/sizing';

/** Cable kinds in the order the way panel lists them, with the panel's words. */
export const CABLE_OPTIONS = (Object.keys(CABLE_PROPERTIES) as (keyof typeof CABLE_PROPERTIES)[]).map((kind) => ({
  value: kind,
  label: CABLE_PROPERTIES[kind].label,
}));

/**
 * Short words for the installation reference methods (BS 7671 Appendix 4, Table 4A2 gives
 * the full descriptions; these are our summaries, from memory of that table).
 */
export const METHOD_WORDS: Record<string, string> = {
  A: 'A: in conduit in a thermally insulated wall',
  B: 'B: in conduit or trunking on a wall',
  C: 'C: clipped direct',
  D: 'D: in the ground or in ducts in the ground',
  E: 'E: on a perforated tray or in free air',
  '100': '100: above a ceiling, insulation up to 100 mm',
  '101': '101: above a ceiling, insulation over 100 mm',
  '102': '102: in an insulated stud wall, touching the inner skin',
  '103': '103: in an insulated stud wall, not touching the inner skin',
};

export const USE_WORDS = {
  lighting: 'Lighting',
  sockets: 'Socket-outlets',
  fixed: 'Fixed equipment',
  distribution: 'Feeds another board',
} as const;

export const ARRANGEMENT_WORDS = {
  'ring-32': 'Ring, 32 A',
  'radial-32': 'Radial, 32 A',
  'radial-20': 'Radial, 20 A',
} as const;

/**
 * Rated breaking capacities offered for circuit-breakers, kA (common BS EN 60898-1 values,
 * from memory; the manufacturer's figure is the one that counts).
 */
export const BREAKING_KA = [3, 4.5, 6, 10, 15, 25] as const;
