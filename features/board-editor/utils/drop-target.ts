import { railOrder } from '@/lib/boards/layout';
import { placementProblem } from '@/lib/boards/rail';
import type { BoardSettings } from '@/lib/boards/schemas';
import type { DeviceOnRail } from '@/lib/sizing';

import type { EditorWay } from '../types/draft';

/** What is being dragged, from the draggables' data. */
export type ActiveData = { from: 'tray'; device: DeviceOnRail } | { from: 'rail'; wayId: string } | undefined;

/** What a drag is over, from the drop zones' data. */
export type OverData =
  { to: 'free'; rail: number } | { to: 'bin' } | { from: 'rail'; wayId: string; rail: number } | undefined;

/** Where a drop would put the device: a place on a rail, the bin, or nowhere. */
type DropTarget =
  | { kind: 'place'; rail: number; index: number; beforeId: string | null; afterId?: string; stays?: boolean }
  | { kind: 'bin' }
  | null;

/**
 * Where a device dropped on `over` goes. On a way: before it, or after it when the way being
 * moved came from its left on the same rail (so moving right one step swaps the two). On the
 * free modules: the end of that rail. `movingId` is the way being moved (null for a new device).
 * The index counts the rail's ways without the moving one, as `placeWay` expects.
 */
export function dropTarget(ways: readonly EditorWay[], movingId: string | null, over: OverData): DropTarget {
  if (!over) return null;
  if ('to' in over && over.to === 'bin') return { kind: 'bin' };
  const rest = railOrder(ways.filter((w) => w.id !== movingId));
  if ('to' in over && over.to === 'free') {
    return { kind: 'place', rail: over.rail, index: rest.filter((w) => w.rail === over.rail).length, beforeId: null };
  }
  if (!('wayId' in over)) return null;
  const target = ways.find((w) => w.id === over.wayId);
  if (!target) return null;
  const moving = movingId ? ways.find((w) => w.id === movingId) : undefined;
  if (moving && moving.id === target.id) {
    const index = rest.filter((w) => w.rail === moving.rail && w.position < moving.position).length;
    return { kind: 'place', rail: moving.rail, index, beforeId: null, stays: true };
  }
  const onRail = rest.filter((w) => w.rail === target.rail);
  const at = onRail.findIndex((w) => w.id === target.id);
  const fromLeft = moving && moving.rail === target.rail && moving.position < target.position;
  const index = fromLeft ? at + 1 : at;
  return fromLeft
    ? { kind: 'place', rail: target.rail, index, beforeId: onRail[at + 1]?.id ?? null, afterId: target.id }
    : { kind: 'place', rail: target.rail, index, beforeId: target.id };
}

/** Why the dragged device would not fit at the place `target`, or null when it fits. */
export function dropProblem(
  settings: BoardSettings,
  ways: readonly EditorWay[],
  active: NonNullable<ActiveData>,
  target: Extract<DropTarget, { kind: 'place' }>,
): string | null {
  const way =
    active.from === 'rail'
      ? ways.find((w) => w.id === active.wayId)
      : { id: '(new)', rail: target.rail, position: target.index, device: active.device };
  return way ? placementProblem(settings, ways, way, target.rail, target.index) : null;
}
