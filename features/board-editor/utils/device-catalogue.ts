import { deviceFaceName } from '@/lib/names';
import type { DeviceOnRail } from '@/lib/sizing';

/** The kinds of device the tray offers (`TRAY` has them in the order it shows them). */
export type TrayKind = 'main-switch' | 'rcd' | 'mcb' | 'rcbo' | 'fuse-bs88-2' | 'fuse-bs3036' | 'spd' | 'blank';

/** A tray item's chosen variant: every field the tray lets the designer pick. */
export type TrayChoice = {
  poles: 1 | 2 | 3 | 4;
  curve?: 'B' | 'C' | 'D';
  ratingA?: number;
  rcdMa?: number;
  rcdType?: 'AC' | 'A' | 'F' | 'B';
};

/** What the tray offers for one kind: its name, a one-line purpose and the variants. */
export type TrayEntry = {
  kind: TrayKind;
  name: string;
  purpose: string;
  poles: readonly (1 | 2 | 3 | 4)[];
  curves?: readonly ('B' | 'C' | 'D')[];
  ratings?: readonly number[];
  rcdMa?: readonly number[];
  rcdTypes?: readonly ('AC' | 'A' | 'F' | 'B')[];
  initial: TrayChoice;
};

// Ratings offered in the tray. Circuit-breakers: the BS EN 60898-1 / 61009-1 preferred values
// (lib/sizing/tables/ratings.ts) within the ranges the product offers; fuses: the BS 88-2 and
// BS 3036 values of that table up to 100 A; switches and RCDs: common enclosure ratings.
const MCB_RATINGS = [6, 10, 16, 20, 25, 32, 40, 50, 63] as const;
const RCBO_RATINGS = [6, 10, 16, 20, 25, 32, 40] as const;

const TRAY: readonly TrayEntry[] = [
  {
    kind: 'main-switch',
    name: 'Main switch',
    purpose: 'Isolates the board',
    poles: [2, 4],
    ratings: [63, 80, 100, 125],
    initial: { poles: 2, ratingA: 100 },
  },
  {
    kind: 'rcd',
    name: 'RCD',
    purpose: 'Protects the ways after it',
    poles: [2, 4],
    ratings: [40, 63, 80, 100],
    rcdMa: [30, 100, 300],
    rcdTypes: ['AC', 'A', 'F', 'B'],
    initial: { poles: 2, ratingA: 63, rcdMa: 30, rcdType: 'A' },
  },
  {
    kind: 'mcb',
    name: 'MCB',
    purpose: 'Circuit-breaker',
    poles: [1, 3],
    curves: ['B', 'C', 'D'],
    ratings: MCB_RATINGS,
    initial: { poles: 1, curve: 'B', ratingA: 16 },
  },
  {
    kind: 'rcbo',
    name: 'RCBO',
    purpose: 'Breaker with its own 30 mA RCD',
    poles: [1],
    curves: ['B', 'C'],
    ratings: RCBO_RATINGS,
    initial: { poles: 1, curve: 'B', ratingA: 16, rcdMa: 30, rcdType: 'A' },
  },
  {
    kind: 'fuse-bs88-2',
    name: 'Fuse carrier BS 88-2',
    purpose: 'Cartridge fuse, gG',
    poles: [1, 3],
    ratings: [6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100],
    initial: { poles: 1, ratingA: 32 },
  },
  {
    kind: 'fuse-bs3036',
    name: 'Fuse carrier BS 3036',
    purpose: 'Rewirable fuse (existing boards)',
    poles: [1],
    ratings: [5, 15, 20, 30, 45, 60, 100],
    initial: { poles: 1, ratingA: 30 },
  },
  { kind: 'spd', name: 'SPD', purpose: 'Surge protection', poles: [2, 4], initial: { poles: 2 } },
  { kind: 'blank', name: 'Blank', purpose: 'Covers a spare module', poles: [1], initial: { poles: 1 } },
];

/**
 * On a three-phase board the tray offers what such a board takes first: four- and
 * three-pole main switches (TP&N, TP), four-pole RCDs and SPDs, three-pole MCBs and BS 88-2
 * fuse carriers, each still offered single- or double-pole after them (common practice).
 */
const THREE_PHASE_POLES: Partial<Record<TrayKind, readonly (1 | 2 | 3 | 4)[]>> = {
  'main-switch': [4, 3],
  rcd: [4, 2],
  mcb: [3, 1],
  'fuse-bs88-2': [3, 1],
  spd: [4, 2],
};

/** The tray for a board of one or three phases: its entries with the board's poles first. */
export function trayFor(phases: 1 | 3): readonly TrayEntry[] {
  if (phases === 1) return TRAY;
  return TRAY.map((e) => {
    const poles = THREE_PHASE_POLES[e.kind];
    return poles ? { ...e, poles, initial: { ...e.initial, poles: poles[0] } } : e;
  });
}

/** Each kind's first choice in the tray of a board of one or three phases. */
export function initialChoices(phases: 1 | 3): Record<TrayKind, TrayChoice> {
  return Object.fromEntries(trayFor(phases).map((e) => [e.kind, e.initial])) as Record<TrayKind, TrayChoice>;
}

/** The tray entry of a kind (for a board of `phases`, single-phase unless given). */
export function trayEntry(kind: TrayKind, phases: 1 | 3 = 1): TrayEntry {
  return trayFor(phases).find((e) => e.kind === kind)!;
}

/** The device a tray choice puts on the rail: modules equal its poles (1–4 modules). */
export function deviceFromChoice(kind: TrayKind, choice: TrayChoice): DeviceOnRail {
  const base = { kind, poles: choice.poles, modules: choice.poles } as DeviceOnRail;
  switch (kind) {
    case 'mcb':
    case 'rcbo': {
      const breaker = { ...base, curve: choice.curve ?? 'B', ratingA: choice.ratingA ?? null, breakingKa: 6 };
      return kind === 'mcb' ? breaker : { ...breaker, rcdMa: choice.rcdMa ?? 30, rcdType: choice.rcdType ?? 'A' };
    }
    case 'rcd':
      return { ...base, ratingA: choice.ratingA ?? 63, rcdMa: choice.rcdMa ?? 30, rcdType: choice.rcdType ?? 'A' };
    case 'main-switch':
      return { ...base, ratingA: choice.ratingA ?? 100 };
    case 'fuse-bs88-2':
    case 'fuse-bs3036':
      return { ...base, ratingA: choice.ratingA ?? null };
    default:
      return base;
  }
}

/** The rating as printed on the device face: "B16", "C32", "63 A", "30 mA", or "" when not set. */
export function ratingText(device: DeviceOnRail): string {
  if (device.kind === 'mcb' || device.kind === 'rcbo') {
    return `${device.curve ?? ''}${device.ratingA ?? '?'}`;
  }
  if (device.kind === 'blank' || device.kind === 'spd') return '';
  return device.ratingA ? `${device.ratingA} A` : '? A';
}

/** The device in a few words: "MCB B16", "RCD 63 A 30 mA type A", "3-pole MCB C20". */
export function deviceWords(device: DeviceOnRail): string {
  const poles =
    device.poles >= 3 && (device.kind === 'mcb' || device.kind.startsWith('fuse')) ? `${device.poles}-pole ` : '';
  const parts = [`${poles}${deviceFaceName(device.kind)}`];
  if (device.kind === 'main-switch' || device.kind === 'rcd' || device.kind === 'spd') parts.push(`${device.poles}P`);
  const rating = ratingText(device);
  if (rating) parts.push(rating);
  if ((device.kind === 'rcd' || device.kind === 'rcbo') && device.rcdMa) {
    parts.push(`${device.rcdMa} mA${device.rcdType ? ` type ${device.rcdType}` : ''}`);
  }
  return parts.join(' ');
}
