import type { Announcements, ScreenReaderInstructions } from '@dnd-kit/core';

import { wayLabelMap } from '@/lib/boards/layout';
import type { BoardSettings } from '@/lib/boards/schemas';

import type { EditorWay } from '../types/draft';
import { wayName } from './describe';
import { deviceWords } from './device-catalogue';
import { dropProblem, dropTarget, type ActiveData, type OverData } from './drop-target';

/** What the screen reader is told on reaching a draggable device. Our words. */
export const SCREEN_READER_INSTRUCTIONS: ScreenReaderInstructions = {
  draggable:
    'To move this device, press Space to pick it up. Left and right arrows move it along the rail, up and down move it to another rail or to the bin. Press Space again to put it down here, or Escape to leave it where it was. Enter opens it in the way panel; Delete removes it, and Control Z brings it back.',
};

type Getter = () => { settings: BoardSettings | null; ways: EditorWay[] };

/**
 * Spoken feedback while dragging with the keyboard (or pointer), in Boardwright's own words:
 * what was picked up, where it would go (and whether it fits), and what happened on release.
 * `dropped` gives the sentence the editor wrote for the last drop, before it changed the draft.
 */
export function boardAnnouncements(
  get: Getter,
  dropped: () => string | null,
): Announcements & { describeDrop: (active: ActiveData, over: OverData) => string } {
  const describe = (active: ActiveData) => {
    const { settings, ways } = get();
    if (!active || !settings) return { name: 'the device', movingId: null };
    if (active.from === 'tray') return { name: `a new ${deviceWords(active.device)}`, movingId: null };
    const way = ways.find((w) => w.id === active.wayId);
    const label = wayLabelMap(settings.phases, ways).get(active.wayId);
    const name = way ? `${label ? `way ${label}, ` : ''}${deviceWords(way.device)}` : 'the way';
    return { name, movingId: active.wayId };
  };

  const where = (active: ActiveData, over: OverData, past: boolean): string => {
    const { settings, ways } = get();
    const { name, movingId } = describe(active);
    const target = dropTarget(ways, movingId, over);
    if (!target || !settings) return past ? `${name} was put back; nothing changed.` : `${name} is not over the board.`;
    if (target.kind === 'bin') {
      if (!movingId) return past ? `${name} was not added.` : 'Over the bin: a new device is simply not added.';
      return past
        ? `${name} was removed. Control Z brings it back.`
        : `Over the bin: putting ${name} down here removes it.`;
    }
    if (target.stays)
      return past ? `${name} was put down where it was; nothing changed.` : `${name} would stay where it is.`;
    const labels = wayLabelMap(settings.phases, ways);
    const rail = settings.rails > 1 ? ` of rail ${target.rail + 1}` : '';
    const wayOf = (id: string) => ways.find((w) => w.id === id)!;
    const named = (id: string) => wayName(wayOf(id), labels.get(id));
    const spot = target.afterId
      ? `after ${named(target.afterId)}${rail}`
      : target.beforeId
        ? `before ${named(target.beforeId)}${rail}`
        : `at the end${rail || ' of the rail'}`;
    const problem = active ? dropProblem(settings, ways, active, target) : null;
    if (problem)
      return past ? `${name} was not placed. ${problem}` : `${name} would go ${spot}, but it does not fit. ${problem}`;
    return past ? `${name} was put down ${spot}.` : `${name} would go ${spot}.`;
  };

  return {
    describeDrop: (active: ActiveData, over: OverData) => where(active, over, true),
    onDragStart: ({ active }) => `Picked up ${describe(active.data.current as ActiveData).name}.`,
    // Silent while over nothing or over its own place, so "Picked up …" is not cut short
    onDragOver: ({ active, over }) => {
      if (!over || over.id === active.id) return undefined;
      return where(active.data.current as ActiveData, over.data.current as OverData, false);
    },
    onDragEnd: ({ active, over }) =>
      dropped() ?? where(active.data.current as ActiveData, over?.data.current as OverData, true),
    onDragCancel: ({ active }) =>
      `${describe(active.data.current as ActiveData).name} was put back where it was; nothing changed.`,
  };
}
