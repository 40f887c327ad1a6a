import { describe, expect, it } from 'vitest';

import { supplyInUseWords } from '@/lib/sites/supply-words';
import type { DerivedSupply } from '@/lib/sites/tree-types';
import { sizeSite } from '@/lib/supply';

import { twoLevel } from '../supply/fixtures';

// The supply the editor's drawn board and the review page state beside a board: the one it is
// sized with. The carried values are lib/supply's, worked by hand in tests/unit/supply.

const typed = { earthing: 'TT' as const, uoV: 230, zeOhm: 21, pfcKa: 0.5, source: 'public' as const };

describe('the supply in use, in words', () => {
  it('a board outside a tree: its typed values', () => {
    expect(supplyInUseWords(typed, null)).toEqual({
      supply: typed,
      values: 'Ze 21 Ω · PFC 0.5 kA',
      title: undefined,
    });
  });

  it('a board fed from another board: the carried Zdb and PFC, marked carried, never the typed ones', () => {
    const fin = sizeSite(twoLevel()).boards.find((b) => b.boardId === 'fin')!;
    const derived: DerivedSupply = {
      from: 'way',
      supply: fin.supply!,
      fedFrom: fin.fedFrom,
      phase: fin.phase,
      zdb: fin.zdb,
      pfc: fin.pfc,
      vdUsed: fin.vdUsed,
      subMainCurrent: fin.subMainCurrent,
      problem: null,
      treeVersion: 2,
    };
    const words = supplyInUseWords(typed, derived);
    // Zdb = 0.35 + 0.093696 = 0.443696 Ω (tests/unit/supply/carried-values.test.ts)
    expect(words.values).toBe(`Zdb 0.444 Ω (carried) · PFC ${fin.pfc!.value.toFixed(2)} kA (carried)`);
    expect(words.supply.earthing).toBe('TN-C-S');
    expect(words.title).toBe('Carried down from Workshop DB1, way 1; the board’s typed Ze and PFC are not used.');
  });
});
