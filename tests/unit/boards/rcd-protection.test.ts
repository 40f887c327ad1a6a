import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

import { protectedById, rcdProtection } from '@/lib/boards/rcd-protection';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import type { WayInput } from '@/lib/boards/schemas';
import { boardInputSchema, sizeBoard } from '@/lib/sizing';
import { demoWays, FLAT_BOARD, WORKSHOP_BOARD } from '@/scripts/demo-data';

describe('rcdProtection: one rule for which ways an RCD protects', () => {
  it('the RCD protects the ways after it to the next RCD or main switch; a spare way sits under it; an RCBO protects itself', () => {
    const d = (kind: string) => ({ kind, poles: 1, modules: 1 });
    const ways = ['main-switch', 'rcd', 'mcb', 'blank', 'rcbo', 'mcb', 'rcd', 'mcb', 'spd', 'main-switch', 'mcb'].map(
      (kind, i) => ({
        id: `w${i}`,
        rail: i < 6 ? 0 : 1,
        position: i,
        device: d(kind),
      }),
    );
    const p = rcdProtection(ways);
    expect([...p.entries()].map(([id, v]) => [id, protectedById(id, v)])).toEqual([
      ['w0', null],
      ['w1', null],
      ['w2', 'w1'],
      ['w3', 'w1'],
      ['w4', 'w4'],
      // The RCBO does not end the RCD's run: the next way is the RCD's again
      ['w5', 'w1'],
      ['w6', null],
      // Across rails, in rail order
      ['w7', 'w6'],
      ['w8', null],
      ['w9', null],
      ['w10', null],
    ]);
    expect(protectedById('w2', rcdProtection(ways.slice(2), true).get('w2')!)).toBe('incoming');
  });

  it('property: the engine, sized on the ways flattened in rail order, gives the same protectedBy for any order of the demo boards’ devices', () => {
    for (const demo of [FLAT_BOARD, WORKSHOP_BOARD]) {
      const base = demoWays(demo);
      let compared = 0;
      fc.assert(
        fc.property(fc.shuffledSubarray(base, { minLength: 1 }), fc.boolean(), (picked, incomingRcd) => {
          // shuffledSubarray picks the devices in a random order: that order is the rail's
          const ways: WayInput[] = picked.map((w, position) => ({ ...w, rail: position % 2, position }));
          const settings = {
            ...demo.settings,
            incoming: incomingRcd
              ? { ...demo.settings.incoming, kind: 'rcd' as const, rcdMa: 30 }
              : demo.settings.incoming,
          };
          const parsed = boardInputSchema.safeParse(boardSizingInput(settings, ways));
          if (!parsed.success) return true;
          const engine = new Map(sizeBoard(parsed.data).ways.map((w) => [w.id, w.protectedBy]));
          const ours = rcdProtection(ways, incomingRcd);
          for (const w of ways) expect(protectedById(w.id, ours.get(w.id) ?? null)).toBe(engine.get(w.id) ?? null);
          compared += 1;
          return true;
        }),
        { numRuns: 60 },
      );
      // Most boards drawn are valid engine input: the comparison is not vacuous
      expect(compared).toBeGreaterThan(30);
    }
  });
});
