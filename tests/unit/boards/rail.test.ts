import { describe, expect, it } from 'vitest';

import { layoutWays, type LayoutWay } from '@/lib/boards/layout';
import {
  drawRails,
  normalisePositions,
  placementProblem,
  placeWay,
  railCapacities,
  rcdGroups,
  reflowWays,
} from '@/lib/boards/rail';

// Small builders: a way is a device of a kind, poles and modules at a place on a rail.
let n = 0;
function way(kind: string, poles = 1, modules = poles, rail = 0, position = n): LayoutWay {
  n += 1;
  return { id: `w${n}`, rail, position, device: { kind, poles, modules } };
}
function row(...ways: LayoutWay[]): LayoutWay[] {
  return ways.map((w, i) => ({ ...w, position: i }));
}

describe('railCapacities', () => {
  it('shares the enclosure evenly and gives an odd module to the first rail', () => {
    expect(railCapacities(36, 1)).toEqual([36]);
    expect(railCapacities(36, 2)).toEqual([18, 18]);
    expect(railCapacities(19, 2)).toEqual([10, 9]);
    expect(railCapacities(19, 2).reduce((a, b) => a + b, 0)).toBe(19);
  });
});

describe('normalisePositions', () => {
  it('renumbers each rail from 0 in the existing order', () => {
    const ways = [way('mcb', 1, 1, 1, 7), way('mcb', 1, 1, 0, 5), way('mcb', 1, 1, 1, 2)];
    const out = normalisePositions(ways);
    expect(out.map((w) => [w.id, w.rail, w.position])).toEqual([
      [ways[1].id, 0, 0],
      [ways[2].id, 1, 0],
      [ways[0].id, 1, 1],
    ]);
  });
});

describe('drawRails', () => {
  it('lays single-phase devices side by side and leaves the rest of the rail free', () => {
    const ways = row(way('main-switch', 2), way('rcd', 2), way('mcb'), way('mcb'), way('blank'));
    const [rail] = drawRails(1, [18], ways);
    expect(rail.cells.map((c) => [c.type, c.start, c.modules])).toEqual([
      ['device', 0, 2],
      ['device', 2, 2],
      ['device', 4, 1],
      ['device', 5, 1],
      ['device', 6, 1],
    ]);
    expect(rail.used).toBe(7);
    expect(rail.free).toBe(11);
  });

  it('leaves the phase positions empty before a three-pole device that would not start on L1', () => {
    // One single-pole way takes 1L1; a three-pole device must then start at 2L1, so 1L2 and
    // 1L3 stay empty: two modules of gap.
    const ways = row(way('mcb', 1), way('mcb', 3));
    const [rail] = drawRails(3, [12], ways);
    expect(rail.cells.map((c) => [c.type, c.start, c.modules])).toEqual([
      ['device', 0, 1],
      ['gap', 1, 2],
      ['device', 3, 3],
    ]);
    const labels = rail.cells.flatMap((c) => (c.type === 'device' ? [c.label] : []));
    expect(labels).toEqual(['1L1', '2L1–L3']);
    expect(rail.free).toBe(12 - 6);
  });

  it('numbers across rails in rail order', () => {
    const ways = [way('mcb', 1, 1, 1, 0), way('mcb', 1, 1, 0, 0), way('mcb', 1, 1, 0, 1)];
    const rails = drawRails(1, [6, 6], ways);
    const label = (r: number) => rails[r].cells.map((c) => (c.type === 'device' ? c.label : null));
    expect(label(0)).toEqual(['1', '2']);
    expect(label(1)).toEqual(['3']);
  });
});

describe('placeWay', () => {
  it('inserts a new way before the one at the index and renumbers the rail', () => {
    const ways = row(way('mcb'), way('mcb'), way('mcb'));
    const added = way('rcbo');
    const out = placeWay(ways, added, 0, 1);
    expect(out.map((w) => w.id)).toEqual([ways[0].id, added.id, ways[1].id, ways[2].id]);
    expect(out.map((w) => w.position)).toEqual([0, 1, 2, 3]);
  });

  it('moves a way between rails and closes the gap it leaves', () => {
    const a = way('mcb', 1, 1, 0, 0);
    const b = way('mcb', 1, 1, 0, 1);
    const c = way('mcb', 1, 1, 1, 0);
    const out = placeWay([a, b, c], a, 1, 1);
    expect(out.map((w) => [w.id, w.rail, w.position])).toEqual([
      [b.id, 0, 0],
      [c.id, 1, 0],
      [a.id, 1, 1],
    ]);
  });
});

describe('placementProblem', () => {
  const single = { phases: 1 as const, enclosureModules: 6, rails: 1 };
  const three = { phases: 3 as const, enclosureModules: 9, rails: 1 };

  it('accepts a device that fits in the free modules', () => {
    const ways = row(way('main-switch', 2), way('mcb'));
    expect(placementProblem(single, ways, way('mcb'), 0, 2)).toBeNull();
  });

  it('refuses a three-pole device on a single-phase board, saying why', () => {
    const msg = placementProblem(single, [], way('mcb', 3), 0, 0);
    expect(msg).toMatch(/3-pole MCB needs a three-phase supply/);
  });

  it('refuses a device wider than the free modules, with both figures', () => {
    // 2 + 2 + 1 = 5 of 6 used: a 2-module RCD needs 2 and only 1 is free.
    const ways = row(way('main-switch', 2), way('rcd', 2), way('mcb'));
    const msg = placementProblem(single, ways, way('rcd', 2), 0, 3);
    expect(msg).toBe('Too few free modules on rail 1: the RCD needs 2 and 1 is free.');
  });

  it('counts the phase positions a three-pole device skips', () => {
    // 9 modules; seven single-pole ways take 1L1 … 3L1, leaving 2 free. A three-pole device
    // at the end must start on an L1 position, so 3L2 and 3L3 stay empty: it needs 3 + 2 = 5.
    const ways = row(way('mcb'), way('mcb'), way('mcb'), way('mcb'), way('mcb'), way('mcb'), way('mcb'));
    const msg = placementProblem(three, ways, way('mcb', 3), 0, 7);
    expect(msg).toMatch(
      /^Too few free modules on rail 1: the MCB needs 5 \(3 for the device and 2 phase positions left empty so that it starts on L1\) and 2 are free\.$/,
    );
  });

  it('never refuses a move that does not make a rail fuller', () => {
    // An over-full rail (8 modules on a 6-module rail) can still be reordered.
    const ways = row(way('main-switch', 2, 4), way('rcd', 2, 4));
    expect(placementProblem(single, ways, ways[1], 0, 0)).toBeNull();
  });

  it('refuses a rail the board does not have', () => {
    expect(placementProblem(single, [], way('mcb'), 1, 0)).toMatch(/no rail 2/);
  });
});

describe('rcdGroups', () => {
  it('an RCD protects the ways after it until the next RCD or main switch', () => {
    const ms = way('main-switch', 2);
    const rcd1 = way('rcd', 2);
    const a = way('mcb');
    const b = way('rcbo');
    const rcd2 = way('rcd', 2);
    const c = way('mcb');
    const blank = way('blank');
    const ways = row(ms, rcd1, a, b, rcd2, c, blank);
    expect(rcdGroups(ways)).toEqual([
      // The RCBO after the last way the RCD protects has its own RCD: the bracket stops before it
      { rcdId: rcd1.id, protectedIds: [a.id], spanIds: [rcd1.id, a.id] },
      // A spare way sits under the RCD before it, as the engine counts it
      { rcdId: rcd2.id, protectedIds: [c.id, blank.id], spanIds: [rcd2.id, c.id, blank.id] },
    ]);
  });

  it('an RCBO between two ways an RCD protects is drawn under the bracket but protects itself', () => {
    const rcd = way('rcd', 2);
    const a = way('mcb');
    const b = way('rcbo');
    const c = way('mcb');
    const spd = way('spd', 2);
    expect(rcdGroups(row(rcd, a, b, c, spd))).toEqual([
      { rcdId: rcd.id, protectedIds: [a.id, c.id], spanIds: [rcd.id, a.id, b.id, c.id] },
    ]);
  });

  it('ways before any RCD and after a main switch are not covered', () => {
    const rcd = way('rcd', 2);
    const a = way('mcb');
    const ms = way('main-switch', 2);
    const b = way('mcb');
    expect(rcdGroups(row(rcd, a, ms, b))).toEqual([{ rcdId: rcd.id, protectedIds: [a.id], spanIds: [rcd.id, a.id] }]);
  });
});

describe('layoutWays (way numbering, the trade convention)', () => {
  it('numbers a single-phase board 1, 2, 3 and skips devices without a way number', () => {
    const ways = row(way('main-switch', 2), way('rcd', 2), way('mcb'), way('mcb'), way('blank'));
    expect(layoutWays(1, ways).map((p) => p.label)).toEqual([null, null, '1', '2', '3']);
  });

  it('numbers a three-phase board per phase: 1L1, 1L2, 1L3, 2L1', () => {
    const ways = row(way('main-switch', 4), way('mcb'), way('mcb'), way('mcb'), way('rcbo'));
    expect(layoutWays(3, ways).map((p) => p.label)).toEqual([null, '1L1', '1L2', '1L3', '2L1']);
  });

  it('a three-pole device takes the three phase positions of one way', () => {
    const ways = row(way('mcb', 3), way('mcb'), way('mcb', 3));
    const places = layoutWays(3, ways);
    expect(places.map((p) => p.label)).toEqual(['1L1–L3', '2L1', '3L1–L3']);
    expect(places[2].skippedBefore).toBe(2);
  });
});

describe('reflowWays', () => {
  it('fills each rail from the left and starts the next when a device would not fit', () => {
    // 2 + 2 + 1 + 1 = 6 fills the first 6-module rail; the 2-module SPD starts the second
    const ways = row(way('main-switch', 2), way('rcd', 2), way('mcb'), way('mcb'), way('spd', 2));
    const { ways: out, fits } = reflowWays(1, [6, 6], ways);
    expect(fits).toBe(true);
    expect(out.map((w) => [w.rail, w.position])).toEqual([
      [0, 0],
      [0, 1],
      [0, 2],
      [0, 3],
      [1, 0],
    ]);
  });

  it('says when the ways do not fit the rails', () => {
    const ways = row(way('main-switch', 2, 4), way('rcd', 2, 4));
    expect(reflowWays(1, [3, 3], ways).fits).toBe(false);
  });
});
