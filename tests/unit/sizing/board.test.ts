import { describe, expect, it } from 'vitest';

import { boardInputSchema, sizeBoard } from '@/lib/sizing';

import { FLAT_SUPPLY } from './helpers';

const te = { cable: 'te-70', method: 'C', ambientC: 30, csaMm2: null, phases: 1 };

describe('sizeBoard: the flat consumer unit (dwelling, single-phase)', () => {
  const input = boardInputSchema.parse({
    supply: FLAT_SUPPLY,
    phases: 1,
    enclosureModules: 12,
    dwelling: true,
    incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: 100 },
    ways: [
      { id: 'main', device: { kind: 'main-switch', poles: 2, modules: 2 }, circuit: null },
      { id: 'rcd1', device: { kind: 'rcd', poles: 2, modules: 2, rcdMa: 30, ratingA: 63 }, circuit: null },
      {
        id: 'ring',
        device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 32 },
        circuit: {
          ...te,
          use: 'sockets',
          lengthM: 40,
          load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 55 },
        },
      },
      {
        id: 'lights',
        device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 6 },
        circuit: { ...te, use: 'lighting', lengthM: 20, load: { kind: 'known', watts: 460, powerFactor: 1 } },
      },
      {
        id: 'kitchen',
        device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 20 },
        circuit: {
          ...te,
          use: 'sockets',
          lengthM: 15,
          load: { kind: 'socket-arrangement', arrangement: 'radial-20', floorAreaM2: 15 },
        },
      },
      { id: 'spare', device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 16 }, circuit: null },
      {
        id: 'shower',
        device: { kind: 'rcbo', poles: 1, modules: 1, curve: 'B', ratingA: 50, rcdMa: 30 },
        circuit: {
          ...te,
          use: 'fixed',
          serves: 'Shower',
          loadType: 'shower',
          lengthM: 12,
          load: { kind: 'known', watts: 9200, powerFactor: 1 },
        },
      },
    ],
  });
  const out = sizeBoard(input);

  it('the RCD protects the ways after it; the RCBO protects itself', () => {
    const by = Object.fromEntries(out.ways.map((w) => [w.id, w.protectedBy]));
    expect(by).toMatchObject({
      main: null,
      rcd1: null,
      ring: 'rcd1',
      lights: 'rcd1',
      kitchen: 'rcd1',
      shower: 'shower',
    });
    expect(out.summary.rcdCoverage).toEqual([{ rcdId: 'rcd1', wayIds: ['ring', 'lights', 'kitchen', 'spare'] }]);
    // The upstream 30 mA RCD satisfies the sockets rule (411.3.3) on the MCB ways.
    expect(out.ways.find((w) => w.id === 'ring')?.result?.checks.find((k) => k.code === 'rcd-additional')?.ok).toBe(
      true,
    );
  });

  it('household diversity, computed by hand (common practice, on-site guidance)', () => {
    // Sockets: ring 32 A (largest) 100 % + kitchen radial 20 A × 40 % = 8 A → 40 A.
    // Lighting: 460 / 230 = 2 A × 66 % = 1.32 A.
    // Shower (instantaneous water heater, largest): 9200 / 230 = 40 A × 100 % = 40 A.
    // Maximum demand = 40 + 1.32 + 40 = 81.32 A. Connected load = 32·230 + 460 + 20·230 + 9200 = 21620 W.
    expect(out.summary.maxDemandA).toBeCloseTo(81.32, 6);
    expect(out.summary.connectedLoadW).toBeCloseTo(21620, 6);
    expect(out.summary.incomingCheck.ok).toBe(true);
    expect(out.summary.busbarCheck?.ok).toBe(true);
    expect(out.summary.diversityRules.length).toBeGreaterThanOrEqual(3);
  });

  it('counts modules and verdicts', () => {
    expect(out.summary.modulesUsed).toBe(9);
    expect(out.summary.modulesFree).toBe(3);
    expect(out.summary.counts.spare).toBe(1);
    const { passes, nearLimit, fails } = out.summary.counts;
    expect(passes + nearLimit + fails).toBe(4);
    expect(out.summary.phaseCurrentsA).toBeNull();
  });
});

describe('sizeBoard: the workshop three-phase board (non-dwelling)', () => {
  const threePhase = { cable: 'multi-pvc-70', method: 'C', ambientC: 30, csaMm2: null };
  const input = boardInputSchema.parse({
    supply: { ...FLAT_SUPPLY, pfcKa: 4 },
    phases: 3,
    enclosureModules: 24,
    incoming: { kind: 'main-switch', ratingA: 63 },
    ways: [
      { id: 'ms', device: { kind: 'main-switch', poles: 4, modules: 4 }, circuit: null },
      {
        id: 'saw',
        device: { kind: 'mcb', poles: 3, modules: 3, curve: 'C', ratingA: 16 },
        circuit: {
          ...threePhase,
          phases: 3,
          use: 'fixed',
          lengthM: 20,
          load: { kind: 'known', watts: 6900, powerFactor: 1 },
        },
      },
      {
        id: 'lights',
        device: { kind: 'rcbo', poles: 1, modules: 1, curve: 'B', ratingA: 10, rcdMa: 30, phase: 'L1' },
        circuit: {
          ...threePhase,
          phases: 1,
          use: 'lighting',
          dwelling: false,
          lengthM: 30,
          load: { kind: 'known', watts: 1150, powerFactor: 1 },
        },
      },
      {
        id: 'heater',
        device: { kind: 'rcbo', poles: 1, modules: 1, curve: 'B', ratingA: 16, rcdMa: 30, phase: 'L2' },
        circuit: {
          ...threePhase,
          phases: 1,
          use: 'fixed',
          lengthM: 10,
          load: { kind: 'known', watts: 2300, powerFactor: 1 },
        },
      },
    ],
  });
  const out = sizeBoard(input);

  it('puts three-phase loads on every phase and single-phase ways on their phase, with diversity', () => {
    // Ib: saw 6900 / (√3 · 400) = 9.9593 A per phase (UL = 400 V); lighting 1150/230 = 5 A;
    // heater 2300/230 = 10 A. Non-dwelling rule (assumption): largest circuit 100 %, rest 75 %:
    // heater 10, saw 7.4695, lighting 3.75.
    // L1 = 7.4695 + 3.75 = 11.2195 A, L2 = 7.4695 + 10 = 17.4695 A, L3 = 7.4695 A;
    // mean 12.0528; imbalance (17.4695 − 12.0528) / 12.0528 = 44.94 %.
    expect(out.summary.phaseCurrentsA?.L1).toBeCloseTo(11.2195, 4);
    expect(out.summary.phaseCurrentsA?.L2).toBeCloseTo(17.4695, 4);
    expect(out.summary.phaseCurrentsA?.L3).toBeCloseTo(7.4695, 4);
    expect(out.summary.maxDemandA).toBeCloseTo(17.4695, 4);
    expect(out.summary.imbalancePct).toBeCloseTo(44.94, 1);
    expect(out.summary.diversityRules[0].source).toMatch(/Assumption/);
  });

  it('flags an incoming device smaller than the demand and a full enclosure', () => {
    const small = sizeBoard({
      ...input,
      enclosureModules: 6,
      incoming: { ...input.incoming, ratingA: 10, busbarRatingA: 8 },
    });
    expect(small.summary.incomingCheck.ok).toBe(false);
    expect(small.summary.busbarCheck?.ok).toBe(false);
    expect(small.summary.modulesCheck.ok).toBe(false);
  });

  it('a main switch drawn with another rating than the incoming main switch of the settings fails the board', () => {
    // The drawn main switch and the incoming device are one device entered twice (common practice:
    // the record shows one rating for it)
    const drawn = (ratingA?: number) =>
      sizeBoard({
        ...input,
        ways: input.ways.map((w) => (w.id === 'ms' ? { ...w, device: { ...w.device, ratingA } } : w)),
      });
    const agree = (r: ReturnType<typeof sizeBoard>) => r.summary.checks.filter((c) => c.code === 'incoming-drawn');
    expect(agree(drawn(63))).toEqual([]);
    // No rating drawn: nothing to disagree with
    expect(agree(drawn(undefined))).toEqual([]);
    const [smaller] = agree(drawn(40));
    expect(smaller.ok).toBe(false);
    expect(smaller.message).toBe(
      "The main switch drawn on the rail is 40 A but the incoming main switch in the board's settings is 63 A: they are one device, so make them agree.",
    );
    expect(agree(drawn(100))).toHaveLength(1);
    // An incoming device of another kind (a fuse ahead of the board) is not the drawn switch
    const fused = sizeBoard({
      ...input,
      incoming: { kind: 'fuse-bs88-2', ratingA: 80 },
      ways: input.ways.map((w) => (w.id === 'ms' ? { ...w, device: { ...w.device, ratingA: 100 } } : w)),
    });
    expect(agree(fused)).toEqual([]);
  });
});

describe('sizeBoard: blanks are spare ways', () => {
  it('a blank counts as a spare and sits under the RCD before it', () => {
    const out = sizeBoard(
      boardInputSchema.parse({
        supply: FLAT_SUPPLY,
        phases: 1,
        enclosureModules: 8,
        incoming: { kind: 'main-switch', ratingA: 100 },
        ways: [
          { id: 'main', device: { kind: 'main-switch', poles: 2, modules: 2 }, circuit: null },
          { id: 'rcd', device: { kind: 'rcd', poles: 2, modules: 2, rcdMa: 30, ratingA: 63 }, circuit: null },
          { id: 'blank', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null },
          { id: 'spd', device: { kind: 'spd', poles: 2, modules: 2 }, circuit: null },
        ],
      }),
    );
    expect(out.summary.counts.spare).toBe(1);
    expect(out.ways.find((w) => w.id === 'blank')?.protectedBy).toBe('rcd');
    expect(out.summary.rcdCoverage).toEqual([{ rcdId: 'rcd', wayIds: ['blank'] }]);
    expect(out.ways.find((w) => w.id === 'spd')?.protectedBy).toBeNull();
  });
});
