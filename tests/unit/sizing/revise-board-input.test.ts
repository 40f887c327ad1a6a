import { describe, expect, it } from 'vitest';

import { parseBoardInput, reviseBoardInput, sizeBoard, SizingInputError, type BoardInput } from '@/lib/sizing';

import { FLAT_SUPPLY } from './helpers';

// reviseBoardInput's contract is parseBoardInput's answer for the revised board: every check
// here compares the two (the schema's own limits are in schemas.test.ts).

const fixed = (id: string, watts: number) => ({
  id,
  device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 16 },
  circuit: {
    phases: 1,
    use: 'fixed',
    load: { kind: 'known', watts },
    lengthM: 12,
    cable: 'te-70',
    method: 'C',
    ambientC: 30,
    csaMm2: 2.5,
  },
});

const subMain = {
  id: 'sub',
  device: { kind: 'mcb', poles: 1, modules: 1, curve: 'C', ratingA: 40 },
  circuit: {
    phases: 1,
    use: 'distribution',
    load: { kind: 'known', watts: 0, powerFactor: 1 },
    lengthM: 20,
    cable: 'swa-xlpe-90',
    method: 'C',
    ambientC: 30,
    csaMm2: 10,
  },
};

const board = () =>
  parseBoardInput({
    supply: FLAT_SUPPLY,
    phases: 1,
    enclosureModules: 12,
    incoming: { kind: 'main-switch', ratingA: 100 },
    ways: [subMain, fixed('a', 2300), { id: 'blank', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null }],
  });

/** The board's ways with the sub-main's load set, the others the same objects. */
const withLoad = (b: BoardInput, load: unknown) =>
  b.ways.map((w) => (w.id === 'sub' ? { ...w, circuit: { ...w.circuit!, load } } : w)) as BoardInput['ways'];

function refusal(f: () => unknown): SizingInputError {
  try {
    f();
  } catch (err) {
    if (err instanceof SizingInputError) return err;
    throw err;
  }
  throw new Error('not refused');
}

describe('reviseBoardInput', () => {
  const carried = { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.41, pfcKa: 2.2, source: 'public', vdUsedPct: 0.8 };

  it('answers what parseBoardInput answers for the revised board, keys in the same order', () => {
    const b = board();
    const ways = withLoad(b, { kind: 'known', watts: 6900, powerFactor: 1 });
    const revised = reviseBoardInput(b, carried, ways);
    const parsed = parseBoardInput({ ...b, supply: carried, ways });
    expect(JSON.stringify(revised)).toBe(JSON.stringify(parsed));
    expect(JSON.stringify(sizeBoard(revised))).toBe(JSON.stringify(sizeBoard(parsed)));
    // Frozen like a parsed input, the unchanged ways kept
    expect(Object.isFrozen(revised) && Object.isFrozen(revised.ways[0].circuit!.load)).toBe(true);
    expect(revised.ways[1]).toBe(b.ways[1]);
  });

  it('fills the defaults of a new load as the schema does', () => {
    const b = board();
    const ways = withLoad(b, { kind: 'known', watts: 500 });
    expect(reviseBoardInput(b, carried, ways).ways[0].circuit!.load).toEqual({
      kind: 'known',
      watts: 500,
      powerFactor: 1,
    });
  });

  it('refuses a bad carried supply with parseBoardInput’s issues', () => {
    const b = board();
    const bad = { ...carried, vdUsedPct: 140, zeOhm: -1 };
    const ways = withLoad(b, { kind: 'known', watts: 100, powerFactor: 1 });
    const expected = refusal(() => parseBoardInput({ ...b, supply: bad, ways }));
    expect(refusal(() => reviseBoardInput(b, bad, ways)).issues).toEqual(expected.issues);
    expect(expected.issues.map((i) => i.path)).toEqual(['supply.zeOhm', 'supply.vdUsedPct']);
  });

  it('refuses a bad load with parseBoardInput’s issues', () => {
    const b = board();
    const ways = withLoad(b, { kind: 'known', watts: 3e6, powerFactor: 1 });
    const expected = refusal(() => parseBoardInput({ ...b, supply: carried, ways }));
    expect(refusal(() => reviseBoardInput(b, carried, ways)).issues).toEqual(expected.issues);
    expect(expected.issues.map((i) => i.path)).toEqual(['ways.0.circuit.load.watts']);
  });

  it('validates the whole board again when a way changes more than its circuit', () => {
    const b = board();
    // A circuit on a blank: the board's own rule, which only the whole board's schema checks
    const ways = b.ways.map((w) => (w.id === 'blank' ? { ...w, circuit: b.ways[1].circuit } : w));
    const expected = refusal(() => parseBoardInput({ ...b, supply: carried, ways }));
    expect(refusal(() => reviseBoardInput(b, carried, ways)).issues).toEqual(expected.issues);
    expect(expected.issues.map((i) => i.path)).toEqual(['ways.2.circuit']);
  });

  it('validates a board this module did not validate', () => {
    const unparsed = { ...board() } as BoardInput; // a copy carries no mark
    const ways = [...unparsed.ways, unparsed.ways[1]]; // a duplicate id
    expect(refusal(() => reviseBoardInput(unparsed, carried, ways)).issues.map((i) => i.path)).toEqual(['ways.3.id']);
  });
});
