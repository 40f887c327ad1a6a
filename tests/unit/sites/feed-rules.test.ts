import { describe, expect, it } from 'vitest';

import type { BoardFeed, WayInput } from '@/lib/boards/schemas';
import { feedLoop, unfitReason } from '@/lib/sites/feed-rules';

import { fixedWay } from '../supply/fixtures';

// The feed rules of lib/dal/site-feed.ts, without the database: a sub-main is a distribution
// circuit on a protective device, with the phases of the board it feeds (BS 7671:2018 Part 2,
// "distribution circuit"; one phase of a three-phase way cannot supply a three-phase board).

const fixed = { ...fixedWay('w1', 2300, 16, 20), rail: 0, position: 0 } as unknown as WayInput;
const subMain = (phases: 1 | 3): WayInput => ({
  ...fixed,
  device: { kind: 'mcb', poles: phases === 3 ? 3 : 1, modules: phases, curve: 'C', ratingA: 32 },
  circuit: { ...fixed.circuit!, use: 'distribution', phases },
});

describe('whether a way may feed a board', () => {
  it('a single-phase distribution way on an MCB feeds a single-phase board', () => {
    expect(unfitReason(subMain(1), 'Way 1', 'Finishing room', 1)).toBeNull();
  });

  it('a final circuit is refused until its use is distribution', () => {
    expect(unfitReason(fixed, 'Way 1', 'Finishing room', 1)).toMatch(/set its use to distribution/);
  });

  it('a way without a circuit is refused', () => {
    expect(unfitReason({ ...subMain(1), circuit: null }, 'Way 1', 'Finishing room', 1)).toMatch(
      /needs a protective device and a circuit/,
    );
  });

  it('the phases must agree both ways', () => {
    expect(unfitReason(subMain(1), 'Way 1', 'Machine shop', 3)).toMatch(/three-phase sub-main/);
    expect(unfitReason(subMain(3), 'Way 1', 'Flat', 1)).toMatch(/single-phase way/);
    expect(unfitReason(subMain(3), 'Way 1', 'Machine shop', 3)).toBeNull();
  });
});

describe('a loop of feeds', () => {
  const board = (id: string, feed: BoardFeed) => ({ id, name: id.toUpperCase(), feed });
  const fromWay = (boardId: string): BoardFeed => ({
    from: 'way',
    boardId,
    wayId: `${boardId}-w`,
    designCurrentOverride: null,
    upstreamRcdTimeDelayed: false,
  });

  it('feeding a board from a board it feeds closes a loop, named as the power would flow', () => {
    // a (origin) feeds b, b feeds c: feeding a from c closes a → b → c → a
    const byId = new Map([
      ['a', board('a', { from: 'origin' })],
      ['b', board('b', fromWay('a'))],
      ['c', board('c', fromWay('b'))],
    ]);
    expect(feedLoop(byId, 'a', 'c')).toEqual([
      { boardId: 'a', name: 'A' },
      { boardId: 'b', name: 'B' },
      { boardId: 'c', name: 'C' },
    ]);
  });

  it('feeding from a board on another branch is no loop', () => {
    const byId = new Map([
      ['a', board('a', { from: 'origin' })],
      ['b', board('b', fromWay('a'))],
      ['c', board('c', fromWay('a'))],
    ]);
    expect(feedLoop(byId, 'c', 'b')).toBeNull();
  });

  it('a loop above that does not pass through the board is not reported as its loop (and ends)', () => {
    const byId = new Map([
      ['x', board('x', fromWay('y'))],
      ['y', board('y', fromWay('x'))],
      ['c', board('c', { from: 'origin' })],
    ]);
    expect(feedLoop(byId, 'c', 'x')).toBeNull();
  });
});
