/**
 * Where devices sit on a board's DIN rails, in modules. Pure: used by the board editor to
 * draw the rails to scale, to refuse a device that does not fit, and to draw RCD brackets.
 *
 * A way's `position` is its order on its rail (0, 1, 2, ...); devices sit side by side from
 * the left end of the rail. On a three-phase board an outgoing three-pole device starts on an
 * L1 position (see layout.ts), so the phase positions skipped before it are drawn as an empty
 * gap and count against the rail's modules.
 */
import { layoutWays, railOrder, type LayoutWay, type Phase } from './layout';
import { deviceKindPhrase } from '@/lib/names';

import { rcdProtection } from './rcd-protection';

/** A device or an empty gap on one rail, `start` and `modules` in module widths. */
export type RailCell =
  | {
      type: 'device';
      id: string;
      start: number;
      modules: number;
      label: string | null;
      phases: Phase[];
    }
  | { type: 'gap'; start: number; modules: number; beforeId: string };

/** One rail as drawn: its capacity, its cells from the left, and what is used and free. */
export type RailDrawing = {
  rail: number;
  capacity: number;
  cells: RailCell[];
  used: number;
  /** Modules left at the right-hand end; negative when the rail is over-full. */
  free: number;
};

/** Modules of each rail: the enclosure's modules shared out evenly, the first rails taking any odd one. */
export function railCapacities(enclosureModules: number, rails: number): number[] {
  const count = Math.max(1, Math.floor(rails));
  const base = Math.floor(enclosureModules / count);
  const extra = enclosureModules - base * count;
  return Array.from({ length: count }, (_, i) => base + (i < extra ? 1 : 0));
}

/** Ways with positions renumbered 0, 1, 2, ... on each rail, keeping their order. */
export function normalisePositions<T extends { rail: number; position: number }>(ways: readonly T[]): T[] {
  const next = new Map<number, number>();
  return railOrder(ways).map((way) => {
    const position = next.get(way.rail) ?? 0;
    next.set(way.rail, position + 1);
    return way.position === position ? way : { ...way, position };
  });
}

/** Every rail of a board, drawn from the left: devices, phase gaps and the free modules. */
export function drawRails(phases: 1 | 3, capacities: readonly number[], ways: readonly LayoutWay[]): RailDrawing[] {
  const places = new Map(layoutWays(phases, ways).map((p) => [p.id, p]));
  const rails: RailDrawing[] = capacities.map((capacity, rail) => ({
    rail,
    capacity,
    cells: [],
    used: 0,
    free: capacity,
  }));
  for (const way of railOrder(ways)) {
    // A way on a rail the board no longer has is drawn on the last rail
    const drawing = rails[Math.min(way.rail, rails.length - 1)];
    const place = places.get(way.id);
    if (place && place.skippedBefore > 0) {
      drawing.cells.push({ type: 'gap', start: drawing.used, modules: place.skippedBefore, beforeId: way.id });
      drawing.used += place.skippedBefore;
    }
    drawing.cells.push({
      type: 'device',
      id: way.id,
      start: drawing.used,
      modules: way.device.modules,
      label: place?.label ?? null,
      phases: place?.phases ?? [],
    });
    drawing.used += way.device.modules;
  }
  for (const drawing of rails) drawing.free = drawing.capacity - drawing.used;
  return rails;
}

/** Board facts that decide whether a device fits. */
export type RailBoard = { phases: 1 | 3; enclosureModules: number; rails: number };

/** The device's kind in words, as the editor says it (lib/names.ts). */
export function kindWords(kind: string): string {
  return deviceKindPhrase(kind);
}

/**
 * Puts a way (new, or moved from elsewhere) at an index of a rail and renumbers positions.
 * `index` counts the ways already on that rail, without the moving one.
 */
export function placeWay<T extends LayoutWay>(ways: readonly T[], way: T, rail: number, index: number): T[] {
  const rest = railOrder(ways.filter((w) => w.id !== way.id));
  const onRail = rest.filter((w) => w.rail === rail);
  const at = Math.max(0, Math.min(index, onRail.length));
  // The target rail in its new order, then every rail renumbered from 0
  onRail.splice(at, 0, { ...way, rail });
  const others = rest.filter((w) => w.rail !== rail);
  return normalisePositions([...others, ...onRail.map((w, position) => ({ ...w, position }))]);
}

/**
 * Why a device cannot go where it is being put, in words the designer reads; null when it fits.
 * Refused: a three- or four-pole device on a single-phase board, a rail the board does not
 * have, and a rail left with too few free modules (counting phase positions a three-pole
 * device makes the rail skip). A change that does not make any rail fuller than it was is
 * never refused, so an already over-full board can still be tidied.
 */
export function placementProblem(
  board: RailBoard,
  ways: readonly LayoutWay[],
  way: LayoutWay,
  rail: number,
  index: number,
): string | null {
  const kind = kindWords(way.device.kind);
  if (board.phases === 1 && way.device.poles >= 3) {
    return `A ${way.device.poles}-pole ${kind} needs a three-phase supply; this board is single-phase.`;
  }
  const capacities = railCapacities(board.enclosureModules, board.rails);
  if (rail < 0 || rail >= capacities.length) {
    return `This board has ${capacities.length} rail${capacities.length === 1 ? '' : 's'}; there is no rail ${rail + 1}.`;
  }
  const before = drawRails(board.phases, capacities, ways);
  const after = drawRails(board.phases, capacities, placeWay(ways, way, rail, index));
  for (const drawing of after) {
    const was = before[drawing.rail];
    if (drawing.free >= 0 || drawing.used <= was.used) continue;
    // How much room the change needs on this rail, against what the rail had without the way
    const without = drawRails(
      board.phases,
      capacities,
      ways.filter((w) => w.id !== way.id),
    )[drawing.rail];
    const needed = drawing.used - without.used;
    const free = Math.max(0, without.free);
    const skipped = needed - way.device.modules;
    const extra =
      skipped > 0
        ? ` (${way.device.modules} for the device and ${skipped} phase position${skipped === 1 ? '' : 's'} left empty so that it starts on L1)`
        : '';
    return `Too few free modules on rail ${drawing.rail + 1}: the ${kind} needs ${needed}${extra} and ${free} ${free === 1 ? 'is' : 'are'} free.`;
  }
  return null;
}

/**
 * The ways laid out again, in their rail order, over rails of the given capacities: each rail
 * is filled from the left until the next device does not fit, then the next rail is started.
 * `fits` is false when the last rail overflows (the ways are then all placed anyway).
 */
export function reflowWays<T extends LayoutWay>(
  phases: 1 | 3,
  capacities: readonly number[],
  ways: readonly T[],
): { ways: T[]; fits: boolean } {
  const placed: T[] = [];
  let rail = 0;
  let position = 0;
  for (const way of railOrder(ways)) {
    let candidate = { ...way, rail, position };
    const overflows = () => {
      const drawing = drawRails(phases, capacities, [...placed, candidate])[rail];
      return drawing.used > drawing.capacity;
    };
    // Start the next rail when this one is full, unless it is the last
    if (overflows() && rail < capacities.length - 1 && position > 0) {
      rail += 1;
      position = 0;
      candidate = { ...way, rail, position };
    }
    placed.push(candidate);
    position += 1;
  }
  const fits = drawRails(phases, capacities, placed).every((d) => d.free >= 0);
  return { ways: placed, fits };
}

/** The ways an RCD protects, and the run of the rail its bracket spans. */
export type RcdGroup = {
  rcdId: string;
  /** Ways (spare ways included) that take their RCD protection from this RCD; RCBOs protect themselves. */
  protectedIds: string[];
  /** Every device from the RCD to the last way it protects, the RCD included. */
  spanIds: string[];
};

/**
 * Which ways each RCD protects, by the one rule of `rcdProtection` (rcd-protection.ts): the
 * ways after it, in rail order across rails, until the next RCD or main switch; an RCBO
 * protects itself.
 */
export function rcdGroups(ways: readonly LayoutWay[]): RcdGroup[] {
  const protection = rcdProtection(ways);
  const ordered = railOrder(ways);
  const groups: RcdGroup[] = [];
  ordered.forEach((way, i) => {
    if (way.device.kind !== 'rcd') return;
    const covered = (w: LayoutWay) => {
      const p = protection.get(w.id);
      return p?.by === 'rcd' && p.rcdId === way.id;
    };
    const protectedIds = ordered.filter(covered).map((w) => w.id);
    // The bracket runs from the RCD to the last way it protects (an RCBO inside it is drawn under it)
    let last = i;
    ordered.forEach((w, j) => {
      if (covered(w)) last = j;
    });
    groups.push({ rcdId: way.id, protectedIds, spanIds: ordered.slice(i, last + 1).map((w) => w.id) });
  });
  return groups;
}
