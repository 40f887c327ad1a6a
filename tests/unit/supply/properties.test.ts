import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

import { sizeBoard, type SupplyInput } from '@/lib/sizing';
import { boardMaxDemand, sizeSite, type SiteBoardInput, type SiteTreeInput } from '@/lib/supply';

import { threeLevel, twoLevel } from './fixtures';

// Random trees of up to six boards, all single-phase or all three-phase, each board fed from the
// origin or from a sub-main way of an earlier board, with random sub-main cables, lengths,
// devices and loads. The properties are physics of a radial tree: going down, Zdb never falls,
// the fault current never rises and the volt drop used never falls; a board sized with carried
// values is the same board sized alone with those values typed in.

const cables1 = ['te-70', 'multi-pvc-70', 'swa-xlpe-90'] as const;
const cables3 = ['multi-pvc-70', 'swa-xlpe-90'] as const;

const subMainArb = (three: boolean) =>
  fc.record({
    cable: fc.constantFrom(...(three ? cables3 : cables1)),
    csaMm2: fc.constantFrom(null, 4, 6, 10, 16),
    lengthM: fc.integer({ min: 1, max: 120 }),
    device: fc.constantFrom(
      { kind: 'mcb', curve: 'C', ratingA: 40 },
      { kind: 'mcb', curve: 'B', ratingA: 63 },
      { kind: 'fuse-bs88-2', ratingA: 63 },
      { kind: 'fuse-bs88-2', ratingA: 100 },
    ),
  });

const treeArb = fc
  .record({
    three: fc.boolean(),
    origin: fc.record({
      earthing: fc.constantFrom('TN-S', 'TN-C-S'),
      zeOhm: fc.double({ min: 0.05, max: 0.8, noNaN: true }),
      pfcKa: fc.double({ min: 0.5, max: 16, noNaN: true }),
    }),
    n: fc.integer({ min: 1, max: 6 }),
  })
  .chain(({ three, origin, n }) =>
    fc.record({
      three: fc.constant(three),
      origin: fc.constant(origin),
      parents: fc.tuple(...Array.from({ length: n }, (_, i) => fc.integer({ min: -1, max: i - 1 }))),
      subMains: fc.array(subMainArb(three), { minLength: n, maxLength: n }),
      loads: fc.array(fc.integer({ min: 0, max: 3500 }), { minLength: n, maxLength: n }),
    }),
  )
  .map(({ three, origin, parents, subMains, loads }): SiteTreeInput => {
    const boards: SiteBoardInput[] = parents.map((p, i) => {
      const ways: unknown[] = [
        {
          id: `b${i}-load`,
          device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 16, ...(three ? { phase: 'L1' } : {}) },
          circuit: {
            phases: 1,
            use: 'fixed',
            load: { kind: 'known', watts: loads[i], powerFactor: 1 },
            lengthM: 10,
            cable: 'te-70',
            method: 'C',
            ambientC: 30,
            csaMm2: 2.5,
          },
        },
      ];
      // One sub-main way for every board fed from this one.
      parents.forEach((q, j) => {
        if (q !== i) return;
        const s = subMains[j];
        ways.push({
          id: `b${i}-to-b${j}`,
          device: { ...s.device, poles: three ? 3 : 1, modules: three ? 3 : 1 },
          circuit: {
            phases: three ? 3 : 1,
            use: 'distribution',
            load: { kind: 'known', watts: 0, powerFactor: 1 },
            lengthM: s.lengthM,
            cable: s.cable,
            method: 'C',
            ambientC: 30,
            csaMm2: s.csaMm2,
          },
        });
      });
      return {
        id: `b${i}`,
        name: `Board ${i}`,
        siteId: 'site',
        feed: p < 0 ? { from: 'origin' } : { from: 'way', boardId: `b${p}`, wayId: `b${p}-to-b${i}` },
        board: {
          phases: three ? 3 : 1,
          enclosureModules: 60,
          incoming: { kind: 'main-switch', ratingA: 400 },
          ways,
        },
      } as SiteBoardInput;
    });
    return { siteId: 'site', origin: { ...origin, uoV: 230, source: 'public' }, boards } as SiteTreeInput;
  });

describe('supply tree properties', () => {
  it('going down the tree: Zdb never falls, fault current never rises, volt drop used never falls', () => {
    fc.assert(
      fc.property(treeArb, (tree) => {
        const site = sizeSite(tree);
        const byId = new Map(site.boards.map((b) => [b.boardId, b]));
        expect(site.boards).toHaveLength(tree.boards.length);
        for (const b of site.boards) {
          if (!b.fedFrom || b.problem) continue;
          const up = byId.get(b.fedFrom.boardId)!;
          expect(b.zdb!.value).toBeGreaterThanOrEqual(up.zdb!.value);
          expect(b.pfc!.value).toBeLessThanOrEqual(up.pfc!.value);
          expect(b.pfc!.shortCircuitKa).toBeLessThanOrEqual(up.pfc!.value);
          expect(b.pfc!.earthFaultKa).toBeLessThanOrEqual(up.pfc!.value);
          expect(b.vdUsed!.value).toBeGreaterThanOrEqual(up.vdUsed!.value);
        }
      }),
      { numRuns: 60 },
    );
  }, 60_000);

  it('a board sized with carried values equals the same board sized alone with those values typed in', () => {
    fc.assert(
      fc.property(treeArb, (tree) => {
        const site = sizeSite(tree);
        for (const b of site.boards) {
          if (b.problem) {
            // Only a board below a sub-main the engine could not size has no values.
            expect(b.fedFrom).not.toBeNull();
            expect(b.sizing).toBeNull();
            continue;
          }
          // Typed in from the displayed numbers, not from the supply object the tree built.
          const typed: SupplyInput = {
            earthing: tree.origin.earthing,
            uoV: 230,
            zeOhm: b.zdb!.value,
            pfcKa: b.pfc!.value,
            source: 'public',
            ...(b.fedFrom ? { vdUsedPct: b.vdUsed!.value } : {}),
          };
          const { supply: _ignored, ...rest } = b.sizedInput!;
          void _ignored;
          expect(sizeBoard({ ...rest, supply: typed })).toEqual(b.sizing);
        }
      }),
      { numRuns: 40 },
    );
  }, 60_000);

  it('the board a sub-main feeds sets its design current: the way’s Ib is that board’s maximum demand', () => {
    fc.assert(
      fc.property(treeArb, (tree) => {
        const site = sizeSite(tree);
        const byId = new Map(site.boards.map((b) => [b.boardId, b]));
        for (const b of site.boards) {
          if (!b.fedFrom || !b.sizing) continue;
          const way = byId.get(b.fedFrom.boardId)!.sizing!.ways.find((w) => w.id === b.fedFrom!.wayId)!;
          expect(way.result!.ibA).toBeCloseTo(b.sizing.summary.maxDemandA, 9);
        }
      }),
      { numRuns: 30 },
    );
  }, 60_000);
});

describe('supply tree: a case the properties found', () => {
  it('a 1 m sub-main: the fault current below is not above the one above, even by rounding', () => {
    // fast-check found 0.6305344133302266 kA below 0.6305344133302265 kA: A and kA rounding.
    const way = (id: string, use: string, csaMm2: number | null, lengthM: number) => ({
      id,
      device: {
        kind: 'mcb',
        poles: 1,
        modules: 1,
        curve: use === 'distribution' ? 'C' : 'B',
        ratingA: use === 'distribution' ? 40 : 16,
      },
      circuit: {
        phases: 1,
        use,
        load: { kind: 'known', watts: 0, powerFactor: 1 },
        lengthM,
        cable: 'te-70',
        method: 'C',
        ambientC: 30,
        csaMm2,
      },
    });
    const board = (ways: unknown[]) => ({
      phases: 1,
      enclosureModules: 60,
      incoming: { kind: 'main-switch', ratingA: 400 },
      ways,
    });
    const site = sizeSite({
      siteId: 'site',
      origin: { earthing: 'TN-S', zeOhm: 0.05, pfcKa: 0.6305344133302265, uoV: 230, source: 'public' },
      boards: [
        {
          id: 'b0',
          name: 'Board 0',
          siteId: 'site',
          feed: { from: 'origin' },
          board: board([way('b0-load', 'fixed', 2.5, 10), way('b0-to-b1', 'distribution', null, 1)]),
        },
        {
          id: 'b1',
          name: 'Board 1',
          siteId: 'site',
          feed: { from: 'way', boardId: 'b0', wayId: 'b0-to-b1' },
          board: board([way('b1-load', 'fixed', 2.5, 10)]),
        },
      ],
    } as SiteTreeInput);
    const [b0, b1] = site.boards;
    expect(b1.pfc!.value).toBeLessThanOrEqual(b0.pfc!.value);
    expect(b1.pfc!.shortCircuitKa).toBeLessThanOrEqual(b0.pfc!.value);
    expect(b1.pfc!.earthFaultKa).toBeLessThanOrEqual(b0.pfc!.value);
  });
});

describe('boardMaxDemand', () => {
  it('equals the maximum demand sizeBoard computes, for every board of random trees', () => {
    fc.assert(
      fc.property(treeArb, fc.boolean(), (tree, dwelling) => {
        const site = sizeSite(tree);
        for (const b of site.boards) {
          if (!b.sizedInput) continue;
          const input = { ...b.sizedInput, dwelling };
          expect(boardMaxDemand(input)).toBe(sizeBoard(input).summary.maxDemandA);
        }
      }),
      { numRuns: 40 },
    );
  }, 60_000);

  it('equals it on the hand-worked boards, three-phase and with a phase set', () => {
    for (const t of [twoLevel(), threeLevel()]) {
      for (const b of sizeSite(t).boards) expect(boardMaxDemand(b.sizedInput!)).toBe(b.sizing!.summary.maxDemandA);
    }
  });
});
