/**
 * The one place where the app's codes become the words a person reads: screens, the schedule
 * PDF, e-mails and the engine's check messages all name things through these functions, so a
 * code (`fuse-bs88-2`, `ring-32`) or an id never reaches a reader.
 *
 * Pure and dependency-free (type imports only), so the engine, the server and client
 * components can all use it.
 */
import type { BoardStatus, LabelStatus, Role } from './domain';
import type {
  CableKind,
  CircuitUse,
  Curve,
  Method,
  SocketArrangementKind,
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
  distribution: 'Distribution (sub-main)',
};

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
export const DEVICE_KIND_NAMES = {
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
export type DeviceKindName = keyof typeof DEVICE_KIND_NAMES;

/** The name of a device kind; an unknown code is never shown as it is. */
export function deviceKindName(kind: string): string {
  return (DEVICE_KIND_NAMES as Record<string, string>)[kind] ?? 'Device';
}

/** The device kinds inside a sentence ("the main switch needs …"). */
const DEVICE_KIND_PHRASES: Record<DeviceKindName, string> = {
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

export const ROLE_NAMES: Record<Role, string> = {
  admin: 'Admin',
  designer: 'Designer',
  inspector: 'Inspector',
  installer: 'Installer',
};
