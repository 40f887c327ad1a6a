import type { CableKind, CircuitUse, Method, Verdict } from '@/lib/sizing';

/** Plain names of the cable kinds, as the forms and the schedule show them. */
export const CABLE_LABELS: Record<CableKind, string> = {
  'te-70': 'Flat twin and earth, 70 °C thermoplastic',
  'single-pvc-70': 'Single-core 70 °C thermoplastic, in conduit or trunking',
  'multi-pvc-70': 'Multicore 70 °C thermoplastic, non-armoured',
  'swa-xlpe-90': 'Armoured multicore, 90 °C thermosetting',
};

/** Short descriptions of the reference methods (BS 7671 Table 4A2). */
export const METHOD_LABELS: Record<Method, string> = {
  A: 'A: in conduit in a thermally insulating wall',
  B: 'B: in conduit or trunking on a wall',
  C: 'C: clipped direct',
  D: 'D: in the ground or in ducts in the ground',
  E: 'E: in free air, on a perforated tray or ladder',
  '100': '100: above a plasterboard ceiling, insulation up to 100 mm',
  '101': '101: above a plasterboard ceiling, insulation over 100 mm',
  '102': '102: in a stud wall, touching the inner surface',
  '103': '103: in a stud wall, not touching the inner surface',
};

export const USE_LABELS: Record<CircuitUse, string> = {
  lighting: 'Lighting',
  sockets: 'Socket-outlets',
  fixed: 'Fixed equipment',
  distribution: 'Distribution (sub-main)',
};

export const VERDICT_WORDS: Record<Verdict, string> = {
  passes: 'Passes',
  'near-limit': 'Near limit',
  fails: 'Fails',
};

export const DEVICE_KIND_LABELS: Record<string, string> = {
  mcb: 'MCB',
  rcbo: 'RCBO',
  'fuse-bs88-2': 'Fuse BS 88-2',
  'fuse-bs88-3': 'Fuse BS 88-3',
  'fuse-bs3036': 'Rewirable fuse BS 3036',
};
