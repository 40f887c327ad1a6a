/**
 * Way numbering on the rail. Pure: used by the editor, the sizing route, the schedule
 * and the label walk, so every screen and print numbers a way the same way.
 *
 * Single-phase boards number each outgoing device 1, 2, 3, ... Three-phase boards number
 * per phase position, the trade's convention: 1L1, 1L2, 1L3, 2L1, ... A three- or four-pole
 * outgoing device takes the three phase positions of one way and starts on an L1 position.
 * Main switches, RCDs and SPDs sit on the rail but carry no way number.
 */
export type Phase = 'L1' | 'L2' | 'L3';

export type LayoutDevice = { kind: string; poles: number; modules: number };
export type LayoutWay = { id: string; rail: number; position: number; device: LayoutDevice };

export type WayPlace = {
  id: string;
  /** The printed way reference (e.g. "7", "3L2", "2L1–L3"), null for devices without one. */
  label: string | null;
  wayNumber: number | null;
  phases: Phase[];
  /** Phase positions left empty before this device so that it starts on L1. */
  skippedBefore: number;
};

const NUMBERED = new Set(['mcb', 'rcbo', 'fuse-bs88-2', 'fuse-bs88-3', 'fuse-bs3036', 'blank']);
const PHASES: Phase[] = ['L1', 'L2', 'L3'];

/** True for the devices that occupy a numbered way. */
export function isOutgoing(kind: string): boolean {
  return NUMBERED.has(kind);
}

/** The ways in rail order: by rail, then position. */
export function railOrder<T extends { rail: number; position: number }>(ways: readonly T[]): T[] {
  return ways.slice().sort((a, b) => a.rail - b.rail || a.position - b.position);
}

/** Way numbers and phases for every device, in rail order. */
export function layoutWays(phases: 1 | 3, ways: readonly LayoutWay[]): WayPlace[] {
  const places: WayPlace[] = [];
  let next = 0;
  for (const way of railOrder(ways)) {
    if (!isOutgoing(way.device.kind)) {
      places.push({ id: way.id, label: null, wayNumber: null, phases: [], skippedBefore: 0 });
      continue;
    }
    if (phases === 1) {
      next += 1;
      places.push({ id: way.id, label: String(next), wayNumber: next, phases: ['L1'], skippedBefore: 0 });
      continue;
    }
    if (way.device.poles >= 3) {
      const skipped = (3 - (next % 3)) % 3;
      next += skipped;
      const wayNumber = next / 3 + 1;
      next += 3;
      places.push({
        id: way.id,
        label: `${wayNumber}L1–L3`,
        wayNumber,
        phases: [...PHASES],
        skippedBefore: skipped,
      });
      continue;
    }
    const wayNumber = Math.floor(next / 3) + 1;
    const phase = PHASES[next % 3];
    next += 1;
    places.push({ id: way.id, label: `${wayNumber}${phase}`, wayNumber, phases: [phase], skippedBefore: 0 });
  }
  return places;
}

/** Each way's printed reference (null for a device without one), by way id. */
export function wayLabelMap(phases: 1 | 3, ways: readonly LayoutWay[]): Map<string, string | null> {
  return new Map(layoutWays(phases, ways).map((p) => [p.id, p.label]));
}

/** Phase positions a board's ways take (three-phase) or ways (single-phase). */
export function positionsUsed(phases: 1 | 3, ways: readonly LayoutWay[]): number {
  const places = layoutWays(phases, ways);
  return places.reduce((n, p) => n + p.skippedBefore + (p.label ? (phases === 3 ? p.phases.length : 1) : 0), 0);
}
