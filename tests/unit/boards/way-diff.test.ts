import { describe, expect, it } from 'vitest';

import type { WayInput } from '@/lib/boards/schemas';
import { diffWays } from '@/lib/boards/way-diff';

import { fixedWay } from '../supply/fixtures';

// What a save changed, for the audit trail (lib/dal/boards.ts saveBoard writes one event per way).

const way = (id: string, position: number, watts = 2300) =>
  ({ ...fixedWay(id, watts, 16, 20), rail: 0, position }) as unknown as WayInput;

describe('the ways a save changed', () => {
  it('names added, removed, moved and changed ways, and leaves an untouched one out', () => {
    const before = [way('a', 0), way('b', 1), way('c', 2)];
    const after = [way('a', 0), way('c', 1, 1150), way('d', 2)];
    expect(diffWays(before, after)).toEqual({ added: ['d'], removed: ['b'], moved: ['c'], changed: ['c'] });
  });

  it('compares stored JSON by value, whatever the order of its keys', () => {
    const stored = way('a', 0);
    const reordered = { ...stored, circuit: Object.fromEntries(Object.entries(stored.circuit!).reverse()) };
    expect(diffWays([stored], [reordered as WayInput])).toEqual({ added: [], removed: [], moved: [], changed: [] });
  });
});
