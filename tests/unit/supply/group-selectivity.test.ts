import { describe, expect, it } from 'vitest';

import { groupSelectivity, placesWords, sizeSite, type SelectivityPair } from '@/lib/supply';

import { threeLevel, twoLevel } from './fixtures';

const working = (text: string) => ({ text, steps: [], sources: ['a source'] });

const pair = (downstream: string, outcome: SelectivityPair['outcome'], text = 'worked'): SelectivityPair => ({
  kind: 'overcurrent',
  upstream: 'MCB C63',
  downstream,
  downstreamWayId: downstream,
  outcome,
  upToA: null,
  advisory: false,
  working: working(text),
});

describe('groupSelectivity', () => {
  it('prints one judgement once with the ways it covers', () => {
    const groups = groupSelectivity([
      pair('MCB B16, way 1', 'selective'),
      pair('MCB B16, way 2', 'selective'),
      pair('MCB B32, way 3', 'not-selective'),
      pair('MCB B16, way 4', 'selective'),
      pair('RCD 30 mA, incoming', 'selective'),
    ]);
    expect(groups.map((g) => [g.device, placesWords(g.places), g.outcome])).toEqual([
      ['MCB B16', 'ways 1, 2, 4', 'selective'],
      ['MCB B32', 'way 3', 'not-selective'],
      ['RCD 30 mA', 'incoming', 'selective'],
    ]);
  });

  it('keeps apart the same device judged with a different working', () => {
    const groups = groupSelectivity([
      pair('MCB B16, way 1', 'selective', 'one'),
      pair('MCB B16, way 2', 'selective', 'two'),
    ]);
    expect(groups).toHaveLength(2);
  });

  it('loses no pair of the engine’s: every downstream device is in one group', () => {
    for (const tree of [twoLevel(), threeLevel()]) {
      for (const b of sizeSite(tree).boards) {
        const groups = groupSelectivity(b.selectivity);
        const placed = groups.reduce((n, g) => n + Math.max(1, g.places.length), 0);
        expect(placed).toBe(b.selectivity.length);
      }
    }
  });

  it('words places in board order: others first, then the ways', () => {
    expect(placesWords([])).toBe('');
    expect(placesWords(['way 3L2'])).toBe('way 3L2');
    expect(placesWords(['incoming', 'way 4'])).toBe('incoming; way 4');
  });
});
