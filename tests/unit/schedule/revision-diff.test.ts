import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

import { diffRevisions, isEmptyDiff, type BoardSnapshot, type SnapshotWay } from '@/lib/boards/revision-diff';

const settings: BoardSnapshot['settings'] = {
  name: 'Flat 2 consumer unit',
  location: 'Hall',
  phases: 1,
  supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.6, source: 'public' },
  incoming: { kind: 'main-switch', ratingA: 100 },
  enclosureModules: 18,
  rails: 1,
  dwelling: true,
};

const mcb = (id: string, serves: string, ratingA = 16): SnapshotWay => ({
  id,
  rail: 0,
  position: 0,
  device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA, breakingKa: 6 },
  circuit: {
    serves,
    phases: 1,
    use: 'fixed',
    load: { kind: 'known', watts: 1000, powerFactor: 1 },
    lengthM: 10,
    cable: 'te-70',
    method: 'C',
    ambientC: 30,
    grouping: { circuits: 1, arrangement: 'bunched' },
    insulationMm: 0,
    csaMm2: null,
    concealedInWall: false,
  },
});

/** A snapshot with the ways in the given order along the rail. */
const board = (ways: SnapshotWay[], extra: Partial<BoardSnapshot['settings']> = {}): BoardSnapshot => ({
  settings: { ...settings, ...extra },
  siteName: 'Site',
  organisationName: 'Org',
  ways: ways.map((w, position) => ({ ...w, position })),
});

const a = mcb('a', 'Kitchen sockets');
const b = mcb('b', 'Lights');
const c = mcb('c', 'Immersion heater');
const d = mcb('d', 'Cooker', 32);

describe('revision diff', () => {
  it('a way added at the start is one addition, and the ways after it are renumbered, not moved', () => {
    const diff = diffRevisions(board([a, b, c]), board([d, a, b, c]));
    expect(diff.added.map((w) => [w.id, w.ref, w.serves])).toEqual([['d', '1', 'Cooker']]);
    expect(diff.moved).toEqual([]);
    expect(diff.renumbered.map((w) => [w.id, w.fromRef, w.ref])).toEqual([
      ['a', '1', '2'],
      ['b', '2', '3'],
      ['c', '3', '4'],
    ]);
    expect(diff.changed).toEqual([]);
  });

  it('a way taken from the end to the start is the only way moved (the fewest moves explain the order)', () => {
    const diff = diffRevisions(board([a, b, c, d]), board([d, a, b, c]));
    expect(diff.moved.map((w) => [w.id, w.fromRef, w.ref])).toEqual([['d', '4', '1']]);
    expect(diff.renumbered.map((w) => w.id)).toEqual(['a', 'b', 'c']);
    expect(diff.added).toEqual([]);
    expect(diff.removed).toEqual([]);
  });

  it('names each changed field of a way and of the board', () => {
    const bigger = { ...d, device: { ...d.device, ratingA: 40 }, circuit: { ...d.circuit!, serves: 'Cooker and hob' } };
    const diff = diffRevisions(board([a, d]), board([a, bigger], { supply: { ...settings.supply, zeOhm: 0.8 } }));
    expect(diff.changed).toHaveLength(1);
    expect(diff.changed[0].fields).toEqual([
      { field: 'device.ratingA', label: 'Rating (A)', before: '32', after: '40' },
      { field: 'circuit.serves', label: 'Serves', before: 'Cooker', after: 'Cooker and hob' },
    ]);
    expect(diff.settings).toEqual([{ field: 'supply.zeOhm', label: 'Ze (Ω)', before: '0.35', after: '0.8' }]);
    expect(diff.unchanged).toBe(1);
  });

  it('a circuit taken off its device leaves a spare, and a removed way is reported with its old reference', () => {
    const spare = { ...c, circuit: null };
    const diff = diffRevisions(board([a, b, c]), board([a, spare]));
    expect(diff.removed.map((w) => [w.id, w.ref])).toEqual([['b', '2']]);
    expect(diff.changed[0]).toMatchObject({ id: 'c', serves: 'Spare' });
    expect(diff.changed[0].fields).toEqual([
      { field: 'circuit', label: 'Circuit', before: 'Immersion heater', after: 'Spare' },
    ]);
  });

  it('a board compared with itself has no changes', () => {
    const diff = diffRevisions(board([a, b, c]), board([a, b, c]));
    expect(isEmptyDiff(diff)).toBe(true);
    expect(diff.unchanged).toBe(3);
  });

  it('reordering ways never adds or removes one, and moves fewer ways than there are', () => {
    const ways = Array.from({ length: 8 }, (_, i) => mcb(`w${i}`, `Circuit ${i}`));
    fc.assert(
      fc.property(fc.shuffledSubarray(ways, { minLength: 8, maxLength: 8 }), (order) => {
        const diff = diffRevisions(board(ways), board(order));
        expect(diff.added).toEqual([]);
        expect(diff.removed).toEqual([]);
        expect(diff.changed).toEqual([]);
        expect(diff.moved.length).toBeLessThan(8);
        // Ways neither moved nor renumbered kept their reference
        const touched = new Set([...diff.moved, ...diff.renumbered].map((w) => w.id));
        expect(diff.unchanged).toBe(8 - touched.size);
      }),
    );
  });
});
