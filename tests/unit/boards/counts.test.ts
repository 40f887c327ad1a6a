import { describe, expect, it } from 'vitest';

import { countWays, countWords, type CountedWay } from '@/lib/boards/counts';
import { layoutWays } from '@/lib/boards/layout';
import { demoWays, FLAT_BOARD, WORKSHOP_BOARD } from '@/scripts/demo-data';

let n = 0;
function way(kind: string, poles = 1, circuit: unknown = kind === 'blank' ? null : {}): CountedWay {
  n += 1;
  return { id: `c${n}`, rail: 0, position: n, device: { kind, poles, modules: poles }, circuit };
}

describe('countWays: counted by way number, as the ways are printed', () => {
  it('the demo flat: main switch and two RCDs are not ways; ways 1–9 are nine ways, eight circuits, one spare', () => {
    const counts = countWays(1, demoWays(FLAT_BOARD));
    expect(counts).toEqual({ ways: 9, circuits: 8, spare: 1, positions: null });
    expect(countWords(counts)).toBe('9 ways: 8 circuits, 1 spare');
  });

  it('the demo workshop: way numbers stop at 8L3, so 8 ways of 24 single-pole positions; 15 circuits, 3 positions spare', () => {
    const ways = demoWays(WORKSHOP_BOARD);
    const last = layoutWays(3, ways)
      .filter((p) => p.label)
      .at(-1);
    expect(last?.label).toBe('8L3');
    const counts = countWays(3, ways);
    expect(counts).toEqual({ ways: 8, circuits: 15, spare: 3, positions: 24 });
    expect(countWords(counts)).toBe('8 ways (24 single-pole positions): 15 circuits, 3 positions spare');
  });

  it('a three-pole device after a single-pole one leaves the skipped positions spare', () => {
    // 1L1 single-pole circuit, 1L2 and 1L3 skipped, 2L1–L3 three-pole circuit
    const counts = countWays(3, [way('main-switch', 4), way('mcb'), way('mcb', 3)]);
    expect(counts).toEqual({ ways: 2, circuits: 2, spare: 2, positions: 6 });
  });

  it('an outgoing device without a circuit is spare; SPDs are not ways; one of each in the singular', () => {
    const counts = countWays(1, [way('spd', 2, null), way('mcb'), way('rcbo', 1, null)]);
    expect(counts).toEqual({ ways: 2, circuits: 1, spare: 1, positions: null });
    expect(countWords(countWays(1, [way('mcb')]))).toBe('1 way: 1 circuit, 0 spare');
    expect(countWords(countWays(1, []))).toBe('0 ways: 0 circuits, 0 spare');
  });
});
