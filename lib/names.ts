/**
 * The one place where the app's codes become the words a person reads: screens, the schedule
 * PDF, e-mails and the engine's check messages all name things through these functions, so a
 * code (`fuse-bs88-2`, `ring-32`) or an id never reaches a reader.
 *
 * Pure and dependency-free (type imports only), so the engine, the server and client
 * components can all use it.
 */
import type { BoardStatus, LabelStatus } from './domain';
import type {
  ArmouredCpc,
  CableKind,
  CircuitUse,
  Curve,
  LoadType,
  Method,
  SocketArrangementKind,
  SpecialLocation,
  Verdict,
} from './sizing/types';

/** Plain names of the cable kinds, as the forms and the schedule show them. */
export const CABLE_NAMES: Record<CableKind, string> = {
  'te-70': 'Flat twin and earth, 70 °C thermoplastic',
  'single-pvc-70': 'Single-core 70 °C thermoplastic, in conduit or trunking',
  'multi-pvc-70': 'Multicore 70 °C thermoplastic, non-armoured',
  'swa-xlpe-90': 'Armoured multicore, 90 °C thermosetting',
};

/** Short names of the cable kinds, for table cells and messages. */
export const CABLE_SHORT_NAMES: Record<CableKind, string> = {
  'te-70': 'twin and earth',
  'single-pvc-70': 'single-core thermoplastic',
  'multi-pvc-70': 'multicore thermoplastic',
  'swa-xlpe-90': 'armoured thermosetting',
};

/** Cable kinds as a table cell names them, with the conductor temperature and its unit. */
export const CABLE_CELL_NAMES: Record<CableKind, string> = {
  'te-70': 'Flat twin and earth 70 °C',
  'single-pvc-70': 'Single-core 70 °C',
  'multi-pvc-70': 'Multicore 70 °C',
  'swa-xlpe-90': 'Armoured XLPE 90 °C',
};

/** Short descriptions of the reference methods (BS 7671 Table 4A2). */
export const METHOD_NAMES: Record<Method, string> = {
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

export const USE_NAMES: Record<CircuitUse, string> = {
  lighting: 'Lighting',
  sockets: 'Socket-outlets',
  fixed: 'Fixed equipment',
  distribution: 'Distribution (feeds another board)',
};

/** The kind of load a way feeds (it sets the diversity allowance); shown on the schedule. */
export const LOAD_TYPE_NAMES: Record<LoadType, string> = {
  lighting: 'Lighting',
  sockets: 'Socket-outlets',
  cooker: 'Cooker',
  shower: 'Electric shower',
  'water-heater': 'Water heater',
  'storage-heating': 'Storage heating',
  'ev-charger': 'EV charger',
  motor: 'Motor',
  other: 'Other load',
};

/**
 * The kind of load of a circuit as the schedule and review show it: the one chosen, else
 * what its use makes it (the engine's rule: lighting, socket-outlets, other).
 */
export function loadTypeName(circuit: { loadType?: LoadType; use: CircuitUse }): string {
  if (circuit.use === 'distribution') return USE_NAMES.distribution;
  if (circuit.loadType) return LOAD_TYPE_NAMES[circuit.loadType];
  return circuit.use === 'lighting' || circuit.use === 'sockets' ? LOAD_TYPE_NAMES[circuit.use] : LOAD_TYPE_NAMES.other;
}

/** Where a circuit goes, for the special-location rules of BS 7671 Part 7. */
export const SPECIAL_LOCATION_NAMES: Record<SpecialLocation, string> = {
  none: 'No special location',
  'bath-shower': 'A room with a bath or shower',
  outdoors: 'Outdoors',
};

/** What an armoured cable uses as its protective conductor. */
export const ARMOURED_CPC_NAMES: Record<ArmouredCpc, string> = {
  'spare-core': 'A spare core of the cable',
  armour: 'The steel armour',
};

/** How grouped cables lie (BS 7671 Table 4C1). */
export const GROUPING_NAMES = {
  bunched: 'Bunched or enclosed',
  'single-layer': 'Single layer on a wall or floor',
} as const;

/**
 * One name per circuit field, used by the way panel and quick size alike (they share one
 * circuit-fields component), so the two screens cannot drift apart.
 */
export const CIRCUIT_FIELD_LABELS = {
  serves: 'Serves',
  use: 'Use',
  loadType: 'Kind of load',
  phases: 'Phases',
  loadGivenAs: 'Load given as',
  watts: 'Load (W)',
  powerFactor: 'Power factor',
  arrangement: 'Socket arrangement',
  floorAreaM2: 'Floor area (m²)',
  assumedA: 'Assumed load (A)',
  cable: 'Cable',
  method: 'Reference method',
  lengthM: 'Length (m)',
  ambientC: 'Ambient (°C)',
  circuits: 'Circuits grouped',
  groupedHow: 'Grouped how',
  spacingM: 'Clearance in the ground (m)',
  inDucts: 'In ducts in the ground (not laid direct)',
  insulationMm: 'Run in insulation (mm)',
  csaMm2: 'Cable size',
  armouredCpc: 'Armoured cable cpc',
  specialLocation: 'Where it goes',
  concealedInWall: 'Concealed in a wall less than 50 mm deep, without earthed protection',
  buried: 'Buried in the ground',
} as const;

/** The words for a cable size the designer fixed (checked, never changed) and "choose it". */
export const CABLE_SIZE_WORDS = {
  choose: 'Choose for me',
  fixed: (mm2: number) => `${mm2} mm² (fixed, checked)`,
} as const;

export const VERDICT_WORDS: Record<Verdict, string> = {
  passes: 'Passes',
  'near-limit': 'Near limit',
  fails: 'Fails',
};

/** Socket-outlet arrangements by their trade names ("32 A ring"). */
export const ARRANGEMENT_NAMES: Record<SocketArrangementKind, string> = {
  'ring-32': '32 A ring',
  'radial-32': '32 A radial',
  'radial-20': '20 A radial',
};

/** Every kind of device a way can hold, by its trade name. */
const DEVICE_KIND_NAMES = {
  'main-switch': 'Main switch',
  rcd: 'RCD',
  mcb: 'MCB',
  rcbo: 'RCBO',
  'fuse-bs88-2': 'BS 88-2 fuse',
  'fuse-bs88-3': 'BS 88-3 fuse',
  'fuse-bs3036': 'BS 3036 rewirable fuse',
  spd: 'SPD',
  blank: 'Blank',
} as const;

/** The name of a device kind; an unknown code is never shown as it is. */
export function deviceKindName(kind: string): string {
  return (DEVICE_KIND_NAMES as Record<string, string>)[kind] ?? 'Device';
}

/** The device kinds inside a sentence ("the main switch needs …"). */
const DEVICE_KIND_PHRASES: Record<keyof typeof DEVICE_KIND_NAMES, string> = {
  'main-switch': 'main switch',
  rcd: 'RCD',
  mcb: 'MCB',
  rcbo: 'RCBO',
  'fuse-bs88-2': 'BS 88-2 fuse carrier',
  'fuse-bs88-3': 'BS 88-3 fuse carrier',
  'fuse-bs3036': 'BS 3036 fuse carrier',
  spd: 'surge protective device',
  blank: 'blank',
};

/** A device kind inside a sentence; an unknown code is never shown as it is. */
export function deviceKindPhrase(kind: string): string {
  return (DEVICE_KIND_PHRASES as Record<string, string>)[kind] ?? 'device';
}

/** The device kinds as printed on the device's face in the drawn board: fuses by their standard alone. */
const DEVICE_FACE_NAMES: Record<keyof typeof DEVICE_KIND_NAMES, string> = {
  ...DEVICE_KIND_NAMES,
  'fuse-bs88-2': 'BS 88-2',
  'fuse-bs88-3': 'BS 88-3',
  'fuse-bs3036': 'BS 3036',
};

/** A device kind as printed on its face; an unknown code is never shown as it is. */
export function deviceFaceName(kind: string): string {
  return (DEVICE_FACE_NAMES as Record<string, string>)[kind] ?? 'Device';
}

/** What `deviceName` needs of a device. */
export interface NamedDevice {
  kind: string;
  curve?: Curve | null;
  ratingA?: number | null;
  rcdMa?: number | null;
}

/**
 * A short name of a device as a practitioner writes it: "MCB B32", "RCBO B16 30 mA",
 * "BS 88-2 fuse 32 A", "Main switch 125 A", "RCD 63 A 30 mA". `chosenRatingA` stands in for a
 * rating the engine chose.
 */
export function deviceName(device: NamedDevice, chosenRatingA?: number | null): string {
  const rating = device.ratingA ?? chosenRatingA ?? null;
  const parts = [deviceKindName(device.kind)];
  if (device.kind === 'mcb' || device.kind === 'rcbo') {
    parts.push(`${device.curve ?? ''}${rating ?? '?'}`);
  } else if (rating) {
    parts.push(`${rating} A`);
  }
  if ((device.kind === 'rcd' || device.kind === 'rcbo') && device.rcdMa) parts.push(`${device.rcdMa} mA`);
  return parts.join(' ');
}

/**
 * A volt drop limit in % for display: a whole limit as it is (3 or 5, the limits at the origin),
 * one carried down a site's tree (the origin's less what the sub-mains above used) to two
 * decimals, as the drop beside it is shown.
 */
export function vdLimitText(pct: number): string {
  return Number.isInteger(pct) ? String(pct) : pct.toFixed(2);
}

/** "way 3L2" or "way 7": how a message names a way. */
export function wayName(number: string | number): string {
  return `way ${number}`;
}

/** "Way 3L2": a way named at the start of a line or a heading. */
export function wayTitle(number: string | number): string {
  return `Way ${number}`;
}

/**
 * A text with every way id in it replaced by the way's name ("Way <id>: …" becomes
 * "Way 3L2: …"), so that an id from a message never reaches a reader. `refs` maps way ids
 * to printed way references (null for a device without one).
 */
export function nameWaysIn(text: string, refs: ReadonlyMap<string, string | null>): string {
  let out = text;
  for (const [id, ref] of refs) {
    if (!out.includes(id)) continue;
    out = out
      .replaceAll(`Way ${id}`, ref ? wayTitle(ref) : 'A device')
      .replaceAll(`way ${id}`, ref ? wayName(ref) : 'a device')
      .replaceAll(id, ref ? wayName(ref) : 'a device');
  }
  return out;
}

/** The earthing arrangements as the schedule prints them. */
export const EARTHING_NAMES: Record<string, string> = {
  'TN-S': 'TN-S',
  'TN-C-S': 'TN-C-S (PME)',
  TT: 'TT',
};

/** What the mail outbox says of a message. */
export const MAIL_STATUS_NAMES: Record<'queued' | 'sent' | 'failed', string> = {
  queued: 'Queued (will retry)',
  sent: 'Sent',
  failed: 'Failed',
};

/**
 * A board's stages. The last one says what happened: the board is issued and an installer
 * found every way's label on site matching the schedule (it is not an inspection or a test).
 */
export const BOARD_STATUS_NAMES: Record<BoardStatus, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  issued: 'Issued',
  'labels-matched': 'Labels matched on site',
};

/** The stages inside a sentence: "this board is …". */
export const BOARD_STATUS_PHRASES: Record<BoardStatus, string> = {
  draft: 'a draft',
  'in-review': 'in review',
  issued: 'issued',
  'labels-matched': 'issued, with every label matched on site',
};

export const LABEL_STATUS_NAMES: Record<LabelStatus, string> = {
  unchecked: 'Not checked',
  matches: 'Label matches',
  wrong: 'Label is wrong',
  missing: 'Label is missing',
};

/** "1 way", "3 ways": a count with its noun, singular or plural. */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** How a pair of protective devices (one above, one below a sub-main) discriminate on a fault. */
export type SelectivityOutcome = 'selective' | 'selective-up-to' | 'not-selective' | 'cannot-judge';

/** Selectivity outcomes in words ("selective up to" takes its current: see selectivityWords). */
export const SELECTIVITY_WORDS: Record<SelectivityOutcome, string> = {
  selective: 'Selective throughout',
  'selective-up-to': 'Selective up to a stated current',
  'not-selective': 'Not selective',
  'cannot-judge': 'Cannot be judged from the data held',
};

/** A selectivity outcome as a reader sees it: "Selective up to 480 A" with its current. */
export function selectivityWords(outcome: SelectivityOutcome, upToA?: number | null): string {
  if (outcome === 'selective-up-to' && upToA !== undefined && upToA !== null) {
    return `Selective up to ${Math.round(upToA)} A`;
  }
  return SELECTIVITY_WORDS[outcome];
}

/**
 * Judgements of selectivity in brief, by outcome in the order of SELECTIVITY_WORDS: "selective
 * throughout" when all are, else each outcome's count ("2 selective up to a stated current,
 * 1 cannot be judged from the data held").
 */
export function selectivitySummary(outcomes: readonly SelectivityOutcome[]): string {
  if (outcomes.every((o) => o === 'selective')) return 'selective throughout';
  return (Object.keys(SELECTIVITY_WORDS) as SelectivityOutcome[])
    .map((o) => [outcomes.filter((x) => x === o).length, SELECTIVITY_WORDS[o].toLowerCase()] as const)
    .filter(([n]) => n > 0)
    .map(([n, words]) => `${n} ${words}`)
    .join(', ');
}

/** What a board is fed from, in words: "the origin" or "Workshop DB1, way 3L2". */
export function fedFromWords(feed: { boardName: string; wayLabel: string | null } | null): string {
  if (!feed) return 'the origin (the supply intake)';
  return feed.wayLabel ? `${feed.boardName}, ${wayName(feed.wayLabel)}` : `${feed.boardName}, a way with no number`;
}

/** The supply kinds of a site's origin. */
export const SUPPLY_SOURCE_NAMES: Record<'public' | 'private', string> = {
  public: 'Public supply',
  private: 'Private supply',
};
